import { HoloError } from '../errors';
import { areaParameterDerivative } from '../dparam';
import { solveStrip } from '../strip';
import type { Bulk, PowerTerm } from '../types';
import { readMetric, taylorOf, type MetricKey, type MetricModel } from './model';
import { evaluateQPoly, type QPoly } from './rational';
import { dualRing, type Dual } from './ring';
import { metricSeries } from './series';
import { taylorNumeric } from './taylor-numeric';

/**
 * The first law of a metric along its named parameters (`firstlaw l=0.3 o=2 along=m,q`): the multi-parameter
 * machinery of the charged and boosted branes (firstlaw.ts) for a state labelled by p₁ … p_k.
 *
 * Which quantities. ΔE = l T_tt with 16πG T_tt = f_d − d g_d (fg.ts), a function of the parameters; every
 * further listed parameter p_j (j ≥ 2) is held as a charge density, ΔX_j = l p_j/(16πG). The relation
 *   δΔS = α δΔE + Σ_{j≥2} β_j δΔX_j,   T_ent = 1/α,  μ_j = −β_j/α
 * is solved over the k directions ∂_{p_i} at fixed l (k equations, k unknowns; G cancels):
 *   4π ∂₁ΔA = α l e₁,   4π ∂_jΔA = α l e_j + β_j l  (j ≥ 2),   e_i = ∂_i(f_d − d g_d),
 * so p₁ must move the energy. T_ent is therefore δΔS/δΔE at fixed p₂ … p_k, a statement about the chosen
 * labels: it is the charged brane's T_ent when f = 1 − m z^d + q² z^{2(d−1)}, because the charged brane's
 * ρ ∝ q_c/zh^{d−1} = q (bulks/charged.ts) and the linear relation does not depend on the coordinates used on
 * parameter space (derived here; checked against the charged bulk in tests/unit/holo/metric-along.test.ts).
 * Then μ_q = μ_Q · 2(d−1)/g_d (ΔQ = l ρ̂/(16πG), ρ̂ = 2(d−1) q/g_d), only μ·ΔX being convention-free.
 *
 * ∂_iΔA at order n: the series (series.ts) run over dual numbers (ring.ts), so every c_K is differentiated
 * exactly; the Taylor coefficients' derivatives are exact (the polynomials of taylor-exact.ts differentiated)
 * when f, g, h are rational in z, otherwise five-point central differences of the Taylor-mode numbers
 * (error ~ step⁴ ≈ 1e−12 relative). Exact: the extremality integral of dparam.ts with ∂_i f, ∂_i h as power
 * terms, so it needs f and h polynomial in z (the slice's own power terms); other metrics are refused at o=exact.
 */
export interface AlongLaw {
	params: string[];
	/** T_ent = 1/α, and β_j, μ_j = −β_j/α for j ≥ 2 (index j − 1; entry 0 is 0) */
	alpha: number;
	beta: number[];
	mu: number[];
	/** 16πG ∂_i T_tt */
	e: number[];
	/** ∂_iΔA at this order (or exact) */
	dA: number[];
	/** ∂_iΔA of the reference (order n+1, or exact) and its (n+1)-th part formed directly */
	dARef: number[];
	dANext?: number[];
	dAExact?: number[];
}

/** A copy of the model whose listed parameters are shown (exact Taylor coefficients are polynomials in them). */
function modelShowing(model: MetricModel, along: string[]): MetricModel {
	const symbols = [...new Set([...model.shown, ...along])];
	return readMetric({ d: model.d, f: model.texts.f, g: model.texts.g, h: model.texts.h, values: model.values, symbols });
}

/** [value, ∂_{along}] of an exact coefficient polynomial at the model's values. */
function gradQPoly(p: QPoly, along: string[], values: Readonly<Record<string, number>>): Dual {
	const out = new Float64Array(along.length + 1);
	out[0] = evaluateQPoly(p, values);
	const idx = along.map((a) => p.vars.indexOf(a));
	for (const [k, q] of p.terms) {
		const e = k === '' ? [] : k.split(',').map(Number);
		const c = Number(q.n) / Number(q.d);
		idx.forEach((vi, i) => {
			if (vi < 0 || !e[vi]) return;
			let t = c * e[vi]!;
			e.forEach((x, j) => {
				if (x === 0) return;
				t *= Math.pow(values[p.vars[j]!]!, j === vi ? x - 1 : x);
			});
			out[i + 1] += t;
		});
	}
	return out;
}

const cache = new WeakMap<MetricModel, Map<string, Dual[]>>();

/** Taylor coefficients z^0..z^N of f, g or h with their derivatives in the listed parameters. */
export function taylorDual(model: MetricModel, key: MetricKey, N: number, along: string[]): Dual[] {
	let byKey = cache.get(model);
	if (!byKey) cache.set(model, (byKey = new Map()));
	const id = `${key}:${N}:${along.join(',')}`;
	const hit = byKey.get(id);
	if (hit) return hit;
	const shown = modelShowing(model, along);
	const t = taylorOf(shown, key, N);
	let out: Dual[];
	if (t.exact) out = t.exact.coeffs.map((p) => gradQPoly(p, along, model.values));
	else {
		const base = taylorNumeric(shown.trees[key], model.values, N);
		out = Array.from(base, (v) => {
			const x = new Float64Array(along.length + 1);
			x[0] = v;
			return x;
		});
		along.forEach((a, i) => {
			const p = model.values[a]!;
			const h = 2e-3 * Math.max(1, Math.abs(p));
			const at = (s: number) => taylorNumeric(shown.trees[key], { ...model.values, [a]: p + s * h }, N);
			const [p2, p1, m1, m2] = [at(2), at(1), at(-1), at(-2)];
			for (let k = 0; k <= N; k++) out[k]![i + 1] = (-p2[k]! + 8 * p1[k]! - 8 * m1[k]! + m2[k]!) / (12 * h);
		});
	}
	byKey.set(id, out);
	return out;
}

