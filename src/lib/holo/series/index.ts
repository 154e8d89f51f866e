import { metricModelOf } from '../bulks/metric';
import { HoloError } from '../errors';
import { metricCoeffsNumeric } from '../metric/coeffs';
import { solveStrip } from '../strip';
import type { Bulk, SeriesCoeff } from '../types';
import { btzCoeff, fractionValue } from './btz';
import { chargedSeries, evalQ2 } from './charged';
import { kappaCoeffs } from './coeffs';
import { chargedLatex, coeffLatex } from './latex';
import { radiusEstimate, radiusFromGrowth } from './radius';

/** Highest order served (the double-precision coefficients stay within 1e−12 up to here). */
export const MAX_ORDER = 14;

function checkOrder(n: number): void {
	if (!Number.isInteger(n) || n < 0) throw new HoloError('order must be a non-negative integer', 'o');
	if (n > MAX_ORDER) throw new HoloError(`order must be ≤ ${MAX_ORDER}`, 'o', 'use o=exact');
}

function requireSeries(bulk: Bulk): void {
	if (!bulk.hasSeries || !bulk.scale) {
		throw new HoloError(`no closed-form series for ${bulk.name}`, 'o', 'use o=exact');
	}
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

/**
 * The charged brane mixes the powers (l/zh)^{da + 2(d−1)b} (series/charged.ts): its "order n" is every power
 * K ≤ n d, the same cut in l/zh as the other bulks. d = 2 is the BTZ brane (the charge drops out of f).
 */
function isChargedSeries(bulk: Bulk): boolean {
	return bulk.name === 'charged' && bulk.d > 2;
}

/** A custom metric's series (metric/series.ts): every power K ≤ n d of l/scale with a nonzero coefficient. */
function metricSeriesAt(bulk: Bulk, n: number): { powers: number[]; values: number[] } | undefined {
	const data = bulk.name === 'metric' ? metricModelOf(bulk) : undefined;
	return data && metricCoeffsNumeric(data.model, n, bulk.scale!);
}

/** Bulks whose powers of l/scale are not the multiples of d (charged, metric). */
function isIrregularSeries(bulk: Bulk): boolean {
	return isChargedSeries(bulk) || bulk.name === 'metric';
}

/** Exponents of l/scale of the terms of order n, ascending: k d (k = 1..n), or the charged brane's K ≤ n d. */
export function seriesPowers(bulk: Bulk, n: number): number[] {
	requireSeries(bulk);
	checkOrder(n);
	const ms = metricSeriesAt(bulk, n);
	if (ms) return ms.powers;
	if (isChargedSeries(bulk)) return chargedSeries(bulk.d, n).powers;
	return Array.from({ length: n }, (_, i) => (i + 1) * bulk.d);
}

/** The numbers a_k (k = 1..n) of this bulk (brane, boosted, wave); charged: c_K in the order of seriesPowers. */
export function seriesValues(bulk: Bulk, n: number): number[] {
	requireSeries(bulk);
	checkOrder(n);
	const { d } = bulk;
	const ms = metricSeriesAt(bulk, n);
	if (ms) return ms.values;
	if (isChargedSeries(bulk)) {
		const q2 = bulk.params.q2 as number;
		return chargedSeries(d, n).polys.map((p) => evalQ2(p, q2));
	}
	if (d === 2) {
		if (bulk.name !== 'brane' && bulk.name !== 'charged') throw new HoloError(`no series for ${bulk.name} at d = 2`, 'd');
		return Array.from({ length: n }, (_, i) => fractionValue(btzCoeff(i + 1)));
	}
	const polys = kappaCoeffs(d, n);
	const { alpha, beta } = bulk.series!;
	return polys.map((p, i) => {
		if (alpha === 0) return p[i + 1] * Math.pow(beta, i + 1);
		let s = 0;
		for (let r = p.length - 1; r >= 0; r--) s = s * beta + p[r];
		return s;
	});
}

/**
 * Closed-form coefficients with their LaTeX; ΔA = l^{2−d} Σ_i value_i (l/scale)^{power_i}: power = k d for
 * brane, boosted and wave; the charged brane's terms (k = index, power = da + 2(d−1)b ≤ n d, `poly` in q²).
 */
export function seriesCoeffs(bulk: Bulk, n: number): SeriesCoeff[] {
	const ms = metricSeriesAt(bulk, n);
	if (ms) {
		// decimals: the metric's coefficients are sums of Beta values weighted by its Taylor coefficients
		return ms.values.map((value, i) => ({
			k: i + 1,
			power: ms.powers[i],
			value,
			latex: `\\approx ${Number(value.toPrecision(12))}`,
			exact: false
		}));
	}
	if (isChargedSeries(bulk)) {
		const values = seriesValues(bulk, n);
		const { powers, polys } = chargedSeries(bulk.d, n);
		return values.map((value, i) => {
			const { latex, exact } = chargedLatex(bulk, powers[i], polys[i]);
			return { k: i + 1, power: powers[i], value, latex, exact, poly: polys[i].slice() };
		});
	}
	const values = seriesValues(bulk, n);
	const polys = bulk.d >= 3 ? kappaCoeffs(bulk.d, n) : undefined;
	return values.map((value, i) => {
		const k = i + 1;
		const latex = coeffLatex(bulk, k, value, polys?.[i]);
		const c: SeriesCoeff = { k, power: k * bulk.d, value, latex, exact: !latex.startsWith('\\approx') };
		if (bulk.name === 'boosted' && polys) c.poly = polys[i].slice();
		return c;
	});
}

/** Order-n series for ΔA at width l (order 0 is the vacuum: 0). */
export function deltaAreaSeries(bulk: Bulk, l: number, n: number): number {
	if (!(l > 0) || !Number.isFinite(l)) throw new HoloError('l must be a positive number', 'l');
	checkOrder(n);
	if (n === 0) return 0;
	const a = seriesValues(bulk, n);
	if (isIrregularSeries(bulk)) {
		const x = l / bulk.scale!;
		const K = seriesPowers(bulk, n);
		let s = 0;
		for (let i = a.length - 1; i >= 0; i--) s += a[i] * Math.pow(x, K[i]);
		return Math.pow(l, 2 - bulk.d) * s;
	}
	const tau = Math.pow(l / bulk.scale!, bulk.d);
	let s = 0;
	for (let k = n; k >= 1; k--) s = (s + a[k - 1]) * tau;
	return Math.pow(l, 2 - bulk.d) * s;
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
	requireSeries(bulk);
	if (isIrregularSeries(bulk)) {
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
	requireSeries(bulk);
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

/** undefined when order n is reliable at l (within 1% of exact); otherwise a sentence saying why not. */
export function seriesWarning(bulk: Bulk, l: number, n: number): string | undefined {
	if (n === 0 || !bulk.hasSeries) return undefined;
	const { l_max, radius, radius_err } = validity(bulk, n, 1e-2);
	const how = isIrregularSeries(bulk) ? ', estimated from the growth of the coefficients' : ', Domb–Sykes extrapolation';
	// only past the radius by more than its uncertainty: a still-converging series must not be called divergent
	if (l > radius + radius_err) {
		return `l=${fmt(l)} is beyond the series' radius of convergence (${fmt(radius)} ± ${fmt(radius_err)}${how}): an order-${n} truncation here is a number, not an approximation — use o=exact`;
	}
	if (l > radius - radius_err) {
		return `l=${fmt(l)} is at the series' radius of convergence (${fmt(radius)} ± ${fmt(radius_err)}${how}): convergence is too slow to trust an order-${n} truncation — use o=exact`;
	}
	if (l > l_max) {
		return `order ${n} is off by more than 1% beyond l ≈ ${fmt(l_max)} (l=${fmt(l)}): use a higher order or o=exact`;
	}
	return undefined;
}

function fmt(x: number): string {
	return Number(x.toPrecision(4)).toString();
}
