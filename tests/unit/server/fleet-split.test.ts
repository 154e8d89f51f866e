// Splitting a sweep into chunks for the evaluation fleet (src/lib/server/eval/fleet/split.ts): the chunks'
// tables, evaluated by the language and merged in order, must equal the whole line's answer exactly — the
// fleet's promise that a split sweep answers what in-process evaluation answers, bit for bit.
import { isDeepStrictEqual } from 'node:util';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { emptyContext, runLine } from '../../../src/lib/lang';
import type * as A from '../../../src/lib/lang/ast';
import { parse } from '../../../src/lib/lang/parser';
import { resolveValue } from '../../../src/lib/lang/values';
import { DEFAULT_LIMITS } from '../../../src/lib/lang/limits';
import { mergeChunks, splitSweep } from '../../../src/lib/server/eval/fleet/split';
import type { LineOutcome, PlotGuide, TableResult } from '../../../src/lib/lang/result';

const BOOSTED = { ...emptyContext(), bulk: { name: 'boosted', params: { d: 4, zh: 1, v: 0.4 } } };

function wholeAndMerged(input: string, ctx = emptyContext(), target = 5) {
	const chunks = splitSweep(input, target);
	expect(chunks, `${input} is split`).toBeDefined();
	const whole = runLine(input, ctx);
	const merged = mergeChunks(chunks!.map((c) => runLine(c.input, ctx)));
	return { chunks: chunks!, whole, merged };
}

describe('a split sweep merges to the whole line exactly', () => {
	it.each([
		['sweep darea l=0.1..3:400', emptyContext()],
		['sweep entropy l=0.05..2.5:97 o=exact', emptyContext()],
		['darea l=0.1,0.2,0.3,0.4,0.5,0.6,0.7,0.8,0.9,1.1 d=3', emptyContext()],
		['sweep darea l=0.1..1:9 | table', emptyContext()],
		['sweep thermo zh=0.5..2:40', emptyContext()],
		['sweep darea zh=0.5..3:33 l=1 | plot', emptyContext()],
		['sweep mu l=0.2..2:24', BOOSTED],
		['sweep darea v=-0.8..0.8:30 l=0.7', BOOSTED],
		// a stateless script picks its bulk on the line itself: every chunk repeats the settings
		['use brane d=3 zh=2; sweep darea l=0.1..1:40', emptyContext()],
		['use boosted d=4 v=0.3; units geo G=2; sweep dentropy l=0.1..1:24', emptyContext()],
		// a quench sweep over widths: a family curve per width, nothing shared between points
		['use vaidya d=3 zh=1; sweep darea l=1..3:16 t=1.5', emptyContext()]
	])('%s', (input, ctx) => {
		const { chunks, whole, merged } = wholeAndMerged(input, ctx);
		expect(chunks.length).toBeGreaterThan(1);
		expect(merged).toBeDefined();
		expect(isDeepStrictEqual(merged, whole)).toBe(true);
		expect(chunks.reduce((n, c) => n + c.points, 0)).toBe((whole.results.at(-1) as { rows: unknown[] }).rows.length);
	});

	it('keeps every chunk within the language limits, however long the written points are', () => {
		const chunks = splitSweep('sweep darea l=0.1..3.3:2000', 2)!;
		expect(chunks.length).toBeGreaterThan(2);
		for (const c of chunks) expect(c.input.length).toBeLessThanOrEqual(DEFAULT_LIMITS.maxInput);
	});

	it('never leaves a one-point chunk (one point without `sweep` answers a scalar, not a table)', () => {
		for (let n = 8; n <= 40; n++) {
			const chunks = splitSweep(`darea l=${Array.from({ length: n }, (_, i) => 0.1 + i / 100).join(',')}`, 3)!;
			for (const c of chunks) expect(c.points).toBeGreaterThan(1);
			expect(chunks.reduce((a, c) => a + c.points, 0)).toBe(n);
		}
	});

	it('writes the range points the language computes, to the last bit (property)', () => {
		const point = fc.double({ min: -50, max: 50, noNaN: true }).filter((x) => !Object.is(x, -0));
		fc.assert(
			fc.property(point, point, fc.integer({ min: 8, max: 300 }), (a, b, n) => {
				const input = `sweep darea l=${a}..${b}:${n}`;
				const chunks = splitSweep(input, 4);
				if (!chunks) return; // a range point the lexer cannot write back (a negative zero): left whole
				const kv = (parse(input).statements[0] as A.VerbStmt).keys[0]!;
				const r = resolveValue(kv.value, { ctx: emptyContext(), lets: {}, bulk: {} }, DEFAULT_LIMITS);
				const written = chunks.flatMap((c) => {
					const v = (parse(c.input).statements[0] as A.VerbStmt).keys[0]!.value as A.ListValue;
					return v.items.map((it) => resolveValue(it, { ctx: emptyContext(), lets: {}, bulk: {} }, DEFAULT_LIMITS));
				});
				expect(written.map((w) => (w.many ? NaN : w.value))).toEqual(r.many ? r.values : []);
			}),
			{ numRuns: 200 }
		);
	});
});

