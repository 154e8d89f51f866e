// The import schema as an allow-list: bulks, units, let names and results are checked by the language's own
// schemas and the result types, and every refusal names what is wrong and the step where it is.
import { describe, expect, it } from 'vitest';
import { parsePadDocument, type PadDocument } from '../../../src/lib/server/export/schema';
import { BULKS } from '../../../src/lib/lang/vocab';

const brane = { name: 'brane', params: { d: 4, zh: 1 } };
const scalar = { kind: 'scalar', label: 'z*', value: 0.75, order: 'exact' };
const step = (n: number, extra: Record<string, unknown> = {}) => ({
	n,
	input: 'zstar l=0.5',
	status: 'ok',
	results: [scalar],
	error: null,
	ref: { value: 0.75, fields: {} },
	bulkBefore: brane,
	...extra
});
const doc = (change: Record<string, unknown> = {}) => ({
	format: 'bulkpad-pad',
	version: 1,
	title: 'T',
	bulk: brane,
	units: { system: 'geo', G: 1 },
	lets: {},
	steps: [step(1), step(2), step(3)],
	...change
});

function refusal(raw: unknown): string {
	const parsed = parsePadDocument(raw);
	expect(parsed.ok, JSON.stringify(parsed)).toBe(false);
	return parsed.ok ? '' : parsed.message;
}

describe('bulks', () => {
	it('takes every bulk the language knows, with the parameters a use line would store', () => {
		const examples: PadDocument['bulk'][] = [
			{ name: 'vacuum', params: { d: 3 } },
			{ name: 'brane', params: { d: 2, zh: 2 } },
			{ name: 'boosted', params: { d: 4, zh: 1, v: 0.6 } },
			{ name: 'charged', params: { d: 4, zh: 1, q: 0.5 } },
			{ name: 'dp', params: { p: 4, zh: 1 } },
			{ name: 'wave', params: { d: 4, zp: 1 } },
			{ name: 'soliton', params: { d: 4, z0: 1 } },
			{ name: 'metric', params: { d: 4, f: '1 - z^4', h: '1' } },
			{ name: 'vaidya', params: { d: 3, zh: 1 } }
		];
		expect(examples.map((b) => b.name).sort()).toEqual([...BULKS].sort());
		for (const bulk of examples) expect(parsePadDocument(doc({ bulk })).ok, bulk.name).toBe(true);
	});

	it('refuses an unknown bulk as the pad’s, naming it', () => {
		expect(refusal(doc({ bulk: { name: 'wormhole', params: {} } }))).toMatch(
			/bulk\.name: unknown bulk 'wormhole': Bulkpad knows vacuum, brane/
		);
	});

	it('refuses an unknown bulk in a step, naming the bulk and the step', () => {
		const steps = [step(1), step(2), step(3, { bulkBefore: { name: 'constructor', params: {} } })];
		expect(refusal(doc({ steps }))).toMatch(/step 3, steps\.2\.bulkBefore\.name: unknown bulk 'constructor'/);
	});

	it.each([
		[{ name: 'brane', params: { d: 11 } }, /bulk\.params\.d: bulk brane: d must be ≤ 10/],
		[{ name: 'brane', params: { d: 4, q: 1 } }, /bulk\.params\.q: bulk brane: key 'q' does not apply to bulk 'brane'/],
		[{ name: 'boosted', params: { d: 4, v: 1.5 } }, /bulk\.params\.v: bulk boosted: v must satisfy \|v\| < 1/],
		[{ name: 'charged', params: { d: 4, q: 2 } }, /q must satisfy q² ≤ d\/\(d−2\)/],
		[{ name: 'dp', params: { p: 5 } }, /p = 5/],
		[{ name: 'metric', params: { d: 4 } }, /bulk metric: f must be a string/],
		[{ name: 'brane', params: { d: 'four' } }, /bulk brane: d must be a number/]
	])('refuses parameters the language would refuse: %j', (bulk, message) => {
		expect(refusal(doc({ bulk }))).toMatch(message);
	});
});

describe('units', () => {
	it.each([
		{ system: 'geo', G: 2 },
		{ system: 'cft', c: 30 },
		{ system: 'sym', N: 10 }
	])('takes %j', (units) => {
		expect(parsePadDocument(doc({ units })).ok).toBe(true);
	});
	it.each([
		[{ system: 'planck' }, /units\.system: units: the system is geo, cft, sym/],
		[{ system: 'geo', G: -1 }, /units\.G: G must be > 0/],
		[{ system: 'cft' }, /units: units cft needs c=…/],
		[{ system: 'cft', c: 3, G: 1 }, /units\.G: units cft takes c=…, not 'G'/]
	])('refuses %j', (units, message) => expect(refusal(doc({ units }))).toMatch(message));
});

