/**
 * Padé resummation of the small-width series (PHYSICS.md, "Perturbative series").
 *
 * ΔA: with τ = (l/scale)^d, ΔA = l^{2−d} τ g(τ), g(τ) = Σ_{i=0}^{n−1} a_{i+1} τ^i (core's closed-form a_k).
 * The approximant is l^{2−d} τ [L/M]_g(τ) with L + M = n − 1, diagonal (L = M) or one off it (L = M + 1),
 * stepping to neighbouring entries when the table is degenerate. T_ent: the same for the series
 * T_ent = (1/l) Σ t_i x^i of firstlaw.ts (the reciprocal of α's series).
 *
 * Why: the coefficients alternate for the brane, so the nearest singularity of ΔA(τ) lies on the negative τ
 * axis and bounds the plain series' convergence on the positive axis too; a rational approximant can
 * continue past it (Baker & Graves-Morris, "Padé Approximants", 2nd ed., 1996). Nothing guarantees
 * convergence: a pole of the approximant on (0, τ] makes its value meaningless there, and `warning` says so.
 * The exact value is returned beside the resummed one so the user sees the actual error.
 */
import { HoloError } from './errors';
import { deltaArea } from './area';
import { seriesCoeffs } from './series/index';
import { padeApproximant, evalPade, nearestPole, evalPoly, type PadeApproximant } from './numeric/pade';
import { firstLawSeries, firstLawCoefficients } from './firstlaw';
import type { Bulk } from './types';

export interface ResumResult {
	order: number;
	/** Padé-resummed value */
	value: number;
	/** plain order-n truncation */
	series: number;
	exact: number;
	L: number;
	M: number;
	/** nearest genuine pole of the approximant, in the series variable and converted to a width */
	pole: { re: number; im: number; abs: number; l: number } | null;
	warning?: string;
}

/** Best diagonal or near-diagonal [L/M] with L + M = n − 1 (falls back along the antidiagonal). */
export function choosePade(c: number[]): PadeApproximant {
	const N = c.length - 1;
	const M0 = Math.floor(N / 2);
	for (const M of [M0, M0 - 1, M0 + 1, M0 - 2, M0 + 2]) {
		if (M < 0 || M > N) continue;
		const p = padeApproximant(c, N - M, M);
		if (p) return p;
	}
	return padeApproximant(c, N, 0) as PadeApproximant;
}

function poleInfo(p: PadeApproximant, scale: number, d: number, x: number): { pole: ResumResult['pole']; warning?: string } {
	const np = nearestPole(p);
	const bad = p.poles.find((q) => !q.spurious && q.im === 0 && q.re > 0 && q.re <= x);
	const pole = np ? { re: np.re, im: np.im, abs: np.abs, l: scale * Math.pow(np.abs, 1 / d) } : null;
	const warning = bad ? `the [${p.L}/${p.M}] approximant has a pole at l ≈ ${(scale * Math.pow(bad.re, 1 / d)).toPrecision(4)}, inside (0, l]: its value here is meaningless` : undefined;
	return { pole, warning };
}

function checkN(n: number): void {
	if (!Number.isInteger(n) || n < 2 || n > 14) throw new HoloError('resummation needs an order 2…14', 'o', 'a Padé approximant needs at least two coefficients');
}

/** The charged series mixes powers (l/zh)^{da + 2(d−1)b}: a Padé approximant in τ = (l/zh)^d does not apply. */
function rejectCharged(bulk: Bulk): void {
	if (bulk.name === 'charged' && bulk.d > 2) {
		throw new HoloError('no resummation for charged: its series mixes (l/zh)^d and (l/zh)^{2(d−1)}', 'bulk', 'use o=exact');
	}
}

/** Padé-resummed ΔA at width l from the order-n series, with the exact ΔA beside it. */
export function resum(bulk: Bulk, l: number, n: number): ResumResult {
	checkN(n);
	if (!bulk.hasSeries || !bulk.scale) throw new HoloError(`no closed-form series for ${bulk.name}`, 'bulk', 'use o=exact');
	rejectCharged(bulk);
	if (!(l > 0) || !Number.isFinite(l)) throw new HoloError('l must be a positive number', 'l');
	const d = bulk.d;
	const a = seriesCoeffs(bulk, n).map((t) => t.value);
	const tau = Math.pow(l / bulk.scale, d);
	const pre = Math.pow(l, 2 - d) * tau;
	const p = choosePade(a);
	const { pole, warning } = poleInfo(p, bulk.scale, d, tau);
	return { order: n, value: pre * evalPade(p, tau), series: pre * evalPoly(a, tau), exact: deltaArea(bulk, l), L: p.L, M: p.M, pole, warning };
}

/** Padé-resummed T_ent from its order-n series (firstlaw.ts), with the exact T_ent beside it. */
export function resumTent(bulk: Bulk, l: number, n: number): ResumResult {
	checkN(n);
	rejectCharged(bulk);
	const s = firstLawSeries(bulk, l, n);
	const p = choosePade(s.tent);
	const scale = Math.pow(Math.pow(l, bulk.d) / s.x, 1 / bulk.d);
	const { pole, warning } = poleInfo(p, scale, bulk.d, s.x);
	return {
		order: n,
		value: evalPade(p, s.x) / l,
		series: 1 / firstLawCoefficients(bulk, l, n).alpha,
		exact: firstLawCoefficients(bulk, l, 'exact').tent,
		L: p.L,
		M: p.M,
		pole,
		warning
	};
}
