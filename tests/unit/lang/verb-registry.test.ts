/**
 * The verb registry: a verb is one module. This test adds a toy verb in this file alone and checks that the
 * parser, the runner (points, sweeps, sinks), completion and help all pick it up; and that every built-in
 * verb carries the help the palette shows, with examples that run on a fresh pad.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { complete } from '../../../src/lib/lang/complete';
import { emptyContext, runLine } from '../../../src/lib/lang/evaluate';
import { help, helpEntries } from '../../../src/lib/lang/help';
import { isLangError } from '../../../src/lib/lang/errors';
import { defineVerb, registerVerb, unregisterVerb, verbSpecs } from '../../../src/lib/lang/verbs/index';

// the toy: twice the turning point, a number any strip bulk can give (z* from the engine, by the point's door)
const twice = defineVerb({
	name: 'twicez',
	kind: 'scalar',
	forms: { strip: { keys: ['l'], required: ['l'] } },
	symbol: { text: '2z*', tex: '2z_*' },
	help: {
		summary: 'twice the turning point (a test verb)',
		method: 'zstar times two',
		accuracy: 'as zstar',
		source: 'none: a test',
		examples: ['twicez l=0.5', 'sweep twicez l=0.1..0.5:3']
	},
	at: (p) => ({ value: 2 * p.holo.zstarOf(p.bulk, p.q.l!) })
});

describe('a verb added in one file', () => {
	beforeAll(() => registerVerb(twice));
	afterAll(() => unregisterVerb('twicez'));

	it('evaluates one point through the language, against the engine', () => {
		const one = runLine('twicez l=0.5', emptyContext()).results[0]!;
		const z = runLine('zstar l=0.5', emptyContext()).results[0]!;
		expect(one.kind).toBe('scalar');
		expect(z.kind).toBe('scalar');
		if (one.kind !== 'scalar' || z.kind !== 'scalar') return;
		expect(one.value).toBe(2 * z.value);
		expect(one.label).toBe('2z*(l=0.5), exact · brane d=4 zh=1');
	});

	it('sweeps, takes bulk keys and sinks like any verb', () => {
		const t = runLine('sweep twicez l=0.1..0.5:3 zh=2 | csv', emptyContext()).results[0]!;
		expect(t.kind).toBe('table');
		if (t.kind !== 'table') return;
		expect(t.columns).toEqual(['l', 'exact']);
		expect(t.rows).toHaveLength(3);
		expect(t.download?.format).toBe('csv');
		const z = runLine('zstar l=0.3 zh=2', emptyContext()).results[0]!;
		// a sweep continues each turning point from the last one: equal to rounding, not bit for bit
		if (z.kind === 'scalar') expect(t.rows[1]![1] as number).toBeCloseTo(2 * z.value, 12);
	});

	it('refuses keys its form does not take, with the form in the hint', () => {
		try {
			runLine('twicez l=0.5 o=2', emptyContext());
			expect.unreachable('o= is not a key of twicez');
		} catch (e) {
			expect(isLangError(e)).toBe(true);
			expect((e as Error).message).toBe("twicez takes no key 'o'");
		}
	});

	it('is offered by completion and help, and reserved as a let-name', () => {
		expect(complete('twi').items.map((i) => i.insert)).toContain('twicez');
		expect(complete('twicez ').items.map((i) => i.insert)).toContain('l=');
		expect(help('twicez')?.summary).toBe('twice the turning point (a test verb)');
		expect(helpEntries('verb').map((e) => e.name)).toContain('twicez');
		expect(() => runLine('let twicez = 1', emptyContext())).toThrow(/twicez/);
	});

	it('is gone again once removed', () => {
		unregisterVerb('twicez');
		expect(() => runLine('twicez l=0.5', emptyContext())).toThrow();
		registerVerb(twice);
	});
});

describe('the built-in verbs', () => {
	it('each carry what the palette shows: summary, method, accuracy, source, two examples', () => {
		for (const v of verbSpecs()) {
			for (const field of ['summary', 'method', 'accuracy', 'source'] as const) {
				expect(v.help[field].length, `${v.name}.${field}`).toBeGreaterThan(8);
			}
			expect(v.help.examples.length, `${v.name} examples`).toBeGreaterThanOrEqual(2);
			expect(v.symbol.text.length, `${v.name} symbol`).toBeGreaterThan(0);
		}
	});

	it.each(verbSpecs().flatMap((v) => v.help.examples.map((ex) => [v.name, ex])))('%s: example "%s" runs on a fresh pad', (_, ex) => {
		const out = runLine(ex, emptyContext());
		expect(out.results.length).toBeGreaterThan(0);
	});
});