describe('results', () => {
	const withResult = (result: unknown) => doc({ steps: [step(1), step(2, { results: [result] })] });

	it('takes every result kind with the optional fields result.ts names, and non-finite numbers as null', () => {
		const results = [
			{ ...scalar, unit: 'L', latex: 'z_*', warning: 'w', fields: { T: 1, mu: null } },
			{ kind: 'record', label: 'thermo', fields: { T: 0.3, s: 1, e: 2, p: null } },
			{
				kind: 'table',
				label: 't',
				columns: ['l', 'o1'],
				rows: [
					[0.1, 1],
					[0.2, null]
				],
				plot: { x: 'l', log: false, validity: { o1: 0.5 }, show: true },
				download: { format: 'csv', filename: 't.csv' }
			},
			{ kind: 'series', label: 's', terms: [{ k: 1, coeff: 0.5, latex: 'a', power: 4 }], latex: 'a', order: 4, warning: 'w' },
			{ kind: 'check', label: 'c', pass: true, lhs: 1, rhs: 1, residual: 0, tolerance: 1e-6, order: 'exact' },
			{ kind: 'note', text: 'n' }
		];
		expect(parsePadDocument(doc({ steps: [step(1, { results })] }))).toMatchObject({ ok: true });
	});

	it('takes a field it does not know only as a plain value or a flat record of numbers', () => {
		expect(parsePadDocument(withResult({ ...scalar, error: 1e-4, phase: 'connected', estimate: { lo: 1, hi: 2 } })).ok).toBe(true);
		expect(refusal(withResult({ ...scalar, extra: { nested: { deep: 1 } } }))).toMatch(/step 2, steps\.1\.results\.0\.extra/);
		expect(refusal(withResult({ ...scalar, extra: [1, 2, 3] }))).toMatch(/step 2, steps\.1\.results\.0\.extra/);
	});

	it.each([
		[{ kind: 'plot', label: 'x' }, /step 2, steps\.1\.results\.0\.kind/],
		[{ kind: 'scalar', label: 'x', value: '1', order: 1 }, /steps\.1\.results\.0\.value/],
		[{ kind: 'scalar', label: 'x', value: 1 }, /steps\.1\.results\.0\.order/],
		[{ kind: 'table', label: 't', columns: ['a'], rows: [[{ a: 1 }]] }, /steps\.1\.results\.0\.rows\.0\.0/],
		[{ kind: 'table', label: 't', columns: ['a'], rows: [], plot: { x: 'a', hook: { a: { b: 1 } } } }, /steps\.1\.results\.0\.plot\.hook/],
		[
			{ kind: 'table', label: 't', columns: ['a'], rows: [], download: { format: 'exe', filename: 'x' } },
			/steps\.1\.results\.0\.download\.format/
		],
		[{ kind: 'series', label: 's', terms: [{ k: 1, coeff: 1 }], latex: '' }, /steps\.1\.results\.0\.terms\.0\.latex/],
		[{ kind: 'check', label: 'c', pass: 'yes', lhs: 1, rhs: 1, residual: 0, tolerance: 0 }, /steps\.1\.results\.0\.pass/],
		[{ kind: 'note' }, /steps\.1\.results\.0\.text/]
	])('refuses %j', (result, message) => expect(refusal(withResult(result))).toMatch(message));
});

describe('state', () => {
	it('refuses a let name the language could not have made', () => {
		expect(refusal(doc({ lets: { 'a b': { fields: {} } } }))).toMatch(/lets/);
		expect(refusal(doc({ lets: { constructor: { fields: {} } } }))).toMatch(/lets\.constructor/);
		// JSON.parse makes "__proto__" an own key; zod's record never copies it, so it cannot reach the pad
		const parsed = parsePadDocument(doc({ lets: JSON.parse('{"__proto__": {"fields": {"x": 1}}, "a": {"fields": {}}}') }));
		expect(parsed.ok && Object.keys(parsed.doc.lets!)).toEqual(['a']);
		expect(parsed.ok && JSON.stringify(parsed.doc.lets)).toBe('{"a":{"fields":{}}}');
		expect(parsePadDocument(doc({ lets: { width_1: { value: 2, fields: {}, order: 3 } } })).ok).toBe(true);
	});

	it('keeps a recorded step error with its code, and refuses one without a message', () => {
		const failed = {
			status: 'error',
			results: null,
			error: { message: 'expected a value', start: 8, end: 8, code: 'language', hint: 'h' }
		};
		expect(parsePadDocument(doc({ steps: [step(1, failed)] })).ok).toBe(true);
		expect(refusal(doc({ steps: [step(1, { ...failed, error: { start: 0 } })] }))).toMatch(/step 1, steps\.0\.error\.message/);
	});
});

describe('tables with plot guides', () => {
	// a growth sweep in a vaidya pad carries reference curves (thermal value, early law, linear growth)
	const growth = (guides: unknown) => ({
		kind: 'table',
		label: 'ΔA vs t',
		columns: ['t', 'exact'],
		rows: [
			[0, 0],
			[1, 0.4]
		],
		plot: { x: 't', show: true, guides }
	});
	it('takes a table whose plot carries guides', () => {
		const guides = [
			{
				label: '\\Delta A_{\\rm th}',
				points: [
					[0, 1],
					[1, 1]
				]
			}
		];
		expect(parsePadDocument(doc({ steps: [step(1, { results: [growth(guides)] })] })).ok).toBe(true);
	});
	it('refuses guides that are not polylines, naming the step', () => {
		const bad = [{ label: 'x', points: [[0, { nested: 1 }]] }];
		expect(refusal(doc({ steps: [step(1, { results: [growth(bad)] })] }))).toMatch(/step|steps/);
	});
});
