import { HoloError } from './errors';
import { findRootBrent } from './numeric/brent';
import { findRootNewton } from './numeric/newton';
import { gamma } from './special/gamma';
import { nodesFor, prepare, type Prepared, type StripIntegrals, type TurningPoint } from './strip-nodes';
import { integrandAt, nodeValuesFor } from './strip-integrand';
import type { Slice } from './types';

export type { StripIntegrals, TurningPoint } from './strip-nodes';

/**
 * The strip RT surface on any slice (see `Slice`): width and finite area as functions of the turning point.
 *
 * With u = z/z*, m = 2(d−1), H = h/z^m, N(u) = h(u z*) u^{−m} − h(z*) (so ρ − 1 = N/h*):
 *   l        = 2 z* √h* ∫₀¹ du / √(f N)
 *   A_fin    = 2 z*^{2−d} ( ∫₀¹ u^{1−d}(g − 1) du − 1/(d−2) ),   g = √h(uz*) / √(f (1 − (h* / h(uz*)) u^m))
 *   (d = 2:    2 ∫₀¹ u^{−1}(g − 1) du + 2 ln z*)
 * which is A − 2/((d−2)ε^{d−2}) (resp. A − 2 ln(1/ε)) with the divergence removed analytically
 * (Ryu & Takayanagi, JHEP 08 (2006) 045, for the vacuum integrals). g − 1 is formed as expm1(ln g) from
 * log1p's of the small quantities, so the subtraction loses nothing as u → 0.
 *
 * Quadrature (nodes: strip-nodes.ts; the integrand from power terms or a black box: strip-integrand.ts; the root
 * in l: numeric/newton.ts): u = 1 − s² removes the 1/√(1−u) endpoint singularity; near a horizon
 * f(u z*) ≈ f* + c s² adds a log-like peak of width a = √(f* / c), removed by s = a sinh σ (exact for that
 * model). The σ range
 * [0, asinh(1/a)] is cut into panels of length ≤ 1.4, each with n-point Gauss–Legendre; all differences
 * (u^p − 1, f(uz*) − f*, 1 − z* / zh) are formed with expm1/log1p from sparse power terms, so the result keeps
 * full relative accuracy up to the horizon. Error: the rule converges like ρ^{−2n} with ρ ≳ 2.4 for d ≤ 10
 * (nearest complex zero of N); measured ≤ 1e−13 relative against 30-digit mpmath (tests/fixtures/holo).
 */

/** Width factor W = l/z* and, with `wantArea`, the parts of the area relative to the vacuum. */
interface Parts {
	width: number;
	/** (W − W₀)/W₀, formed without cancellation. */
	wrel: number;
	/** S − S₀ where A_fin = 2 z*^{2−d} S (d = 2: A_fin = 2S + 2 ln z*). */
	dS: number;
	/** d ln l / d ln z* (with `wantSlope` on a slice with power terms; NaN otherwise). */
	slope: number;
}

/**
 * Integrals at one turning point. The integrands are written relative to the vacuum ones,
 * 1/√(fN) = (1/√N₀)(1 + expm1(−½ ln(f N/N₀))) and g = g₀ (1 + expm1(ln g/g₀)), g₀ = 1/√(1−u^m), whose
 * vacuum parts are Beta functions in closed form; so W − W₀ and S − S₀ (hence ΔA) keep full relative accuracy
 * even when ΔA/A ~ (l/zh)^d is tiny.
 */
