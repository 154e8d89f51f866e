/**
 * The one formula sandbox (src/lib/holo/formula.ts), attacked through both of its doors: metric strings
 * (`use metric f="…"`, makeBulk('metric')) and the language's arithmetic. Each attack asserts its exact
 * error; after each, a clean formula on the same module instance still gives the right number, so no
 * string can leave state behind for the next user.
 */
import { describe, expect, it } from 'vitest';
import { compileFormula, evaluateFormula, FORMULA_FUNCTIONS, FormulaError } from '../../../src/lib/holo/formula';
import { deltaArea, HoloError, makeBulk } from '../../../src/lib/holo/index';
import { FUNCTIONS } from '../../../src/lib/lang/vocab';
import { emptyContext, runLine } from '../../../src/lib/lang/evaluate';

function metricError(f: string): HoloError {
	try {
		makeBulk('metric', { d: 4, f, zh: 1 });
	} catch (e) {
		if (e instanceof HoloError) return e;
		throw e;
	}
	throw new Error(`no error for f="${f}"`);
}

/** A clean metric after an attack: f = 1 − z⁴ is the planar brane, so ΔA must agree with the brane's. */
function expectCleanMetric() {
	const m = makeBulk('metric', { d: 4, f: '1 - z^4', zh: 1 });
	const b = makeBulk('brane', { d: 4, zh: 1 });
	expect(Math.abs(deltaArea(m, 0.5) / deltaArea(b, 0.5) - 1)).toBeLessThan(1e-8);
	// and plain double arithmetic: 0.1 + 0.2 is not 0.3 in IEEE doubles (a BigNumber instance would say it is)
	expect(evaluateFormula('0.1 + 0.2')).toBe(0.1 + 0.2);
	expect(evaluateFormula('0.1 + 0.2')).not.toBe(0.3);
}

const short = (t: string) => (t.length > 60 ? `${t.slice(0, 40)}… (${t.length} characters)` : t);
const HUGE_NESTING = '('.repeat(5000) + 'z' + ')'.repeat(5000);

describe('metric strings: each attack refused with its exact error, then a clean metric works', () => {
	const attacks: [f: string, message: string][] = [
		['config({number: "BigNumber"})', "f is refused: function 'config' is not allowed"],
		['1 + 0*config({precision: 2})', "f is refused: function 'config' is not allowed"],
		['createUnit("zork")', "f is refused: function 'createUnit' is not allowed"],
		['import({sin: 1}, {override: true})', "f is refused: function 'import' is not allowed"],
		['1+0*sum(range(1,1e9))', "f is refused: function 'sum' is not allowed"],
		['1+0*size(range(1,1e9))[1]', 'f is refused: properties and indexing are not allowed'],
		['1 + 0*ones(1e5, 1e5)', "f is refused: function 'ones' is not allowed"],
		['1 + 0*zeros(1e5, 1e5)', "f is refused: function 'zeros' is not allowed"],
		['1 + 0*matrix([1, 2])', "f is refused: function 'matrix' is not allowed"],
		['1 + 0*[1, 2]', 'f is refused: matrices and lists are not allowed'],
		['1 + 0*(1:1e9)', 'f is refused: ranges are not allowed'],
		['compile("1")', "f is refused: function 'compile' is not allowed"],
		['parser()', "f is refused: function 'parser' is not allowed"],
		['evaluate("1")', "f is refused: function 'evaluate' is not allowed"],
		['g(x) = x', 'f is refused: function definitions are not allowed'],
		['z = 1', 'f is refused: assignment is not allowed'],
		['"1"', 'f is refused: strings are not allowed'],
		['1; 2', "f is refused: one formula only (no ';' or line breaks)"],
		['z > 0 ? 1 : 2', 'f is refused: conditionals are not allowed'],
		['{a: 1}.a', 'f is refused: properties and indexing are not allowed'],
		['sin.constructor("return process")', 'f is refused: only named functions can be called'],
		['true', 'f is refused: only numbers are allowed (got true)'],
		['1 - z!', "f is refused: operator '!' is not allowed"],
		// a free name is a symbolic parameter (never a unit): here it makes f(0) ≠ 1
		['1 - 2 cm', 'f(0) must be 1 (got -2*cm+1)'],
		['1 - sqrt', "f is refused: 'sqrt' is a function: call it, e.g. sqrt(z)"],
		['1 - pow(z)', 'f is refused: pow takes 2 arguments, got 1'],
		[HUGE_NESTING, 'f is longer than 400 characters'],
		['('.repeat(100) + 'z' + ')'.repeat(100), 'f is nested more than 64 deep'],
		['1 - (z', 'f does not parse: Parenthesis ) expected (char 7)']
	];
	it.each(attacks.map(([f, m]) => [short(f), f, m] as const))('%s', (_, f, message) => {
		const e = metricError(f);
		expect(e.message).toBe(message);
		expect(e.key).toBe('f');
		expectCleanMetric();
	});

	it('sending the BigNumber attack many times changes nothing', () => {
		for (let i = 0; i < 20; i++) expect(() => makeBulk('metric', { d: 4, f: 'config({number: "BigNumber"})' })).toThrow(HoloError);
		expectCleanMetric();
	});

	it('keeps the elementary functions and the parameters a metric needs', () => {
		const m = makeBulk('metric', { d: 4, f: '1 - (z/zh)^4 + q^2*(z/zh)^6 - q^2*(z/zh)^4', zh: 1, q: 0.3 });
		expect(m.slice.f(0.5)).toBeCloseTo(1 - 0.5 ** 4 + 0.09 * 0.5 ** 6 - 0.09 * 0.5 ** 4, 15);
		const h = makeBulk('metric', { d: 4, f: '1', h: 'exp(-z^2) * cosh(z) / sqrt(1 + z^2) + 0*tanh(z)' });
		expect(h.slice.h!(0.7)).toBeCloseTo((Math.exp(-0.49) * Math.cosh(0.7)) / Math.sqrt(1.49), 15);
		// no real value: NaN for the scan that finds where the slice ends, not an error
		const n = makeBulk('metric', { d: 4, f: 'sqrt(1 - z)', zh: 1 });
		expect(n.slice.f(2)).toBeNaN();
	});
});

