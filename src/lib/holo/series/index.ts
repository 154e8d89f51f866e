import { HoloError } from '../errors';
import { MAX_ORDER } from '../limits';
import { solveStrip } from '../strip';
import type { Bulk, SeriesCapability, SeriesCoeff } from '../types';
import { kappaCoeffs } from './coeffs';
import { radiusEstimate, radiusFromGrowth } from './radius';
import { sigFigs } from '../numeric/digits';

export { MAX_ORDER };

function checkOrder(n: number): void {
	if (!Number.isInteger(n) || n < 0) throw new HoloError('order must be a non-negative integer', 'o');
	if (n > MAX_ORDER) throw new HoloError(`order must be ≤ ${MAX_ORDER}`, 'o', 'use o=exact');
}

/** The bulk's series (Bulk.series), or the error a line without one gets. */
function seriesOf(bulk: Bulk): SeriesCapability {
	if (!bulk.series || !bulk.scale) throw new HoloError(`no closed-form series for ${bulk.name}`, 'o', 'use o=exact');
	return bulk.series;
}

/**
 * a_k(κ) of the boosted brane as coefficient arrays of κ^0..κ^k, k = 1..n (d ≥ 3); the static brane is the
 * κ^0 entry and the wave (scale zp) the κ^k entry. Stable signature for the first-law code.
 */
export function boostedCoeffPolys(d: number, n: number): number[][] {
	checkOrder(n);
	if (!Number.isInteger(d) || d < 3 || d > 10) throw new HoloError('d must be an integer in 3..10', 'd');
	return kappaCoeffs(d, n).map((p) => p.slice());
}

/** Exponents of l/scale of the terms of order n, ascending: k d (k = 1..n), or the charged brane's K ≤ n d. */
export function seriesPowers(bulk: Bulk, n: number): number[] {
	const s = seriesOf(bulk);
	checkOrder(n);
	return s.powers(n);
}

/** The numbers a_k (k = 1..n) of this bulk (brane, boosted, wave); charged: c_K in the order of seriesPowers. */
export function seriesValues(bulk: Bulk, n: number): number[] {
	const s = seriesOf(bulk);
	checkOrder(n);
	return s.values(n);
}

/**
 * Closed-form coefficients with their LaTeX; ΔA = l^{2−d} Σ_i value_i (l/scale)^{power_i}: power = k d for
 * brane, boosted and wave; the charged brane's terms (k = index, power = da + 2(d−1)b ≤ n d, `poly` in q²).
 */
export function seriesCoeffs(bulk: Bulk, n: number): SeriesCoeff[] {
	const s = seriesOf(bulk);
	checkOrder(n);
	return s.coeffs(n);
}

/** Order-n series for ΔA at width l (order 0 is the vacuum: 0). */
export function deltaAreaSeries(bulk: Bulk, l: number, n: number): number {
	if (!(l > 0) || !Number.isFinite(l)) throw new HoloError('l must be a positive number', 'l');
	const s = seriesOf(bulk);
	checkOrder(n);
	if (n === 0) return 0;
	const a = s.values(n);
	if (s.mixedPowers) {
		const x = l / bulk.scale!;
		const K = s.powers(n);
		let sum = 0;
		for (let i = a.length - 1; i >= 0; i--) sum += a[i] * Math.pow(x, K[i]);
		return Math.pow(l, 2 - bulk.d) * sum;
	}
	// one power per order, k d: Horner in τ = (l/scale)^d
	const tau = Math.pow(l / bulk.scale!, bulk.d);
	let sum = 0;
	for (let k = n; k >= 1; k--) sum = (sum + a[k - 1]) * tau;
	return Math.pow(l, 2 - bulk.d) * sum;
}

export interface ValidityResult {
	l_max: number;
	radius: number;
	/** absolute uncertainty of `radius`, same units */
	radius_err: number;
}

const validityCache = new Map<string, ValidityResult>();

/**
 * Radius of convergence in l (same units as l) with its uncertainty, from the coefficients up to MAX_ORDER:
 * the Domb–Sykes extrapolation of radiusEstimate in τ = (l/scale)^d, converted as l = scale τ^{1/d}
 * (relative uncertainty divided by d). The charged brane's exponents are irregular, so its radius comes from a
 * fit of the coefficients' growth (radiusFromGrowth): an estimate whose uncertainty is taken as the change
 * between the fits to MAX_ORDER − 2 and MAX_ORDER orders, plus 1% (its measured bias at q = 0 is ~0.5%).
 */
