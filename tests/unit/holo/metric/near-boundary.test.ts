/**
 * Exact ΔA of non-polynomial metrics at small widths (the black-box strip path with f − 1, h − 1 from the Taylor
 * series near the boundary: holo/metric/near-boundary.ts). Reference: the metric's own small-width series at
 * order 12 (holo/metric/series.ts, checked against the brane's and charged brane's closed forms and their mpmath
 * fixtures in metric.test.ts); at these widths order 10 and order 12 agree to ≤ 1e−13, so the series' truncation
 * is far below the 1e−10 asked. Before the fix, f = 1 − z⁴e^{−z} was off by 7e−7 at l = 0.05 and 2e−5 at l = 0.02.
 */
import { describe, expect, it } from 'vitest';
import { deltaArea, deltaAreaSeries, makeBulk } from '../../../../src/lib/holo/index';
import { expectRel } from '../check';

const METRICS: [string, string][] = [
	['1 - z^4*exp(-z)', '1'],
	['1 - z^4*exp(-z)', '1 + z^4*exp(-z^2)/3'],
	['(1 - z^4)/(1 + z^5)', '1'],
	['cos(z^2) - z^4/2', '1']
];

describe('non-polynomial metrics at small widths', () => {
	for (const [f, h] of METRICS) {
		it(`f="${f}" h="${h}": exact ΔA equals the order-12 series to 1e−10 at l = 0.02 … 0.2`, () => {
			const bulk = makeBulk('metric', { d: 4, f, h });
			expect(bulk.slice.fTerms).toBeUndefined(); // the black-box path
			for (const l of [0.02, 0.05, 0.1, 0.2]) {
				const s12 = deltaAreaSeries(bulk, l, 12);
				expect(Math.abs(deltaAreaSeries(bulk, l, 10) - s12)).toBeLessThanOrEqual(1e-13 * Math.abs(s12));
				expectRel(`ΔA l=${l}`, s12, deltaArea(bulk, l), 1e-10, 'the metric’s order-12 series');
			}
		});
	}

	it('the Taylor difference hands over to f(z) − 1 smoothly: ΔA is continuous across widths (d = 3, 5)', () => {
		for (const d of [3, 5]) {
			const bulk = makeBulk('metric', { d, f: `1 - z^${d}*exp(-z)` });
			const ls = [0.05, 0.1, 0.2];
			for (const l of ls) expectRel(`d=${d} l=${l}`, deltaAreaSeries(bulk, l, 12), deltaArea(bulk, l), 1e-10, 'the order-12 series');
		}
	});
});
