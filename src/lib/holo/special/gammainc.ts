/**
 * Regularised incomplete gamma functions P(a, x) = γ(a, x)/Γ(a) and Q(a, x) = 1 − P, and from them the
 * χ² distribution's upper tail (the p-value of a χ² statistic) and its quantile.
 * Method (Press et al., Numerical Recipes, 3rd ed., §6.2): the power series of γ for x < a + 1, the continued
 * fraction of Γ(a, x) by the modified Lentz method otherwise, each to a relative 1e-15; Γ(a) through `lgamma`
 * (relative error ≲ 2e−15 for the a = dof/2 ≤ 500 used here). Q is accurate to about 1e−13 relative down to
 * tails of 1e−300, where it underflows to 0.
 */
import { lgamma } from './gamma';

const EPS = 1e-15;
const TINY = 1e-300;

function seriesP(a: number, x: number): number {
	let sum = 1 / a;
	let term = sum;
	for (let n = 1; n < 10_000; n++) {
		term *= x / (a + n);
		sum += term;
		if (Math.abs(term) < Math.abs(sum) * EPS) break;
	}
	return sum * Math.exp(-x + a * Math.log(x) - lgamma(a));
}

function fractionQ(a: number, x: number): number {
	let b = x + 1 - a;
	let c = 1 / TINY;
	let d = 1 / b;
	let h = d;
	for (let i = 1; i < 10_000; i++) {
		const an = -i * (i - a);
		b += 2;
		d = an * d + b;
		if (Math.abs(d) < TINY) d = TINY;
		c = b + an / c;
		if (Math.abs(c) < TINY) c = TINY;
		d = 1 / d;
		const del = d * c;
		h *= del;
		if (Math.abs(del - 1) < EPS) break;
	}
	return Math.exp(-x + a * Math.log(x) - lgamma(a)) * h;
}

/** Q(a, x) for a > 0, x ≥ 0. */
export function gammaQ(a: number, x: number): number {
	if (!(a > 0) || !(x >= 0)) return NaN;
	if (x === 0) return 1;
	if (x === Infinity) return 0;
	return x < a + 1 ? 1 - seriesP(a, x) : fractionQ(a, x);
}

/** P(a, x) = 1 − Q(a, x), computed without the cancellation where P is small. */
export function gammaP(a: number, x: number): number {
	if (!(a > 0) || !(x >= 0)) return NaN;
	if (x === 0) return 0;
	return x < a + 1 ? seriesP(a, x) : 1 - fractionQ(a, x);
}

/** The p-value of a χ² statistic with `dof` degrees of freedom: Pr(χ²_dof ≥ chi2). */
export function chi2Sf(chi2: number, dof: number): number {
	return gammaQ(dof / 2, chi2 / 2);
}

/** The χ² value whose upper tail is `p` (e.g. p = 0.05: the 95 % critical value), by bisection on chi2Sf. */
export function chi2Quantile(p: number, dof: number): number {
	if (!(p > 0 && p < 1) || !(dof > 0)) return NaN;
	let lo = 0;
	let hi = Math.max(1, dof);
	while (chi2Sf(hi, dof) > p) hi *= 2;
	for (let i = 0; i < 200 && hi - lo > 1e-13 * hi; i++) {
		const mid = (lo + hi) / 2;
		if (chi2Sf(mid, dof) > p) lo = mid;
		else hi = mid;
	}
	return (lo + hi) / 2;
}