/** Check the along= list against the metric's numeric parameters. */
export function readAlong(model: MetricModel, along: string[]): string[] {
	const names = Object.keys(model.values).filter((k) => k !== 'd' && k !== 'zh');
	if (along.length === 0) throw new HoloError('along= needs one or more parameter names, e.g. along=m,q', 'along');
	for (const a of along) {
		if (!names.includes(a))
			throw new HoloError(
				`along: '${a}' is not a parameter of this metric`,
				'along',
				names.length ? `its parameters: ${names.join(', ')}` : 'this metric has no named parameters (write f="1-m*z^4" m=1)'
			);
	}
	if (new Set(along).size !== along.length) throw new HoloError('along: a parameter is listed twice', 'along');
	return along;
}

/** ∂_iΔA of the order-n series at l: the total and the part order n adds to order n − 1. */
function seriesGradient(model: MetricModel, along: string[], l: number, n: number): { total: number[]; last: number[] } {
	const d = model.d;
	const M = n * d;
	const R = dualRing(along.length);
	const { c } = metricSeries(R, d, taylorDual(model, 'f', M, along), taylorDual(model, 'h', M, along), M);
	const total = along.map(() => 0);
	const last = along.map(() => 0);
	c.forEach((x, i) => {
		const K = i + 1;
		const lk = Math.pow(l, K + 2 - d);
		along.forEach((_, j) => {
			total[j] += x[j + 1]! * lk;
			if (K > (n - 1) * d) last[j] += x[j + 1]! * lk;
		});
	});
	return { total, last };
}

/** ∂_iΔA exact by extremality, from ∂_i f and ∂_i h as power terms in units of the slice's scale. */
function exactGradient(bulk: Bulk, model: MetricModel, along: string[], l: number): number[] {
	const { slice } = bulk;
	if (!slice.fTerms || !slice.hTerms)
		throw new HoloError('o=exact along=… needs f and h polynomial in z (at these numbers)', 'o', 'use a series order, o=1…12');
	const scale = slice.scale ?? 1;
	const deg = (t: PowerTerm[]) => t.reduce((m, x) => Math.max(m, x.p), 0);
	const N = Math.max(deg(slice.fTerms), deg(slice.hTerms), 1);
	const df = taylorDual(model, 'f', N, along);
	const dh = taylorDual(model, 'h', N, along);
	const sol = solveStrip(slice, l);
	return along.map((_, i) => {
		const terms = (c: Dual[]) => c.map((x, k) => ({ c: x[i + 1]! * Math.pow(scale, k), p: k })).filter((t) => t.p > 0 && t.c !== 0);
		return areaParameterDerivative(slice, sol.point, terms(df), terms(dh));
	});
}

/** α, β_j of the relation (module comment) from ∂_iΔA and e_i. */
function solve(dA: number[], e: number[], l: number): { alpha: number; beta: number[] } {
	const alpha = (4 * Math.PI * dA[0]!) / (l * e[0]!);
	const beta = dA.map((a, j) => (j === 0 ? 0 : (4 * Math.PI * a - alpha * l * e[j]!) / l));
	return { alpha, beta };
}

export function metricAlongLaw(bulk: Bulk, model: MetricModel, alongIn: string[], l: number, order: number | 'exact', top = 12): AlongLaw {
	const along = readAlong(model, alongIn);
	const d = model.d;
	const fd = taylorDual(model, 'f', d, along)[d]!;
	const gd = taylorDual(model, 'g', d, along)[d]!;
	const e = along.map((_, i) => fd[i + 1]! - d * gd[i + 1]!);
	if (e[0] === 0)
		throw new HoloError(
			`along: ${along[0]} does not move the energy (∂T_tt/∂${along[0]} = 0), so it cannot carry T_ent`,
			'along',
			'list first a parameter that changes T_tt (the z^d coefficients of f and g)'
		);
	let dA: number[];
	let dARef: number[];
	let dANext: number[] | undefined;
	let dAExact: number[] | undefined;
	if (order === 'exact') {
		dA = dARef = dAExact = exactGradient(bulk, model, along, l);
	} else {
		dA = seriesGradient(model, along, l, order).total;
		if (order < top) {
			const next = seriesGradient(model, along, l, order + 1);
			dARef = next.total;
			dANext = next.last;
		} else dARef = dA;
		if (bulk.slice.fTerms && bulk.slice.hTerms) dAExact = exactGradient(bulk, model, along, l);
	}
	const { alpha, beta } = solve(dA, e, l);
	return { params: along, alpha, beta, mu: beta.map((b) => (b === 0 ? 0 : -b / alpha)), e, dA, dARef, dANext, dAExact };
}