describe('arithmetic lines after each attack, on the same module instance', () => {
	const attacks: [text: string, message: string, limits?: { maxDepth: number }][] = [
		['config({number: "BigNumber"})', "function 'config' is not allowed"],
		['createUnit("zork")', "function 'createUnit' is not allowed"],
		['import({x: 1})', "function 'import' is not allowed"],
		['sum(range(1, 1e9))', "function 'sum' is not allowed"],
		['ones(1e5, 1e5)', "function 'ones' is not allowed"],
		['zeros(1e5, 1e5)', "function 'zeros' is not allowed"],
		['matrix([1])', "function 'matrix' is not allowed"],
		['compile("1")', "function 'compile' is not allowed"],
		['parser()', "function 'parser' is not allowed"],
		['evaluate("1")', "function 'evaluate' is not allowed"],
		['f(x) = 1', 'function definitions are not allowed'],
		['x = 1', 'assignment is not allowed'],
		['"s"', 'strings are not allowed'],
		['-'.repeat(10) + '('.repeat(70) + '1' + ')'.repeat(70), 'is nested more than 64 deep'],
		['1+'.repeat(1000) + '1', 'is longer than 2000 characters'],
		['1+'.repeat(700) + '1', 'is nested more than 64 deep'],
		['1+'.repeat(700) + '1', 'has more than 600 parts', { maxDepth: 1000 }]
	];
	it.each(attacks.map(([t, m, l]) => [short(t), t, m, l] as const))('%s', (_, text, message, limits) => {
		let err: unknown;
		try {
			evaluateFormula(text, {}, { strict: true, limits });
		} catch (e) {
			err = e;
		}
		expect(err).toBeInstanceOf(FormulaError);
		expect((err as Error).message).toBe(message);
		expect(runLine('1/3 + 2^10', emptyContext()).results[0]).toMatchObject({ kind: 'scalar', value: 1 / 3 + 1024 });
		expect(evaluateFormula('0.1 + 0.2')).toBe(0.1 + 0.2);
	});

	it('tells a missing real value from a non-finite one', () => {
		expect(() => evaluateFormula('sqrt(-1)', {}, { strict: true })).toThrow(new FormulaError('sqrt() has no real value here', 'complex'));
		expect(() => evaluateFormula('(-8)^(1/3)', {}, { strict: true })).toThrow(new FormulaError('^ has no real value here', 'complex'));
		expect(evaluateFormula('1/0', {}, { strict: true })).toBe(Infinity);
		expect(evaluateFormula('sqrt(-1)')).toBeNaN();
	});

	it('evaluates what mathjs would, in doubles (values from JS Math, common practice)', () => {
		const f = compileFormula('2z + log(x, 2) - -round(-2.5) + max(1, z, 3)', ['z', 'x']);
		expect(f.evaluate([0.25, 8])).toBe(0.5 + 3 - 3 + 3);
		expect(Object.isFrozen(f)).toBe(true);
		expect(() => f.evaluate([1])).toThrow('needs 2 values, got 1');
	});

	it('offers every function the language lets a line call', () => {
		expect([...FUNCTIONS].filter((f) => !FORMULA_FUNCTIONS.includes(f))).toEqual([]);
	});
});