describe('lines left whole', () => {
	it.each([
		['one point', 'darea l=0.5'],
		['a sweep after a let', 'let w = 2; sweep darea l=0.1..1:40'],
		['two sweeps', 'sweep darea l=0.1..1:40; sweep zstar l=0.1..1:40'],
		['a sweep before a setting', 'sweep darea l=0.1..1:40; use brane d=3'],
		['a sink that reshapes', 'sweep darea l=0.1..1:40 | tex'],
		['a range written with names', 'sweep darea l=0.1..zh:40'],
		['a step reference', 'sweep darea l=0.1..#1:40'],
		['two swept keys', 'sweep darea l=0.1..1:40 v=0.1..0.5:40'],
		['too few points to be worth it', 'sweep darea l=0.1..1:7'],
		['over the points limit: it must answer the limit', 'sweep darea l=0.1..1:2001'],
		['truncated orders: their warnings are merged over every point', 'sweep darea l=0.1..3:400 o=1,2,3,exact'],
		['one truncated order', 'sweep darea l=0.1..3:400 o=2'],
		['an order sweep', 'thermo o=1,2,3,4,5,6,7,8,9'],
		['a line that does not parse', 'sweep darea l=0.1..'],
		['a macro', '@growth l=0.1..1:40'],
		// each exact ball starts from the previous ones: chunks starting afresh would differ in the last bits
		['a ball sweep', 'sweep darea ball R=0.1..2:200'],
		// the times of a quench sweep share one family curve, refined for each time in turn: chunks would each build
		// it and land within rounding of the whole line's numbers, not on them
		['a quench sweep over t', 'use vaidya d=3 zh=1; sweep darea l=2 t=-0.5..3:40'],
		['a quench sweep over t, in the pad’s bulk', 'sweep dentropy l=2 t=0..3:24']
	])('%s', (_, input) => {
		expect(splitSweep(input, 8)).toBeUndefined();
	});
});

describe('reference curves of the chunks', () => {
	// guides sit at the table's own x values, so joining each label's points in chunk order is the whole line's
	const table = (xs: number[], guides: PlotGuide[]) => ({
		results: [
			{ kind: 'table' as const, label: 'ΔA vs t', columns: ['t', 'exact'], rows: xs.map((x) => [x, x * x]), plot: { x: 't', guides } }
		],
		bulk: { name: 'vaidya', params: { d: 3, zh: 1 } },
		units: emptyContext().units,
		lets: {}
	});
	it('joins each label in chunk order, labels in order of first appearance', () => {
		const merged = mergeChunks([
			table(
				[0.1, 0.2],
				[
					{
						label: 'thermal',
						points: [
							[0.1, 1],
							[0.2, 1]
						]
					},
					{
						label: 'early',
						points: [
							[0.1, 0.01],
							[0.2, 0.04]
						]
					}
				]
			),
			table(
				[0.3, 0.4],
				[
					{
						label: 'thermal',
						points: [
							[0.3, 1],
							[0.4, 1]
						]
					},
					{ label: 'linear', points: [[0.4, 0.5]] }
				]
			)
		] as unknown as LineOutcome[]);
		const t = merged!.results[0] as TableResult;
		expect(t.rows).toHaveLength(4);
		expect(t.plot!.guides!.map((g) => g.label)).toEqual(['thermal', 'early', 'linear']);
		expect(t.plot!.guides![0]!.points).toEqual([
			[0.1, 1],
			[0.2, 1],
			[0.3, 1],
			[0.4, 1]
		]);
		expect(t.plot!.guides![2]!.points).toEqual([[0.4, 0.5]]);
	});
});

describe('merging refuses chunks that disagree beyond their rows', () => {
	it('a chunk with a warning the others lack, or another pad state, is not merged', () => {
		const chunks = splitSweep('sweep darea l=0.1..3:40', 4)!;
		const outs = chunks.map((c) => runLine(c.input, emptyContext()));
		expect(mergeChunks(outs)).toBeDefined();
		const withWarning = outs.map((o, i) => (i === 1 ? { ...o, results: [{ ...o.results[0]!, warning: 'near the horizon' }] } : o));
		expect(mergeChunks(withWarning)).toBeUndefined();
		const otherBulk = outs.map((o, i) => (i === 2 ? { ...o, bulk: { name: 'brane', params: { d: 3, zh: 1 } } } : o));
		expect(mergeChunks(otherBulk)).toBeUndefined();
		expect(mergeChunks([])).toBeUndefined();
	});
});
