// A pad whose stored bulk name this Bulkpad does not know: verbs answer a language error naming the bulk and
// pointing at `use`, while the lines that need no bulk still run and `use` leaves the state.
import { describe, expect, it } from 'vitest';
import { emptyContext, runLine } from '../../../src/lib/lang/evaluate';
import { LangError } from '../../../src/lib/lang/errors';
import type { PadContext } from '../../../src/lib/lang/result';

const stranded = (name: unknown): PadContext => ({ ...emptyContext(), bulk: { name: name as string, params: { d: 4 } } });

function errorOf(input: string, ctx: PadContext): LangError {
	try {
		runLine(input, ctx);
	} catch (e) {
		expect(e).toBeInstanceOf(LangError);
		return e as LangError;
	}
	throw new Error(`${input} did not fail`);
}

describe('a stored bulk this Bulkpad does not know', () => {
	it.each(['zstar l=0.5', 'darea l=0.3 o=2', 'sweep width zstar=0.1..0.5:3', 'thermo'])('%s names the bulk and points at use', (line) => {
		const e = errorOf(line, stranded('wormhole'));
		expect(e.message).toBe("this pad's bulk 'wormhole' is not one Bulkpad knows");
		expect(e.code).toBe('language');
		expect(e.hint).toMatch(/^start with use <bulk> …, one of vacuum, brane, boosted/);
		expect([e.start, e.end]).toEqual([0, line.length]);
	});

	it('underlines only the statement that needs the bulk', () => {
		const line = 'let a = 2; zstar l=0.5';
		const e = errorOf(line, stranded('wormhole'));
		expect(line.slice(e.start, e.end)).toBe('zstar l=0.5');
	});

	it('keeps a name from the prototype chain or a non-string from reaching the schema lookup', () => {
		expect(errorOf('zstar l=0.5', stranded('toString')).message).toMatch(/'toString' is not one Bulkpad knows/);
		expect(errorOf('zstar l=0.5', stranded(42)).message).toMatch(/bulk with no valid name is not one/);
	});

	it('still runs arithmetic and let, and `use` leaves the unknown bulk for a known one', () => {
		expect(runLine('let a = 2 * 3', stranded('wormhole')).lets.a?.value).toBe(6);
		const moved = runLine('use brane d=4 zh=1; zstar l=0.5', stranded('wormhole'));
		expect(moved.bulk).toEqual({ name: 'brane', params: { d: 4, zh: 1 } });
		// the same line in a fresh pad (whose default bulk is brane d=4 zh=1) gives the same z*
		const fresh = runLine('zstar l=0.5', emptyContext());
		expect(moved.results[1]).toEqual(fresh.results[0]);
	});
});