export function seriesRadiusEstimate(bulk: Bulk): { radius: number; uncertainty: number } {
	seriesOf(bulk);
	if (seriesOf(bulk).mixedPowers) {
		const at = (n: number) => bulk.scale! * radiusFromGrowth(seriesPowers(bulk, n), seriesValues(bulk, n), bulk.d);
		const r = at(MAX_ORDER);
		return { radius: r, uncertainty: Math.abs(r - at(MAX_ORDER - 2)) + 0.01 * r };
	}
	const e = radiusEstimate(seriesValues(bulk, MAX_ORDER));
	const radius = bulk.scale! * Math.pow(e.radius, 1 / bulk.d);
	return { radius, uncertainty: Number.isFinite(radius) ? (radius * e.uncertainty) / (bulk.d * e.radius) : 0 };
}

/** The radius alone (seriesRadiusEstimate). */
export function seriesRadius(bulk: Bulk): number {
	return seriesRadiusEstimate(bulk).radius;
}

/**
 * Validity of order n: l_max is the largest l (on (0, radius]) below which the order-n series stays within
 * a relative error `tol` of the exact ΔA, |ΔA_n − ΔA| ≤ tol·|ΔA|, found by a log-spaced scan from
 * 1e−3·scale and bisection to 1e−6 relative. `radius` as in `seriesRadius`.
 */
export function validity(bulk: Bulk, n: number, tol: number): ValidityResult {
	seriesOf(bulk);
	checkOrder(n);
	if (!(tol > 0) || !(tol < 1)) throw new HoloError('tol must satisfy 0 < tol < 1', 'tol');
	const key = `${bulk.name}:${JSON.stringify(bulk.params)}:${n}:${tol}`;
	const hit = validityCache.get(key);
	if (hit) return hit;
	const { radius, uncertainty } = seriesRadiusEstimate(bulk);
	const exact = (l: number) => solveStrip(bulk.slice, l).deltaArea;
	const bad = (l: number) => {
		const e = exact(l);
		return !(Math.abs(deltaAreaSeries(bulk, l, n) - e) <= tol * Math.abs(e));
	};
	const top = Math.min(radius, 50 * bulk.scale!);
	let lo = 1e-3 * bulk.scale!;
	let result: number;
	if (n === 0 || bad(lo)) result = n === 0 ? 0 : lo;
	else {
		let hi = NaN;
		const steps = 60;
		const factor = Math.pow(top / lo, 1 / steps);
		for (let i = 1; i <= steps; i++) {
			const l = lo * factor;
			if (bad(l)) {
				hi = l;
				break;
			}
			lo = l;
		}
		if (Number.isNaN(hi)) result = top;
		else {
			while (hi / lo - 1 > 1e-6) {
				const mid = Math.sqrt(lo * hi);
				if (bad(mid)) hi = mid;
				else lo = mid;
			}
			result = lo;
		}
	}
	const out = { l_max: result, radius, radius_err: uncertainty };
	validityCache.set(key, out);
	return out;
}

/**
 * undefined when order n is reliable at l (within the relative tolerance `tol` of exact — the pad's validity
 * tolerance, 1e-3 by default, the same the plot shades with); otherwise a sentence saying why not.
 */
export function seriesWarning(bulk: Bulk, l: number, n: number, tol = 1e-3): string | undefined {
	if (n === 0 || !bulk.series) return undefined;
	const { l_max, radius, radius_err } = validity(bulk, n, tol);
	const how = bulk.series.mixedPowers ? ', estimated from the growth of the coefficients' : ', Domb–Sykes extrapolation';
	// only past the radius by more than its uncertainty: a still-converging series must not be called divergent
	if (l > radius + radius_err) {
		return `l=${fmt(l)} is beyond the series' radius of convergence (${fmt(radius)} ± ${fmt(radius_err)}${how}): an order-${n} truncation here is a number, not an approximation — use o=exact`;
	}
	if (l > radius - radius_err) {
		return `l=${fmt(l)} is at the series' radius of convergence (${fmt(radius)} ± ${fmt(radius_err)}${how}): convergence is too slow to trust an order-${n} truncation — use o=exact`;
	}
	if (l > l_max) {
		return `order ${n} is off by more than ${fmt(tol)} (relative, the pad's validity tolerance) beyond l ≈ ${fmt(l_max)} (l=${fmt(l)}): use a higher order or o=exact`;
	}
	return undefined;
}

const fmt = (x: number): string => sigFigs(x, 4);
