// The pad page's pure pieces: where attempts sit among steps, what the live region says, how the pad list groups.
import { describe, expect, it } from 'vitest';
import { buildTimeline } from '../../../src/lib/client/timeline';
import { announceFailure, announceStep, describeResult } from '../../../src/lib/client/announce';
import { groupPadsByBulk, paramChips } from '../../../src/lib/client/pad-groups';
import type { AttemptData, PadSummary, StepData } from '../../../src/lib/client/types';

const step = (n: number): StepData => ({ id: `s${n}`, n, input: `darea l=0.${n}`, status: 'ok', results: [], error: null, ms: 1 });
const attempt = (id: string, afterN: number, dismissed = false): AttemptData => ({
	id,
	input: 'dara',
	status: 'error',
	error: { message: 'x', start: 0, end: 4 },
	afterN,
	forN: null,
	dismissed
});

describe('buildTimeline', () => {
	it('puts each attempt after the step it was typed after, in typing order, and leaves dismissed ones out', () => {
		const t = buildTimeline([step(1), step(2)], [attempt('a0', 0), attempt('a1', 1), attempt('b1', 1), attempt('d', 2, true)]);
		expect(t.map((e) => e.key)).toEqual(['a0', 's1', 'a1', 'b1', 's2']);
		expect(buildTimeline([step(1)], [attempt('d', 1, true)], true).map((e) => e.key)).toEqual(['s1', 'd']);
	});
	it('keeps attempts after a step this page does not hold, at the end', () => {
		expect(buildTimeline([step(1)], [attempt('late', 5)]).map((e) => e.key)).toEqual(['s1', 'late']);
	});
});

describe('announcements', () => {
	it('says the step, its name and the first results in words', () => {
		const text = announceStep(4, 'btz', [
			{ kind: 'scalar', label: 'ΔA', value: 0.012345678, order: 3 },
			{ kind: 'check', label: 'first law', pass: true, lhs: 1, rhs: 1, residual: 1e-9, tolerance: 1e-6 }
		]);
		expect(text).toBe('Step 4 (btz): ΔA = 0.0123457, order 3; first law: holds, residual 1e−9.');
	});
	it('counts what it does not read out, and says why a line failed', () => {
		const notes = Array.from({ length: 5 }, (_, i) => ({ kind: 'note' as const, text: `n${i}` }));
		expect(announceStep(1, null, notes)).toBe('Step 1: n0; n1; n2 and 2 more results.');
		expect(describeResult({ kind: 'table', label: 'ΔA', columns: ['l', 'o1'], rows: [[1, 2]] })).toBe(
			'ΔA: a table of 1 rows, columns l, o1'
		);
		expect(announceFailure("unknown verb 'dara'")).toMatch(/^Not evaluated, kept as an attempt: unknown verb 'dara'\./);
	});
});

describe('the pad list', () => {
	const pad = (id: string, title: string, name: string, params: Record<string, number | string>): PadSummary => ({
		id,
		title,
		bulk: { name, params },
		updatedAt: Number(id.slice(1))
	});
	const pads = [
		pad('p9', 'Zeta', 'brane', { d: 4, zh: 1 }),
		pad('p8', 'Custom', 'metric', { d: 3, f: '1-z^3' }),
		pad('p7', 'Alpha', 'brane', { d: 3, zh: 1 }),
		pad('p6', 'Boost', 'boosted', { d: 4, zh: 1, v: 0.6 }),
		pad('p5', 'Odd', 'wormhole', {})
	];
	it('groups by bulk in the language order, unknown bulks last, titles alphabetical (not by recency)', () => {
		const g = groupPadsByBulk(pads);
		expect(g.map((x) => x.bulk)).toEqual(['brane', 'boosted', 'metric', 'wormhole']);
		expect(g[0]!.pads.map((p) => p.title)).toEqual(['Alpha', 'Zeta']);
	});
	it('gives numeric parameters as chips, leaving formula strings out', () => {
		expect(paramChips(pads[1]!.bulk)).toEqual(['d=3']);
		expect(paramChips(pads[3]!.bulk)).toEqual(['d=4', 'zh=1', 'v=0.6']);
	});
	it('narrows by title, bulk or chip, every word matching', () => {
		expect(groupPadsByBulk(pads, 'd=4').flatMap((g) => g.pads.map((p) => p.id))).toEqual(['p9', 'p6']);
		expect(groupPadsByBulk(pads, 'brane d=3').flatMap((g) => g.pads.map((p) => p.id))).toEqual(['p7']);
		expect(groupPadsByBulk(pads, 'boost').map((g) => g.bulk)).toEqual(['boosted']);
	});
});
