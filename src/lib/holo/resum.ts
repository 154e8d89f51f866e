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
 *
 * Reliability (every value comes with it): an error estimate from the neighbouring approximants (padeError),
 * spurious poles (Froissart doublets: a pole with a zero on it or a negligible residue, numeric/pade.ts) counted
 * and named when they lie within the range, genuine poles on (0, τ] named, and a value whose sign contradicts
 * the exact one called unphysical. Above 1% estimated error the value carries a warning; above 25% the
 * warning says it is no value.
 */
import { HoloError } from './errors';
import { deltaArea } from './area';
import { MAX_ORDER, seriesCoeffs } from './series/index';
import { padeApproximant, evalPade, nearestPole, evalPoly, type PadeApproximant } from './numeric/pade';
import { firstLawSeries, firstLawCoefficients } from './firstlaw';
import type { Bulk } from './types';

export interface ResumResult {
	order: number;
	/** Padé-resummed value */
	value: number;
	/**
	 * error estimate: the largest |[L/M] − neighbour| over the approximants [L−1/M] and [L/M−1] built from one
	 * coefficient fewer (Baker & Graves-Morris 1996, ch. 2; common practice). Infinity when no neighbour exists.
	 */
	error: number;
	/** plain order-n truncation */
	series: number;
	exact: number;
	L: number;
	M: number;
	/** nearest genuine pole of the approximant, in the series variable and converted to a width */
	pole: { re: number; im: number; abs: number; l: number } | null;
	/** pole–zero pairs (Froissart doublets) found and discarded as spurious */
	froissart: number;
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

/** Relative error above which a resummed value carries a warning; above REFUSE_REL it is called no value. */
export const RESUM_WARN_REL = 1e-2;
const REFUSE_REL = 0.25;

/**
 * The neighbours' spread as an error estimate for [L/M] of the coefficients c at x: [L−1/M] and [L/M−1] use
 * c_0…c_{n−2} only. A neighbour with a pole in (0, x] counts as disagreeing completely (Infinity).
 */
export function padeError(c: number[], p: PadeApproximant, x: number): number {
	const v = evalPade(p, x);
	let err = -Infinity;
	for (const [L, M] of [
		[p.L - 1, p.M],
		[p.L, p.M - 1]
	]) {
		if (L < 0 || M < 0 || L + M + 1 > c.length - 1) continue;
		const q = padeApproximant(c.slice(0, L + M + 1), L, M);
		if (!q) continue;
		const blocked = q.poles.some((r) => r.im === 0 && r.re > 0 && r.re <= x);
		err = Math.max(err, blocked ? Infinity : Math.abs(evalPade(q, x) - v));
	}
	return err === -Infinity ? Infinity : err;
}

interface Reliability {
	pole: ResumResult['pole'];
	froissart: number;
	warning?: string;
}

/**
 * What the approximant's poles and its neighbours say about its value at x (series variable; `scale`, `d`
 * convert it to a width): a genuine pole on (0, x], a Froissart doublet within |x| of the origin, the
 * neighbours' spread, and — for ΔA — a sign against the exact one.
 */
function reliability(
	p: PadeApproximant,
	value: number,
	error: number,
	exact: number,
	scale: number,
	d: number,
	x: number,
	what: string
): Reliability {
	const np = nearestPole(p);
	const width = (t: number) => (scale * Math.pow(t, 1 / d)).toPrecision(4);
	const pole = np ? { re: np.re, im: np.im, abs: np.abs, l: scale * Math.pow(np.abs, 1 / d) } : null;
	const froissart = p.poles.filter((q) => q.spurious).length;
	const notes: string[] = [];
	const bad = p.poles.find((q) => !q.spurious && q.im === 0 && q.re > 0 && q.re <= x);
	if (bad) notes.push(`the [${p.L}/${p.M}] approximant has a pole at l ≈ ${width(bad.re)}, inside (0, l]: its value here is meaningless`);
	const near = p.poles.find((q) => q.spurious && q.abs <= 1.5 * x);
	if (near)
		notes.push(`a spurious pole–zero pair (Froissart doublet) of [${p.L}/${p.M}] lies at |l| ≈ ${width(near.abs)}, within the range`);
	const rel = error / Math.abs(value);
	if (exact > 0 && value < 0) notes.push(`${what} = ${value.toPrecision(4)} < 0 is unphysical (the exact ${what} is positive)`);
	if (!(rel <= REFUSE_REL)) notes.push(`neighbouring approximants differ by ${fmtRel(rel)}: this is no value, use o=exact`);
	else if (!(rel <= RESUM_WARN_REL))
		notes.push(`neighbouring approximants differ by ${fmtRel(rel)} (error ≈ ±${error.toPrecision(2)}): use a higher order or o=exact`);
	return notes.length ? { pole, froissart, warning: `Padé: ${notes.join('; ')}` } : { pole, froissart };
}

const fmtRel = (r: number) =>
	Number.isFinite(r) ? `${Number((100 * r).toPrecision(2))}%` : 'an unbounded amount (a neighbour has a pole in range)';

function checkN(n: number): void {
	if (!Number.isInteger(n) || n < 2 || n > MAX_ORDER)
		throw new HoloError(`resummation needs an order 2…${MAX_ORDER}`, 'o', 'a Padé approximant needs at least two coefficients');
}

/** The charged series mixes powers (l/zh)^{da + 2(d−1)b}: a Padé approximant in τ = (l/zh)^d does not apply. */
function rejectCharged(bulk: Bulk): void {
	if (bulk.series?.mixedPowers) {
		throw new HoloError('no resummation for charged: its series mixes (l/zh)^d and (l/zh)^{2(d−1)}', 'bulk', 'use o=exact');
	}
}

/** Padé-resummed ΔA at width l from the order-n series, with its error estimate and the exact ΔA beside it. */
export function resum(bulk: Bulk, l: number, n: number): ResumResult {
	checkN(n);
	if (!bulk.series || !bulk.scale) throw new HoloError(`no closed-form series for ${bulk.name}`, 'bulk', 'use o=exact');
	rejectCharged(bulk);
	if (!(l > 0) || !Number.isFinite(l)) throw new HoloError('l must be a positive number', 'l');
	const d = bulk.d;
	const a = seriesCoeffs(bulk, n).map((t) => t.value);
	const tau = Math.pow(l / bulk.scale, d);
	const pre = Math.pow(l, 2 - d) * tau;
	const p = choosePade(a);
	const value = pre * evalPade(p, tau);
	const error = Math.abs(pre) * padeError(a, p, tau);
	const exact = deltaArea(bulk, l);
	const r = reliability(p, value, error, exact, bulk.scale, d, tau, 'ΔA');
	return { order: n, value, error, series: pre * evalPoly(a, tau), exact, L: p.L, M: p.M, ...r };
}

/** Padé-resummed T_ent from its order-n series (firstlaw.ts), with its error estimate and the exact T_ent. */
export function resumTent(bulk: Bulk, l: number, n: number): ResumResult {
	checkN(n);
	rejectCharged(bulk);
	const s = firstLawSeries(bulk, l, n);
	const p = choosePade(s.tent);
	const scale = Math.pow(Math.pow(l, bulk.d) / s.x, 1 / bulk.d);
	const value = evalPade(p, s.x) / l;
	const error = padeError(s.tent, p, s.x) / l;
	const exact = firstLawCoefficients(bulk, l, 'exact').tent;
	const r = reliability(p, value, error, exact, scale, bulk.d, s.x, 'T_ent');
	return { order: n, value, error, series: 1 / firstLawCoefficients(bulk, l, n).alpha, exact, L: p.L, M: p.M, ...r };
}
