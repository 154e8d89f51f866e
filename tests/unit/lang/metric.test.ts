/**
 * The custom metric through the language: g and params keys, symbolic coefficients, stress/thermo of a metric,
 * the deformation and symbolic refusals, and the first law. Values are checked against the named bulks
 * (holo's own tests hold those against mpmath and published limits).
 */
import katex from 'katex';
import { describe, expect, it } from 'vitest';
import type { RecordResult, Result, ScalarResult, SeriesResult, CheckResult } from '../../../src/lib/lang/result';
import { exactLatex } from '../../../src/lib/holo/series/exact-latex';
import { Pad } from './pad';

const one = <T extends Result>(p: Pad, line: string) => p.run(line).results.at(-1) as T;

describe('use metric', () => {
	it('coeffs of a two-parameter metric: each term a polynomial in m and q, LaTeX that KaTeX renders', () => {
		const p = new Pad();
		const r = one<SeriesResult>(p, 'use metric d=4 f="1-m*z^4+q^2*z^6"; coeffs darea o=3 | tex');
		expect(r.terms.map((t) => t.power)).toEqual([4, 6, 8, 10, 12]);
		// exact π/B forms (holo/metric/exact-series.ts): c_4 = a_1 m with the brane's a_1 (0.565637954628…)
		expect(r.terms[0]!.latex).toBe(`${exactLatex(4, 'brane', 1)}\\,m`);
		expect(r.terms.every((t) => /\\pi/.test(t.latex) && !/\d\.\d/.test(t.latex))).toBe(true);
		expect(r.terms[4]!.latex).toMatch(/m\^\{3\}.*q\^\{4\}/);
		// no numbers for the symbols: the coefficient's value is not a number
		expect(r.terms.every((t) => Number.isNaN(t.coeff))).toBe(true);
		expect(() => katex.renderToString(r.latex, { throwOnError: true })).not.toThrow();
	});

	it('named parameters with numbers: the polynomial and its value, equal to the numeric series', () => {
		const p = new Pad();
		const sym = one<SeriesResult>(p, 'use metric d=4 f="1-m*z^4+q^2*z^6" params="m,q" m=1.5 q=0.4; coeffs darea o=2');
		const num = one<SeriesResult>(new Pad(), 'use metric d=4 f="1-m*z^4+q^2*z^6" m=1.5 q=0.4; coeffs darea o=2');
		// the numeric one is in l/zh (zh the horizon): convert to l^K
		const zh = findZh(1.5, 0.16);
		sym.terms.forEach((t, i) => {
			const n = num.terms[i]!;
			expect(n.power).toBe(t.power);
			expect(Math.abs(t.coeff - n.coeff / Math.pow(zh, n.power!)) / Math.abs(t.coeff)).toBeLessThan(1e-12);
		});
	});

	it('g: thermo of a metric with g = f equals the brane; stress and thermo of the brane as a metric', () => {
		const brane = one<RecordResult>(new Pad(), 'use brane d=4 zh=1.2; thermo');
		const metric = one<RecordResult>(new Pad(), 'use metric d=4 f="1-(z/zh)^4" g="1-(z/zh)^4" zh=1.2; thermo');
		for (const k of ['T', 's', 'e', 'p']) expect(Math.abs(metric.fields[k]! / brane.fields[k]! - 1), k).toBeLessThan(1e-12);
	});

	it('a z² term: stress refused as a deformation; symbols refuse numbers, naming them', () => {
		const p = new Pad();
		p.run('use metric d=4 f="1 - z^2 - z^4"');
		expect(p.fail('stress').message).toMatch(/^not a normalisable deformation: f has a z\^2 term/);
		const q = new Pad();
		q.run('use metric d=4 f="1 - m*z^4"');
		expect(q.fail('darea l=0.3').message).toBe('m is symbolic: give m=… for numbers');
	});

	it('tent and firstlaw of the brane written as a metric equal the brane’s (order 2 and exact)', () => {
		for (const o of ['2', 'exact']) {
			const a = one<ScalarResult>(new Pad(), `tent l=0.5 o=${o}`);
			const b = one<ScalarResult>(new Pad(), `use metric d=4 f="1-z^4"; tent l=0.5 o=${o}`);
			expect(Math.abs(b.value / a.value - 1), o).toBeLessThan(1e-10);
			const c = one<CheckResult>(new Pad(), `firstlaw l=0.5 o=${o}`);
			const e = one<CheckResult>(new Pad(), `use metric d=4 f="1-z^4"; firstlaw l=0.5 o=${o}`);
			expect(Math.abs(e.lhs / c.lhs - 1), o).toBeLessThan(1e-10);
			expect(Math.abs(e.rhs / c.rhs - 1), o).toBeLessThan(1e-10);
		}
	});
});

/** The first zero of 1 − m z⁴ + q² z⁶ by bisection (independent of the engine's horizon search). */
function findZh(m: number, q2: number): number {
	const f = (z: number) => 1 - m * z ** 4 + q2 * z ** 6;
	let lo = 0.5;
	let hi = 1;
	for (let i = 0; i < 200; i++) {
		const mid = (lo + hi) / 2;
		if (f(mid) > 0) lo = mid;
		else hi = mid;
	}
	return (lo + hi) / 2;
}

describe('along= (a metric first law over its named parameters)', () => {
	const use = 'use metric d=4 f="1 - m*z^4 + q^2*z^6" m=1.2 q=0.4';
	it('is a list of names, not a sweep: tent over widths and orders, mu labelled by the second parameter', () => {
		const p = new Pad();
		p.run(use);
		const t = p.run('tent l=0.1,0.3 o=1,2 along=m,q').results.at(-1) as { kind: string; columns: string[]; rows: number[][] };
		expect(t.kind).toBe('table');
		expect(t.columns).toEqual(['l', 'o1', 'o2']);
		// the same number as the single line
		const single = one<ScalarResult>(p, 'tent l=0.3 o=2 along=m,q');
		expect(t.rows[1]![2]).toBe(single.value);
		const m = one<ScalarResult>(p, 'mu l=0.3 o=2 along=m,q');
		expect(m.label).toContain('μ_q');
	});

	it('errors: an unknown parameter and a first parameter that does not move the energy, each naming along', () => {
		const p = new Pad();
		p.run(use);
		expect(() => p.run('tent l=0.3 o=2 along=m,r')).toThrow("along: 'r' is not a parameter of this metric");
		expect(() => p.run('firstlaw l=0.3 o=2 along=q,m')).toThrow('does not move the energy');
		expect(() => p.run('tent l=0.3 o=2 along=2')).toThrow('along takes parameter names');
	});
});
