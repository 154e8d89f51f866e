import { describe, expect, it } from 'vitest';
import { checkBody, checkMacro, checkMacroName, checkParams, substituteDefaults } from '../../../src/lib/library/check';

describe('macro names', () => {
	it.each(['btz-check', 'sym-thermo', 'a', 'first_law-o3'])('takes %j', (n) => expect(checkMacroName(n)).toBeNull());
	it.each(['', 'BTZ', '9a', '-a', 'a-', 'a--b', 'a b', 'a.b', 'x'.repeat(41)])('refuses %j', (n) =>
		expect(checkMacroName(n)).not.toBeNull()
	);
});

describe('parameters', () => {
	it('takes names the language can use as keys, with a default each', () => {
		expect(checkParams({ l: '1', N: '10', zh_2: '0.5' })).toBeNull();
	});
	it.each([[{ '2l': '1' }], [{ 'l-x': '1' }], [{ l: ' ' }], [{ l: '{x}' }], [{ l: 'x'.repeat(101) }]])('refuses %j', (p) =>
		expect(checkParams(p)).not.toBeNull()
	);
});

describe('body lines', () => {
	it('puts defaults in before parsing and keeps unknown placeholders visible', () => {
		expect(substituteDefaults('dentropy l={l} c={c}', { l: '2', c: '12' })).toBe('dentropy l=2 c=12');
		expect(substituteDefaults('darea l={q}', { l: '2' })).toBe('darea l={q}');
	});

	it('accepts the seeded library', () => {
		expect(
			checkMacro({ name: 'btz-check', params: { l: '1', c: '12' }, body: ['use brane d=2 zh=1', 'units cft c={c}', 'dentropy l={l}'] })
		).toBeNull();
		expect(
			checkMacro({ name: 'sym-thermo', params: { N: '10', zh: '1' }, body: ['use brane d=4 zh={zh}', 'units sym N={N}', 'thermo'] })
		).toBeNull();
	});

	it('points at the failing line with the parser’s message and span', () => {
		const p = checkBody(['use brane d=4', 'thermo', 'darea l=0.3 l=0.4'], {});
		expect(p).toMatchObject({ line: 3 });
		expect(p!.message.startsWith('line 3: ')).toBe(true);
		expect(p!.start).toBeGreaterThan(0);
		expect(p!.end).toBeGreaterThan(p!.start!);
	});

	it.each([
		[[], /at least one/],
		[Array(21).fill('thermo'), /at most 20/],
		[['thermo', '  '], /line 2 is empty/],
		[['darea l=1 // ' + 'x'.repeat(300)], /line 1 has \d+ characters/],
		[['darea l={w}'], /\{w\} is not a parameter/]
	])('refuses %j', (body, message) => expect(checkBody(body as string[], {})?.message).toMatch(message));
});
