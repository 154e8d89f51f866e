import { HoloError } from '../errors';
import { solveStrip, vacuumWidthFactor } from '../strip';
import type { Bulk } from '../types';
import { metricCoeffsNumeric } from './coeffs';
import { fgStress } from './fg';
import type { MetricModel } from './model';

/**
 * The first law of entanglement for a custom metric along its scale direction, the static brane's δzh:
 * f_λ(z) = f(λz), g_λ, h_λ alike, a one-parameter family of states of the same theory (every Taylor
 * coefficient f_k → λ^k f_k). At fixed l, δΔS = α δΔE with ΔE = l T_tt, T_ent = 1/α (PHYSICS.md; order 1:
 * Bhattacharya, Nozaki, Takayanagi & Ugajin 2013).
 *
 * Order n: ΔA⁽ⁿ⁾ = l^{2−d} Σ_{K≤nd} c_K l^K with c_K of weight K, so ∂_λΔA⁽ⁿ⁾ = l^{2−d} Σ K c_K l^K, and
 * T_tt ∝ λ^d gives ∂_λΔE = d l T_tt. Exact: ΔA has dimension length^{2−d}, so ΔA_λ(l) = λ^{d−2} ΔA(λl) and
 * ∂_λΔA = (d−2) ΔA + l ∂_lΔA, with ∂_l A_fin = √h(z*)/z*^{d−1} (Hamilton–Jacobi: the momentum conjugate to x,
 * conserved along the surface) and the vacuum's (W₀/l)^{d−1} (derived here; checked against the brane's
 * firstLaw in the tests). The variation is δλ = 1/d, the brane's δw = w (δ ln zh = −1/d), so the numbers
 * match the brane's. G cancels from α. The first law holds only for metrics that solve Einstein's equations
 * near the boundary: g's z^d term enters ΔE but not the slice, so for other metrics the residual says so.
 */
export interface MetricFirstLaw {
	alpha: number;
	/** ∂_λΔA at this order (or exact) */
	dA: number;
	/** ∂_λΔA of the reference: order n+1, or exact */
	dARef: number;
	dAExact: number;
	/** the (n+1)-th order's part of ∂_λΔA, formed directly */
	dANext?: number;
	Ttt: number;
}

function seriesSlope(model: MetricModel, l: number, n: number): { total: number; last: number } {
	const { powers, values } = metricCoeffsNumeric(model, n);
	const d = model.d;
	let total = 0;
	let last = 0;
	powers.forEach((K, i) => {
		const t = K * values[i]! * Math.pow(l, K + 2 - d);
		total += t;
		if (K > (n - 1) * d) last += t;
	});
	return { total, last };
}

/** ∂_λΔA exact: (d−2)ΔA + l ∂_lΔA. */
function exactSlope(bulk: Bulk, l: number): number {
	const d = bulk.d;
	const sol = solveStrip(bulk.slice, l);
	const dl = Math.sqrt(bulk.slice.h(sol.zstar)) / Math.pow(sol.zstar, d - 1) - Math.pow(vacuumWidthFactor(d) / l, d - 1);
	return (d - 2) * sol.deltaArea + l * dl;
}

export function metricFirstLaw(bulk: Bulk, model: MetricModel, l: number, order: number | 'exact', G = 1): MetricFirstLaw {
	if (!(l > 0) || !Number.isFinite(l)) throw new HoloError('l must be a positive number', 'l');
	if (order !== 'exact' && (!Number.isInteger(order) || order < 1 || order > 12))
		throw new HoloError('order must be an integer 1…12 or exact', 'o');
	const fg = fgStress(model);
	if (fg.kind === 'deformation') throw new HoloError(fg.message, fg.keys[0]!, 'the first law needs a normalisable state');
	const Ttt = fg.stress(G).tt;
	if (Ttt === 0) throw new HoloError('T_tt = 0 for this metric: the scale direction changes no energy, so there is no T_ent', 'f');
	const d = model.d;
	const dAExact = exactSlope(bulk, l);
	let dA = dAExact;
	let dARef = dAExact;
	let dANext: number | undefined;
	if (order !== 'exact') {
		dA = seriesSlope(model, l, order).total;
		if (order < 12) {
			const next = seriesSlope(model, l, order + 1);
			dARef = next.total;
			dANext = next.last;
		}
	}
	// δΔS = dA δλ/(4G), δΔE = d l T_tt δλ
	const alpha = dA / (4 * G) / (d * l * Ttt);
	return { alpha, dA, dARef, dAExact, dANext, Ttt };
}