function integrate(P: Prepared, tp: TurningPoint, wantArea: boolean, wantSlope = false): Parts {
	const d = P.d;
	const zs = tp.z;
	const I = integrandAt(P, tp);
	const { fstar, hstar, hstarM1, cslope, dhstar } = I;
	if (!(fstar > 0) || !(hstar > 0) || !Number.isFinite(fstar * hstar)) {
		throw new HoloError(`the metric is not positive at the turning point z*=${zs}`, 'zstar');
	}
	const a = cslope > fstar ? Math.sqrt(fstar / cslope) : 1;
	const X = nodesFor(P, a, hstar);
	const slope = wantSlope && I.hasSlope;
	const v = nodeValuesFor(X);
	I.fill(X, v, slope);
	const { F: Fs, Fm1: Fm1s, hm1: hm1s, dh: dhs, dN: dNs, dF: dFs, dNl: dNls } = v;
	let wd = 0;
	let ad = 0;
	let sd = 0; // ∫ ∂_{ln z*} (f N)^{−1/2} du
	for (let q = 0; q < X.n; q++) {
		const F = Fs[q];
		const Fm1 = Fm1s[q];
		const hm1 = hm1s[q];
		const dh = dhs[q];
		const dN = dNs[q];
		const N0 = X.N0[q];
		const N = N0 + dN;
		if (!(F > 0) || !(N > 0) || !(hm1 > -1) || !Number.isFinite(F * N * hm1)) {
			throw new HoloError(
				`no strip surface: f or H is not positive/decreasing below z*=${zs}`,
				'l',
				'the metric must keep f > 0 and H = h/z^{2(d−1)} decreasing on (0, z*]'
			);
		}
		const logF = Math.abs(Fm1) < 0.5 ? Math.log1p(Fm1) : Math.log(F);
		const lnNN0 = Math.log1p(dN / N0);
		const em = Math.expm1(-0.5 * (logF + lnNN0));
		wd += (X.jac[q] * em) / Math.sqrt(N0);
		if (slope) sd -= (0.5 * X.jac[q] * (1 + em) * (dFs[q] / F + dNls[q] / N)) / Math.sqrt(N0);
		if (wantArea) {
			const omum = X.omum[q];
			const lnQQ0 = Math.log1p((X.um[q] * dh) / ((1 + hm1) * omum));
			const lngg0 = 0.5 * (Math.log1p(hm1) - logF - lnQQ0);
			ad += (X.jac[q] * X.u1d[q] * Math.expm1(lngg0)) / Math.sqrt(omum);
		}
	}
	const W0 = vacuumWidthFactor(d);
	const sh = Math.sqrt(hstar);
	// W = 2√h* (W₀/2 + ΔI_w)  ⇒  (W − W₀)/W₀ = (√h* − 1) + 2√h* ΔI_w / W₀
	const wrel = Math.expm1(0.5 * Math.log1p(hstarM1)) + (2 * sh * wd) / W0;
	// l = 2 z* √h* I, I = W₀/2 + wd  ⇒  d ln l/d ln z* = 1 + ½ h*'/h* + I'/I
	const dlnl = slope ? 1 + (0.5 * dhstar) / hstar + sd / (0.5 * W0 + wd) : NaN;
	return { width: zs * W0 * (1 + wrel), wrel, dS: ad, slope: dlnl };
}

/** S₀ = Ŝ for the vacuum: −√π Γ(d/m)/Γ(1/m)/(d−2), d = 2: ln 2 − (the ln z* is kept apart). */
function vacuumS(d: number): number {
	if (d === 2) return Math.LN2;
	return -vacuumWidthFactor(d) / (2 * (d - 2));
}

function finiteArea(d: number, zs: number, dS: number): number {
	const S = vacuumS(d) + dS;
	return d === 2 ? 2 * S + 2 * Math.log(zs) : 2 * Math.pow(zs, 2 - d) * S;
}

/**
 * ΔA at width l from the parts, without subtracting two large numbers:
 *   d > 2: ΔA = 2 l^{2−d} W₀^{d−2} [ S₀ expm1((d−2) ln(1 + wrel)) + (1 + wrel)^{d−2} ΔS ]
 *   d = 2: ΔA = 2 ΔS − 2 ln(1 + wrel)
 */
export function deltaFromParts(d: number, l: number, wrel: number, dS: number): number {
	if (d === 2) return 2 * dS - 2 * Math.log1p(wrel);
	const W0 = vacuumWidthFactor(d);
	const lw = Math.log1p(wrel);
	return 2 * Math.pow(l / W0, 2 - d) * (vacuumS(d) * Math.expm1((d - 2) * lw) + Math.exp((d - 2) * lw) * dS);
}

