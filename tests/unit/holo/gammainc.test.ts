import { describe, expect, it } from 'vitest';
import { chi2Quantile, chi2Sf, gammaP, gammaQ } from '../../../src/lib/holo/special/gammainc';
import { minimizeBrent } from '../../../src/lib/holo/numeric/minimize';

describe('χ² upper tail', () => {
	it('even dof: the closed form e^{-x/2} Σ_{k<ν/2} (x/2)^k/k! (Abramowitz & Stegun 26.4.21)', () => {
		for (const dof of [2, 4, 10, 40]) {
			for (const x of [0.01, 0.5, 1, 3.7, 10, 25, 60, 150]) {
				let term = 1;
				let sum = 1;
				for (let k = 1; k < dof / 2; k++) {
					term *= x / 2 / k;
					sum += term;
				}
				const want = Math.exp(-x / 2) * sum;
				const got = chi2Sf(x, dof);
				expect(Math.abs(got - want) / want, `dof ${dof}, x ${x}: want ${want}, got ${got}`).toBeLessThan(1e-12);
			}
		}
	});
	it('odd dof: Q(a+1, x) = Q(a, x) + x^a e^{-x}/Γ(a+1) links ν and ν+2 (A&S 6.5.21), and P + Q = 1', () => {
		for (const a of [0.5, 1.5, 4.5, 12.5]) {
			for (const x of [0.2, 1, 2.5, 7, 20]) {
				const step = Math.exp(a * Math.log(x) - x - lgammaRef(a + 1));
				expect(gammaQ(a + 1, x)).toBeCloseTo(gammaQ(a, x) + step, 13);
				expect(gammaP(a, x) + gammaQ(a, x)).toBeCloseTo(1, 14);
			}
		}
	});
	it('published 95 % points of χ² (A&S Table 26.8: 3.841, 11.070, 18.307, 43.773 for ν = 1, 5, 10, 30)', () => {
		expect(chi2Quantile(0.05, 1)).toBeCloseTo(3.8415, 3);
		expect(chi2Quantile(0.05, 5)).toBeCloseTo(11.0705, 3);
		expect(chi2Quantile(0.05, 10)).toBeCloseTo(18.307, 3);
		expect(chi2Quantile(0.05, 30)).toBeCloseTo(43.773, 3);
		expect(chi2Sf(chi2Quantile(0.05, 7), 7)).toBeCloseTo(0.05, 12);
	});
});

/** ln Γ at half-integers and integers, exactly: Γ(n+1) = n!, Γ(n+½) = (2n)! √π / (4^n n!) */
function lgammaRef(z: number): number {
	if (Number.isInteger(z)) {
		let s = 0;
		for (let k = 2; k < z; k++) s += Math.log(k);
		return s;
	}
	const n = z - 0.5;
	let s = 0.5 * Math.log(Math.PI);
	for (let k = 1; k <= n; k++) s += Math.log(k - 0.5);
	return s;
}

describe("Brent's minimiser", () => {
	it('finds the minimum of smooth functions to its tolerance, and steps around refused values', () => {
		const m = minimizeBrent((x) => (x - 1.2345678) ** 2 + 3, 0, 4, 1e-10);
		expect(m.x).toBeCloseTo(1.2345678, 7);
		expect(m.fx).toBeCloseTo(3, 12);
		// cos has its minimum at π on [2, 4] (from memory)
		expect(minimizeBrent(Math.cos, 2, 4, 1e-10).x).toBeCloseTo(Math.PI, 7);
		// NaN/∞ count as +∞, as an engine refusal does in a fit
		const g = minimizeBrent((x) => (x > 2.5 ? NaN : (x - 2) ** 2), 0, 3, 1e-10);
		expect(g.x).toBeCloseTo(2, 7);
	});
});
