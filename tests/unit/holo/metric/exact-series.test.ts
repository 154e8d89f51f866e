/**
 * Exact π/B forms of a rational metric's series coefficients (holo/metric/exact-series.ts) against the brane's
 * own exact forms (series/exact-latex.ts, checked there against 60-digit mpmath numerics) and the charged
 * brane's (series/exact-charged.ts), and against the metric's double-precision series (coeffs.ts).
 */
import katex from 'katex';
import { describe, expect, it } from 'vitest';
import { makeBulk } from '../../../../src/lib/holo/index';
import {
	metricCoeffsNumeric,
	metricCoeffsSymbolic,
	metricExactLatex,
	evaluateCoeff,
	metricTerms
} from '../../../../src/lib/holo/metric/coeffs';
import { exactMetricCoeffs } from '../../../../src/lib/holo/metric/exact-series';
import { readMetric, taylorOf } from '../../../../src/lib/holo/metric/model';
import { exactLatex, exactValue } from '../../../../src/lib/holo/series/exact-latex';
import { seriesCoeffs } from '../../../../src/lib/holo/series/index';
import { expectRel } from '../check';

/** LaTeX with spacing commands and blanks removed: the same expression typed either way compares equal. */
const norm = (s: string) => s.replace(/\\[,;!]|\s+/g, '');

describe('exact forms of the metric series', () => {
	for (const d of [3, 4, 5, 6]) {
		it(`the brane as a metric, d=${d}: each a_k's LaTeX is the brane's and its value agrees to 1e−12 (orders 1–${d > 5 ? 4 : 6})`, () => {
			const n = d > 5 ? 4 : 6;
			const model = readMetric({ d, f: `1 - z^${d}`, values: {} });
			const tex = metricExactLatex(model, n)!;
			expect(tex).toBeDefined();
			const { powers, values } = metricCoeffsNumeric(model, n);
			expect(powers).toEqual(Array.from({ length: n }, (_, i) => (i + 1) * d));
			for (let k = 1; k <= n; k++) {
				expect(norm(tex.get(k * d)!), `d=${d} k=${k}`).toBe(norm(exactLatex(d, 'brane', k)));
				expectRel(`a_${k} d=${d}`, exactValue(d, 'brane', k), values[k - 1]!, 1e-12, 'the brane’s exact a_k (series/exact-latex.ts)');
			}
		});
	}

	it('through the bulk: coeffs of `metric f="1-z^4"` are exact and print the brane’s forms', () => {
		const brane = seriesCoeffs(makeBulk('brane', { d: 4, zh: 1 }), 4);
		const metric = seriesCoeffs(makeBulk('metric', { d: 4, f: '1 - z^4' }), 4);
		metric.forEach((t, i) => {
			expect(t.exact).toBe(true);
			expect(norm(t.latex)).toBe(norm(brane[i]!.latex));
			expectRel(`a_${i + 1}`, brane[i]!.value, t.value, 1e-12, 'the brane');
		});
	});

	it('a two-parameter symbolic metric: exact polynomial coefficients equal the decimal ones monomial by monomial (1e−12) and compile in KaTeX', () => {
		const model = readMetric({ d: 4, f: '1 - m*z^4 + q^2*z^6', values: {} });
		const n = 4;
		const M = n * 4;
		const exact = exactMetricCoeffs(4, n, taylorOf(model, 'f', M).exact!.coeffs, taylorOf(model, 'h', M).exact!.coeffs, model.shown, {})!;
		const { coeffs, vars } = metricCoeffsSymbolic(model, n);
		expect(exact.map((c) => c.power)).toEqual(coeffs.map((c) => c.power));
		const at = { m: 1.3, q: 0.45 };
		const withNumbers = exactMetricCoeffs(
			4,
			n,
			taylorOf(model, 'f', M).exact!.coeffs,
			taylorOf(model, 'h', M).exact!.coeffs,
			model.shown,
			at
		)!;
		withNumbers.forEach((c, i) =>
			expectRel(`c_${c.power}`, evaluateCoeff(coeffs[i]!, vars, at), c.value, 1e-12, 'the decimal series (coeffs.ts)')
		);
		const shown = metricTerms(model, n, undefined);
		shown.terms.forEach((t) => {
			expect(t.latex).toMatch(/\\pi|\\mathrm\{B\}/);
			expect(t.latex).not.toMatch(/\d\.\d/);
			expect(() => katex.renderToString(t.latex, { throwOnError: true })).not.toThrow();
		});
		// c_6 is linear in q² with no m: one term
		expect(shown.terms.find((t) => t.power === 6)!.latex).toMatch(/q\^\{2\}$/);
	});

	it('the charged brane as a metric (zh = 1, q = 1/2): coefficients evaluate to the charged brane’s to 1e−12', () => {
		const bulk = makeBulk('metric', { d: 4, f: '1 - (1 + q^2)*z^4 + q^2*z^6', q: 0.5 });
		const charged = seriesCoeffs(makeBulk('charged', { d: 4, zh: 1, q: 0.5 }), 3);
		const metric = seriesCoeffs(bulk, 3);
		expect(metric.map((t) => t.power)).toEqual(charged.map((t) => t.power));
		metric.forEach((t, i) => {
			expect(t.exact).toBe(true);
			expectRel(`c_${t.power}`, charged[i]!.value, t.value, 1e-12, 'the charged brane (series/charged.ts)');
		});
	});
});
