/**
 * AdS soliton (Horowitz & Myers, Phys. Rev. D 59 (1998) 026005), the double Wick rotation of the brane:
 *   ds² = (1/z²)[ −dt² + f dθ² + dz²/f + dx₁² + … + dx_{d−2}² ],  f = 1 − (z/z0)^d,  θ ~ θ + 4π z0/d,
 * capping off smoothly at z = z0. Stress (from the brane's by t ↔ iθ; from memory, checked tracelessly):
 * T_tt = −1/(16πG z0^d), T_θθ = −(d−1)/(16πG z0^d), T_xx = +1/(16πG z0^d) — negative Casimir energy.
 *
 * Strip orthogonal to the circle: width l along the non-compact x₁, wrapping θ and x₂…x_{d−2}; areas per
 * unit θ-length and transverse volume. The functional is √(f/z^{2(d−1)}) √(x'² + 1/f): core's `Slice` with
 * h = f (the √g_θθ factor), so core's strip integrals (integrateStrip) evaluate width and finite area at a
 * turning point; f's simple zero at the cap is passed as the slice's `zh` so that 1 − z* / z0 is kept exact.
 * Two candidate surfaces (Nishioka & Takayanagi, JHEP 01 (2007) 090; Klebanov, Kutasov & Murugan, Nucl.
 * Phys. B 796 (2008) 274 — from memory):
 *   connected:     turning point z* < z0, l(z*) rises from 0, peaks at l_max and falls back to 0 as z* → z0;
 *   disconnected:  two straight sheets x = ±l/2 ending at the cap, A_fin = −2/((d−2) z0^{d−2}) exactly.
 * The RT area is the minimum; the critical width l_c is where the connected branch of smaller z* has the
 * disconnected area (Brent on z* in (0, z*_max)); above l_c the entanglement no longer depends on l.
 * z*_max comes from a golden-section search on l(z*) in logit(z* / z0). Accuracy: that of core's strip
 * integrals (≤ 1e-12 relative) for the widths and areas; l_c to ~1e-12 relative (tests: independent
 * mpmath evaluation of both branches, tests/fixtures/holo/analysis/soliton.py).
 */
import { HoloError } from '../errors';
import { findRootBrent } from '../numeric/brent';
import { integrateStrip, widthAt } from '../strip';
import type { Bulk, Slice, Stress } from '../types';

export interface SolitonParams {
	d: number;
	z0: number;
}

function readParams(params: Record<string, number | string>): SolitonParams {
	for (const k of Object.keys(params))
		if (k !== 'd' && k !== 'z0') throw new HoloError(`soliton has no key '${k}'`, k, 'soliton keys: d, z0');
	const d = params.d === undefined ? 4 : Number(params.d);
	const z0 = params.z0 === undefined ? 1 : Number(params.z0);
	if (!Number.isInteger(d) || d < 3 || d > 10) throw new HoloError('soliton needs an integer d with 3 ≤ d ≤ 10', 'd');
	if (!(z0 > 0) || !Number.isFinite(z0)) throw new HoloError('z0 must be a positive number', 'z0');
	return { d, z0 };
}

function sliceOf({ d, z0 }: SolitonParams): Slice {
	const terms = [
		{ c: 1, p: 0 },
		{ c: -1, p: d }
	];
	return { d, f: (z) => 1 - Math.pow(z / z0, d), h: (z) => 1 - Math.pow(z / z0, d), scale: z0, zh: z0, fTerms: terms, hTerms: terms };
}

/** The soliton as a Bulk (strip quantities of core then give the connected branch only; use solitonArea). */
export function makeSolitonBulk(params: Record<string, number | string>): Bulk {
	const P = readParams(params);
	const { d, z0 } = P;
	const c = (G: number) => 1 / (16 * Math.PI * G * Math.pow(z0, d));
	return {
		name: 'soliton',
		d,
		params: { d, z0, period: (4 * Math.PI * z0) / d },
		scale: z0,
		slice: sliceOf(P),
		// y is the circle θ here
		stress: (G): Stress => ({ tt: -c(G), ty: 0, xx: c(G), yy: -(d - 1) * c(G) }),
		thermo: (G) => ({ T: 0, s: 0, e: -c(G), p: c(G), py: -(d - 1) * c(G) })
	};
}