/** Turning point from the root-finder's variable x (logit of z* / bound, or ln z*). */
function pointOf(P: Prepared, x: number): TurningPoint {
	if (Number.isFinite(P.bound)) {
		const eta = 1 / (1 + Math.exp(x));
		const zeta = 1 / (1 + Math.exp(-x));
		return { z: P.bound * zeta, eta };
	}
	return { z: Math.exp(x), eta: NaN };
}

/** Turning point from a user-given z*: validated against the slice's bound. */
export function turningPoint(slice: Slice, zstar: number): TurningPoint {
	const P = prepare(slice);
	if (!(zstar > 0) || !Number.isFinite(zstar)) throw new HoloError('zstar must be a positive number', 'zstar');
	if (zstar >= P.bound) {
		throw new HoloError(`zstar must be below ${P.bound}`, 'zstar', 'the turning point lies outside the horizon/cap');
	}
	return { z: zstar, eta: Number.isFinite(P.bound) ? 1 - zstar / P.bound : NaN };
}

const widthFactors = new Map<number, number>();

/** Vacuum width per unit z*: l = W₀ z*, W₀ = 2√π Γ(d/(2(d−1)))/Γ(1/(2(d−1))) (Ryu & Takayanagi 2006). */
export function vacuumWidthFactor(d: number): number {
	// asked twice per strip solve: two Γ evaluations were ~8 % of an exact sweep point, so they are kept per d
	let c = widthFactors.get(d);
	if (c === undefined) {
		const m = 2 * (d - 1);
		c = (2 * Math.sqrt(Math.PI) * gamma(d / m)) / gamma(1 / m);
		widthFactors.set(d, c);
	}
	return c;
}

/** Width and finite area of the strip on `slice` whose turning point is `tp` (one pass of the quadrature). */
export function integrateStrip(slice: Slice, tp: TurningPoint): StripIntegrals & { deltaArea: number } {
	const P = prepare(slice);
	const r = integrate(P, tp, true);
	return {
		zstar: tp.z,
		width: r.width,
		areaFinite: finiteArea(P.d, tp.z, r.dS),
		deltaArea: deltaFromParts(P.d, r.width, r.wrel, r.dS)
	};
}

/**
 * Width l(z*) and d ln l/d ln z* from one pass (slices with power terms; the slope is NaN for black-box
 * slices). The slope integrand is ∂_{ln z*}(f N)^{−1/2}; near a horizon it peaks like f^{−3/2}, which the
 * sinh substitution of the width maps to a smooth bump, so it converges with the same nodes.
 */
export function widthSlope(slice: Slice, tp: TurningPoint): { width: number; slope: number } {
	const r = integrate(prepare(slice), tp, false, true);
	return { width: r.width, slope: r.slope };
}

/** Width l(z*) only. */
export function widthAt(slice: Slice, tp: TurningPoint): number {
	return integrate(prepare(slice), tp, false).width;
}

/**
 * Solves l(z*) = l in x = logit(z* / bound) (or ln z*), where ln l(x) is close to linear at both ends
 * (l ∝ z* for small z*, l ∝ −ln(1 − z* / zh) near a horizon), starting from the vacuum guess z* = l/W₀.
 * Slices with power terms: Newton's method on g(x) = ln l(x) − ln l (or l(x)/l − 1 for x > 0, near a horizon,
 * where l is nearly linear in x) with g' from d ln l/d ln z* and d(ln z*)/dx
 * from the same quadrature pass (`integrate` with the slope; d(ln z*)/dx = η, or 1 unbounded), safeguarded
 * by the bracket it builds (bisection when a step leaves it or the slope is not positive); it stops once a
 * step is below 1e−7 (relative to max(1, |x|)) — with quadratic convergence the error after it is ~1e−14,
 * and with the slope's own error ε (≲ 1e−6 even for the wave far beyond zp) ε·1e−7, so that step is applied
 * without another pass. Typically 2–4 passes instead of Brent's 8–10. Black-box slices: Brent on g, with the
 * bracket grown from the same guess. Returns the turning point with η exact, and the finite area there.
 */
