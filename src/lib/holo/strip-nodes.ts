/**
 * What the strip quadrature precomputes: a slice's power terms split into typed arrays (`prepare`, once per
 * slice), and the Gauss–Legendre nodes in u with every factor that depends only on u (`nodesFor`, cached per
 * peak width). See strip.ts for the integrals and the substitutions.
 */
import { gaussLegendre } from './numeric/gauss';
import type { NodeValues, StripIntegrand } from './strip-integrand';
import type { PowerTerm, Slice } from './types';

/** Turning point: z* and, when the slice is bounded (horizon or cap), η = 1 − z* / bound kept exact. */
export interface TurningPoint {
	z: number;
	eta: number;
}

export interface StripIntegrals {
	zstar: number;
	width: number;
	areaFinite: number;
}

export interface Prepared {
	d: number;
	m: number;
	scale: number;
	bound: number; // zh, zmax or Infinity
	horizon: boolean;
	exact: boolean; // power terms available
	fp: Float64Array; // powers of the non-constant f terms
	fc: Float64Array;
	hp: Float64Array;
	hc: Float64Array;
	slice: Slice;
	/** the slice's integrand, moved from turning point to turning point (see strip-integrand.ts) */
	integrand?: StripIntegrand;
}

const prepared = new WeakMap<Slice, Prepared>();

function split(terms: PowerTerm[] | undefined): [Float64Array, Float64Array] {
	const t = (terms ?? []).filter((x) => x.p !== 0 && x.c !== 0);
	return [Float64Array.from(t.map((x) => x.p)), Float64Array.from(t.map((x) => x.c))];
}

export function prepare(slice: Slice): Prepared {
	const hit = prepared.get(slice);
	if (hit) return hit;
	const exact = !!(slice.fTerms && slice.hTerms);
	const [fp, fc] = split(slice.fTerms);
	const [hp, hc] = split(slice.hTerms);
	const horizon = slice.zh !== undefined && exact && slice.scale === slice.zh;
	const p: Prepared = {
		d: slice.d,
		m: 2 * (slice.d - 1),
		scale: slice.scale ?? 1,
		bound: slice.zh ?? slice.zmax ?? Infinity,
		horizon,
		exact,
		fp,
		fc,
		hp,
		hc,
		slice
	};
	prepared.set(slice, p);
	return p;
}

/** Gauss–Legendre points per panel, and the longest panel in σ (the error bound in strip.ts is for these). */
const GL_N = 24;
const PANEL = 1.4;

/** Quadrature nodes in u with everything that depends only on u (and the slice's powers), for a given a. */
export interface Nodes {
	n: number;
	jac: Float64Array; // weight · du/dσ
	lu: Float64Array; // ln u
	u: Float64Array;
	N0: Float64Array; // u^{−m} − 1
	omum: Float64Array; // 1 − u^m
	um: Float64Array; // u^m
	u1d: Float64Array; // u^{1−d}
	fE: Float64Array[]; // per f term: u^p − 1
	fU: Float64Array[]; // per f term: u^p (not 1 + fE: that loses u^p ≪ 1 near u = 0)
	hU: Float64Array[]; // per h term: u^p
	hE: Float64Array[]; // per h term: u^p − 1
	hN: Float64Array[]; // per h term: u^{p−m} − 1
	/** the integrand's values at these nodes, filled on every pass (see strip-integrand.ts) */
	values?: NodeValues;
}

const fixedNodes = new WeakMap<Prepared, Map<number, Nodes>>();

function buildNodes(P: Prepared, a: number, extra: number): Nodes {
	const smax = Math.asinh(1 / a);
	const panels = Math.max(1, Math.ceil(smax / PANEL)) + extra;
	const hw = smax / panels / 2;
	const rule = gaussLegendre(GL_N);
	const n = panels * GL_N;
	const arr = () => new Float64Array(n);
	const X: Nodes = {
		n,
		jac: arr(),
		lu: arr(),
		u: arr(),
		N0: arr(),
		omum: arr(),
		um: arr(),
		u1d: arr(),
		fE: Array.from(P.fp, arr),
		fU: Array.from(P.fp, arr),
		hU: Array.from(P.hp, arr),
		hE: Array.from(P.hp, arr),
		hN: Array.from(P.hp, arr)
	};
	const { m, d } = P;
	let q = 0;
	for (let k = 0; k < panels; k++) {
		const mid = (2 * k + 1) * hw;
		for (let i = 0; i < GL_N; i++, q++) {
			const sig = mid + hw * rule.x[i];
			const s = a * Math.sinh(sig);
			X.jac[q] = 2 * s * a * Math.cosh(sig) * hw * rule.w[i]; // du = 2s ds, ds = a cosh σ dσ
			const lu = Math.log1p(-s * s);
			X.lu[q] = lu;
			X.u[q] = 1 - s * s;
			X.N0[q] = Math.expm1(-m * lu);
			X.omum[q] = -Math.expm1(m * lu);
			X.um[q] = Math.exp(m * lu);
			X.u1d[q] = Math.exp((1 - d) * lu);
			P.fp.forEach((p, j) => {
				X.fE[j][q] = Math.expm1(p * lu);
				X.fU[j][q] = Math.exp(p * lu);
			});
			P.hp.forEach((p, j) => {
				X.hU[j][q] = Math.exp(p * lu);
				X.hE[j][q] = Math.expm1(p * lu);
				X.hN[j][q] = Math.expm1((p - m) * lu);
			});
		}
	}
	return X;
}

/**
 * A large h* (the wave far beyond zp) moves complex zeros of N towards u ≈ (h*)^{−1/d}; extra panels keep the
 * rule converged there (about two per decade of h*).
 */
export function nodesFor(P: Prepared, a: number, hstar: number): Nodes {
	const extra = hstar > 10 ? Math.ceil(2 * Math.log10(hstar)) : 0;
	// a only has to be of the order of the peak width, so it is rounded down to a power of 2 and the node
	// sets are cached per (a, extra)
	const k = a >= 1 ? 0 : Math.min(1000, Math.ceil(-Math.log2(a)));
	const key = k * 64 + extra;
	let byKey = fixedNodes.get(P);
	if (!byKey) fixedNodes.set(P, (byKey = new Map()));
	let X = byKey.get(key);
	if (!X) {
		if (byKey.size > 400) byKey.clear();
		byKey.set(key, (X = buildNodes(P, Math.pow(2, -k), extra)));
	}
	return X;
}