const point = (z0: number, x: number) => ({ z: z0 / (1 + Math.exp(-x)), eta: 1 / (1 + Math.exp(x)) });

/** Width l(z*) of the connected surface. */
export function solitonWidth(P: SolitonParams, zstar: number): number {
	if (!(zstar > 0 && zstar < P.z0)) throw new HoloError('zstar must lie in (0, z0)', 'zstar');
	return widthAt(sliceOf(P), { z: zstar, eta: 1 - zstar / P.z0 });
}

/** Finite area of the connected surface with turning point z*. */
export function solitonConnectedArea(P: SolitonParams, zstar: number): number {
	return integrateStrip(sliceOf(P), { z: zstar, eta: 1 - zstar / P.z0 }).areaFinite;
}

/** Finite area of the two sheets ending at the cap: −2/((d−2) z0^{d−2}). */
export function solitonDisconnectedArea(P: SolitonParams): number {
	return -2 / ((P.d - 2) * Math.pow(P.z0, P.d - 2));
}

const maxCache = new Map<string, { lmax: number; zstar: number }>();

/** Largest width of a connected surface and its turning point (golden section in logit(z* / z0)); cached. */
export function solitonMaxWidth(P: SolitonParams): { lmax: number; zstar: number } {
	const key = `${P.d}:${P.z0}`;
	const hit = maxCache.get(key);
	if (hit) return hit;
	const slice = sliceOf(P);
	const lw = (x: number) => widthAt(slice, point(P.z0, x));
	const g = (Math.sqrt(5) - 1) / 2;
	let a = -6;
	let b = 12;
	let c = b - g * (b - a);
	let e = a + g * (b - a);
	let fc = lw(c);
	let fe = lw(e);
	for (let i = 0; i < 200 && b - a > 1e-12; i++) {
		if (fc > fe) {
			b = e;
			e = c;
			fe = fc;
			c = b - g * (b - a);
			fc = lw(c);
		} else {
			a = c;
			c = e;
			fc = fe;
			e = a + g * (b - a);
			fe = lw(e);
		}
	}
	const x = (a + b) / 2;
	const out = { lmax: lw(x), zstar: point(P.z0, x).z };
	if (maxCache.size > 64) maxCache.clear();
	maxCache.set(key, out);
	return out;
}

/** Turning point of the connected surface on the branch of smaller z* (the one that can dominate). */
export function solitonZstar(P: SolitonParams, l: number): number {
	const { lmax, zstar } = solitonMaxWidth(P);
	if (!(l > 0)) throw new HoloError('l must be > 0', 'l');
	if (l > lmax)
		throw new HoloError(`no connected surface for l > l_max = ${lmax}`, 'l', 'the disconnected surface is the RT surface there');
	const slice = sliceOf(P);
	const xmax = Math.log(zstar / (P.z0 - zstar));
	const g = (x: number) => widthAt(slice, point(P.z0, x)) - l;
	let lo = xmax - 1;
	while (g(lo) > 0) lo -= 2;
	return point(P.z0, findRootBrent(g, lo, xmax, 1e-14).x).z;
}

export interface SolitonArea {
	areaFinite: number;
	phase: 'connected' | 'disconnected';
	connected?: number;
	disconnected: number;
}

/** RT finite area of the strip: min(connected, disconnected). */
export function solitonArea(P: SolitonParams, l: number): SolitonArea {
	const dis = solitonDisconnectedArea(P);
	const { lmax } = solitonMaxWidth(P);
	if (l > lmax) return { areaFinite: dis, phase: 'disconnected', disconnected: dis };
	const con = solitonConnectedArea(P, solitonZstar(P, l));
	return con < dis
		? { areaFinite: con, phase: 'connected', connected: con, disconnected: dis }
		: { areaFinite: dis, phase: 'disconnected', connected: con, disconnected: dis };
}