export function solveStrip(slice: Slice, l: number): StripIntegrals & { point: TurningPoint; deltaArea: number } {
	if (!(l > 0) || !Number.isFinite(l)) throw new HoloError('l must be a positive number', 'l');
	const P = prepare(slice);
	const lnl = Math.log(l);
	const z0 = l / vacuumWidthFactor(P.d);
	const bounded = Number.isFinite(P.bound);
	let x0: number;
	if (bounded) {
		const zeta = Math.min(z0 / P.bound, 0.9);
		x0 = Math.log(zeta / (1 - zeta));
	} else x0 = Math.log(z0);
	const root = P.exact ? newtonRoot(P, x0, lnl, bounded) : brentRoot(P, x0, lnl, l);
	const point = pointOf(P, root);
	const r = integrate(P, point, true);
	return {
		zstar: point.z,
		width: r.width,
		areaFinite: finiteArea(P.d, point.z, r.dS),
		deltaArea: deltaFromParts(P.d, l, r.wrel, r.dS),
		point
	};
}

function unreachable(l: number): HoloError {
	return new HoloError(`no turning point found for l=${l}`, 'l', 'the width may be unreachable in this bulk');
}

/**
 * x = logit(z* / zh) = ln(z* / (η zh)) above which the turning point is out of reach: η = e^{−700} ≈ 1e−304 is the
 * last decade before η underflows (double's smallest normal is e^{−708.4} ≈ 2.2e−308). l grows like ln(1/η) there;
 * this is a brane strip of l ≈ 700, 286, 104 zh for d = 2, 4, 10, where ΔA = l/zh^{d−1} + const to every printed
 * digit.
 */
const HORIZON_X_MAX = 700;
/**
 * |x| past which there is no turning point to find: e^{±800} over/underflows a double (|ln| ≤ 709.8), so z* (or
 * η) itself is no longer representable.
 */
const X_LIMIT = 800;
/** Newton stops once a step is below this relative size (see `solveStrip`: the error after it is ~1e−14). */
const NEWTON_XTOL = 1e-7;
/** Quadrature passes before giving up (2–4 are typical). */
const NEWTON_MAX_ITER = 100;

function newtonRoot(P: Prepared, x0: number, lnl: number, bounded: boolean): number {
	const r = findRootNewton(
		(x) => {
			const tp = pointOf(P, x);
			const s = integrate(P, tp, false, true);
			// near a horizon l grows linearly in x, so Newton on l/l₀ − 1 lands in one or two steps; further out
			// ln l is the nearly linear one
			const lr = Math.exp(Math.log(s.width) - lnl);
			const lin = bounded && x > 0;
			const g = lin ? lr - 1 : Math.log(lr);
			return { g, dg: s.slope * (bounded ? tp.eta : 1) * (lin ? lr : 1) };
		},
		x0,
		{ xtol: NEWTON_XTOL, maxIter: NEWTON_MAX_ITER, ceiling: bounded ? HORIZON_X_MAX : Infinity, limit: X_LIMIT }
	);
	// the width as typed (exp of its logarithm is off in the last digits: 1e6 would read 999999.9999999995)
	const typed = Number(Math.exp(lnl).toPrecision(12));
	if (r.reason === 'ceiling') {
		throw new HoloError(
			`l=${typed} puts the turning point within e^−700 of the horizon`,
			'l',
			'that is beyond double precision; there ΔA = l/zh^{d−1} + const to all printed digits'
		);
	}
	if (r.reason) throw unreachable(typed);
	return r.x;
}

function brentRoot(P: Prepared, x0: number, lnl: number, l: number): number {
	const g = (x: number) => Math.log(integrate(P, pointOf(P, x), false).width) - lnl;
	let g0 = g(x0);
	let step = g0 < 0 ? 0.5 : -0.5;
	let x1 = x0 + step;
	let g1 = g(x1);
	let guard = 0;
	while (g0 * g1 > 0) {
		if (++guard > 60 || !Number.isFinite(g1)) throw unreachable(l);
		x0 = x1;
		g0 = g1;
		step *= 2;
		x1 = x0 + step;
		g1 = g(x1);
	}
	return findRootBrent(g, x0, x1, 4e-16, 200, g0, g1).x;
}