/** Critical width where the connected and disconnected surfaces have equal area. */
export function solitonCriticalWidth(P: SolitonParams): { lc: number; zstar: number; lmax: number } {
	const { lmax, zstar } = solitonMaxWidth(P);
	const dis = solitonDisconnectedArea(P);
	const slice = sliceOf(P);
	const xmax = Math.log(zstar / (P.z0 - zstar));
	const g = (x: number) => integrateStrip(slice, point(P.z0, x)).areaFinite - dis;
	if (!(g(xmax) > 0)) throw new HoloError('no phase transition found below l_max', 'l');
	let lo = xmax - 1;
	while (g(lo) > 0) lo -= 2;
	const x = findRootBrent(g, lo, xmax, 1e-14).x;
	const tp = point(P.z0, x);
	return { lc: widthAt(slice, tp), zstar: tp.z, lmax };
}

export { readParams as readSolitonParams };

export type SolitonPhase = 'connected' | 'disconnected';
/** Which surface an answer is about: the RT (minimal) one by default, or either candidate by name. */
export type SolitonPhaseChoice = SolitonPhase | 'rt';

export interface SolitonPhases {
	/** critical width: the connected and disconnected areas are equal there */
	lc: number;
	/** the largest width of a connected surface */
	lmax: number;
	/** turning point of the connected surface at l_c */
	zstarC: number;
	/** turning point at l_max */
	zstarMax: number;
	/**
	 * ∂A_fin/∂l just above l_c minus just below: 0 (disconnected: A does not depend on l) minus the connected
	 * surface's √f(z*)/z*^{d−1} at l_c — by Hamilton–Jacobi, ∂A/∂l is the conserved momentum √(H(z*)),
	 * H = h z^{−2(d−1)} with h = f here (derived; checked against finite differences in the tests).
	 */
	jump: number;
}

/** l_c, l_max and the jump of ∂A/∂l at l_c: the first-order transition of the strip's entanglement. */
export function solitonPhases(P: SolitonParams): SolitonPhases {
	const { lc, zstar, lmax } = solitonCriticalWidth(P);
	const f = 1 - Math.pow(zstar / P.z0, P.d);
	return { lc, lmax, zstarC: zstar, zstarMax: solitonMaxWidth(P).zstar, jump: -Math.sqrt(f) / Math.pow(zstar, P.d - 1) };
}

export interface SolitonSurface {
	phase: SolitonPhase;
	/** true when this is the RT (minimal) surface at this l */
	minimal: boolean;
	areaFinite: number;
	/** deepest point: the connected surface's turning point, or the cap z0 that the two sheets reach */
	zstar: number;
}

/**
 * The strip's surface in the phase asked for (`rt` = the minimal one). The connected one exists only up to
 * l_max (on its branch of smaller z*, the one that can dominate); asking for it beyond is an error naming l_max.
 */
export function solitonSurface(P: SolitonParams, l: number, choice: SolitonPhaseChoice = 'rt'): SolitonSurface {
	if (!(l > 0) || !Number.isFinite(l)) throw new HoloError('l must be a positive number', 'l');
	const rt = solitonArea(P, l);
	const disconnected: SolitonSurface = {
		phase: 'disconnected',
		minimal: rt.phase === 'disconnected',
		areaFinite: rt.disconnected,
		zstar: P.z0
	};
	if (choice === 'disconnected' || (choice === 'rt' && rt.phase === 'disconnected')) return disconnected;
	if (rt.connected === undefined) {
		const { lmax } = solitonMaxWidth(P);
		throw new HoloError(
			`no connected surface for l > l_max = ${Number(lmax.toPrecision(6))}`,
			'l',
			'the disconnected surface is the RT surface there: use phase=rt or phase=disconnected'
		);
	}
	return { phase: 'connected', minimal: rt.phase === 'connected', areaFinite: rt.connected, zstar: solitonZstar(P, l) };
}
