import { deltaFromParts, vacuumWidthFactor } from '../strip';
import { QUAD_TOL, integrateAdaptive } from './quad';

/**
 * One extremal surface of a strip in thin-shell AdS–Vaidya, in units zh = 1 (m = 1), labelled by its tip z* and
 * the fraction ζ = z_c/z* at which it crosses the shell (PHYSICS.md, "Quench"; Liu & Suh, Phys. Rev. D 89 (2014)
 * 066012; Balasubramanian et al., Phys. Rev. D 84 (2011) 026010).
 *
 * With u = z/z*, n = 2(d−1), μ = z*^d, R = u^{−n}:
 *  - inside the shell (ζ < u < 1) the surface is the vacuum strip surface with tip z* (E = 0);
 *  - at the shell v′ is continuous and z′_out = z′_in (1 − a), a = μζ^d/2, so outside E = f v′ + z′ = −a √(R_c − 1)
 *    (x runs from the tip to the boundary, z′_in < 0);
 *  - outside z′² = P(u) = E² + f (R − 1), f = 1 − μu^d.
 * Width, area and time are then one-dimensional integrals, written relative to the vacuum surface of the same tip
 * so the vacuum parts are closed forms and nothing large is subtracted:
 *   l/z*  = W₀ + 2 ∫₀^ζ (P^{−½} − (R−1)^{−½}) du  [+ 4 ∫_ζ^{u_t} P^{−½} du]
 *   A_fin = A_fin^vac(z*) + 2 z*^{2−d} ( ∫₀^ζ R (P^{−½} − (R−1)^{−½}) du [+ 2 ∫_ζ^{u_t} R P^{−½} du] )
 *   t/z*  = ∫₀^ζ (R−1) / (√P (√P − E)) du  [+ ∫_ζ^{u_t} 2E / (f √P) du]
 * dv/dz is written as (R − 1)/(√P(√P − E)) = (1/f)(1 + E/√P) without the 1/f, so crossing the horizon is harmless.
 * The bracketed terms exist when a > 1: the refracted z′ has the other sign, the surface climbs behind the
 * horizon to u_t (the first zero of P above ζ) and comes back; the climb and the return are summed (the time
 * integrand of the pair is 2E/(f√P), f < 0 there). Substitutions: u = 1 − e^{2w} on [0, ζ] (the (R−1)^{−½} of the
 * tip just beyond ζ, and its narrow neighbourhood when ζ → 1, become smooth in w = ln √(1−u)), and u = u_t − s²
 * on [ζ, u_t] (the 1/√P turning point). P − (R − 1) = E² − μu^d (R − 1) is formed directly, so the integrands
 * of the differences keep full relative accuracy at early times where ΔA ~ (m/2) t² is tiny.
 */
export interface Surface {
	d: number;
	/** tip z* and crossing fraction ζ (units zh = 1) */
	zstar: number;
	zeta: number;
	/** width, boundary time and ΔA (units zh = 1) */
	l: number;
	t: number;
	dA: number;
	/** conserved E outside the shell (< 0 here; the slope identity is dΔA/dt = 2|E|/z*^{d−1}) */
	E: number;
	/** refraction factor a = m z_c^d / 2 (> 1: the surface climbs behind the horizon) */
	a: number;
	/** where the refracted surface turns back towards the boundary (a > 1; z_c < z_t < z*), else the tip z* */
	zturn: number;
	/** part of the surface after the shell lies at z > zh (f < 0 there) */
	behindHorizon: boolean;
	/** parts for the cancellation-free ΔA */
	wrel: number;
	dS: number;
	/** set on a near-critical surface (climb.ts): its branch and λ = ln ε, the closeness to z_m that labels it */
	critical?: { branch: 'climb' | 'pass'; lam: number };
}

interface Setup {
	d: number;
	n: number;
	mu: number;
	lnmu: number;
	zeta: number;
	E: number;
	E2: number;
	a: number;
}

function setup(d: number, zstar: number, zeta: number): Setup {
	const n = 2 * (d - 1);
	const lnmu = d * Math.log(zstar);
	const mu = Math.exp(lnmu);
	const lnz = Math.log(zeta);
	const a = 0.5 * Math.exp(lnmu + d * lnz);
	const Rc1 = Math.expm1(-n * lnz);
	const E2 = a * a * Rc1;
	return { d, n, mu, lnmu, zeta, E: -Math.sqrt(E2), E2, a };
}

/** P(u) = E² + (1 − μu^d)(u^{−n} − 1). */
function pAt(S: Setup, u: number): number {
	const lnu = Math.log(u);
	return S.E2 + (1 - Math.exp(S.lnmu + S.d * lnu)) * Math.expm1(-S.n * lnu);
}

/**
 * g(u) − g(ut) for g = f(R − 1) = u^{−n} − 1 − μu^{d−n} + μu^d, from ln(u/ut) (exact near the turning point), as
 * c₀ expm1(−n r) − c₁ expm1((d−n) r) + c₂ expm1(d r) with the powers of ut computed once per surface (turnCoeffs).
 */
function pFromTurn(S: Setup, c: Float64Array, lnr: number): number {
	const { d, n } = S;
	return c[0] * Math.expm1(-n * lnr) - c[1] * Math.expm1((d - n) * lnr) + c[2] * Math.expm1(d * lnr);
}

function turnCoeffs(S: Setup, ut: number): Float64Array {
	const { d, n, mu } = S;
	return Float64Array.of(Math.pow(ut, -n), mu * Math.pow(ut, d - n), mu * Math.pow(ut, d));
}

/**
 * The unique minimum of g(u) = f(R − 1) on u > 0: u^{n+1} g′(u) = −n + μ(n − d) y + μ d y^{1+n/d} with y = u^d is
 * increasing in y (n ≥ d), so g′ has exactly one zero u_m, and P = E² + g decreases on (0, u_m), increases after.
 * Hence P > 0 on (0, ζ) iff P(min(ζ, u_m)) > 0, and for a > 1 the climb turns at the one zero of P in (ζ, u_m),
 * which exists iff u_m > ζ and P(u_m) < 0. As P(u_m) → 0 the surface hugs z_m = u_m z* and its width diverges.
 */
export function minimumOfP(d: number, mu: number): number {
	const n = 2 * (d - 1);
	if (d === 2) return Math.pow(mu, -0.25);
	// Newton in ln y on h(y) = −n + μ(n−d) y + μ d y^{1+n/d}: h is increasing and convex in y, so from a point
	// with h > 0 the iterates decrease monotonically onto the root
	const e = 1 + n / d;
	const A = mu * (n - d);
	const B = mu * d;
	let ly = Math.min(Math.log(n / Math.max(A, B)), -Math.log(B) / e);
	while (-n + A * Math.exp(ly) + B * Math.exp(e * ly) < 0) ly += 1;
	for (let k = 0; k < 100; k++) {
		const y = Math.exp(ly);
		const ye = Math.exp(e * ly);
		const h = -n + A * y + B * ye;
		const dh = A * y + e * B * ye; // dh/d ln y
		const step = h / dh;
		ly -= step;
		if (Math.abs(step) < 1e-15) break;
	}
	return Math.exp(ly / d);
}

/** The zero of P in (ζ, u_m) (a > 1), or NaN when P does not reach zero there (no such surface). */
function turningPoint(S: Setup, um: number): number {
	if (!(um > S.zeta) || !(pAt(S, Math.min(um, 1)) < 0)) return NaN;
	let lo = S.zeta;
	let hi = Math.min(um, 1);
	for (let k = 0; k < 200 && hi - lo > 2e-16 * hi; k++) {
		const mid = 0.5 * (lo + hi);
		if (pAt(S, mid) > 0) lo = mid;
		else hi = mid;
	}
	return lo;
}

/**
 * Whether the surface (z*, ζ) exists (P > 0 outside the shell, and a turning point for a climbing one): the same
 * tests as surfaceAt without its integrals, so the family's edge can be located to rounding for a few μs.
 */
export function surfaceExists(d: number, zstar: number, zeta: number): boolean {
	const S = setup(d, zstar, zeta);
	const um = minimumOfP(d, S.mu);
	if (!(pAt(S, Math.min(um, zeta)) > 0)) return false;
	// turningPoint finds a zero exactly when P(min(u_m, 1)) < 0 with u_m > ζ (its own precondition): that test
	// alone, without the bisection (the edge search calls this ~50 times per tip)
	return S.a > 1 ? um > S.zeta && pAt(S, Math.min(um, 1)) < 0 : true;
}

/**
 * The surface with tip z* crossing the shell at ζ z*, or null when there is none (P ≤ 0 somewhere). `quadTol` is
 * the integrals' relative tolerance: 1e−14 for answers, looser for the points of a family curve that only
 * bracket answers (curve.ts LOOSE).
 */
export function surfaceAt(d: number, zstar: number, zeta: number, quadTol = QUAD_TOL): Surface | null {
	const S = setup(d, zstar, zeta);
	const { n, E, E2 } = S;
	const um = minimumOfP(d, S.mu);
	if (!(pAt(S, Math.min(um, zeta)) > 0)) return null;
	const om = 1 - zeta;
	// the integrand of the differences at u (1 − u given apart, exact near the tip); jac = du/d(variable)
	// Only products and two square roots (the quench's hot loop): the powers of u by multiplication, and
	// R − 1 = (1 − u)·Σ_{j<n} u^j / u^n, a sum of positive terms, exact near the tip where 1 − u is small;
	// (1 + X)^{−½} − 1 = −X/(r(1 + r)), r = √(1 + X), has no cancellation at early times where X is tiny.
	const { d: dd, mu } = S;
	const ru = new Float64Array(2);
	const inner = (u: number, omu: number, jac: number, o: Float64Array): boolean => {
		rMinus1(u, omu, dd, ru);
		const R1 = ru[0];
		const X = E2 / R1 - mu * ru[1]; // (P − (R−1))/(R−1)
		if (!(X > -1)) return false;
		const r = Math.sqrt(1 + X);
		const sr = Math.sqrt(R1);
		const sq = sr * r;
		const dw = -X / (r * (1 + r) * sr);
		o[0] = jac * dw;
		o[1] = jac * (1 + R1) * dw;
		o[2] = (jac * R1) / (sq * (sq - E));
		return true;
	};
	// [0, u_s] in w = ln √(1 − u); [u_s, ζ] in σ with u = ζ − (ζ − u_s)σ², which takes the 1/√P of a surface
	// leaving the shell almost tangentially (a → 1) and keeps the tip's (R−1)^{−½}, at distance 1 − ζ, resolved
	const gap = Math.min(0.5 * zeta, 4 * om);
	const us = zeta - gap;
	const partA = new Float64Array(3);
	const partB = new Float64Array(3);
	const okA = integrateAdaptive(
		(w, o) => {
			const s2 = Math.exp(2 * w);
			// 1 − s2 is exact enough where it is ≥ ½; nearer the boundary u is formed without cancellation
			return inner(s2 <= 0.5 ? 1 - s2 : -Math.expm1(2 * w), s2, 2 * s2, o);
		},
		0.5 * Math.log1p(-us),
		0,
		3,
		partA,
		quadTol
	);
	const okB =
		okA &&
		integrateAdaptive(
			(sg, o) => {
				const q = gap * sg * sg;
				return inner(zeta - q, om + q, 2 * gap * sg, o);
			},
			0,
			1,
			3,
			partB,
			quadTol
		);
	if (!okB) return null;
	const inner3 = new Float64Array(3);
	for (let j = 0; j < 3; j++) inner3[j] = partA[j] + partB[j];
	let dw = inner3[0];
	let da = inner3[1];
	let tt = inner3[2];
	let zturn = zstar;
	let fmin = 1 - Math.exp(S.lnmu + S.d * Math.log(zeta));
	if (S.a > 1) {
		const ut = turningPoint(S, um);
		if (!Number.isFinite(ut)) return null;
		zturn = ut * zstar;
		fmin = 1 - Math.exp(S.lnmu + S.d * Math.log(ut));
		const climb = new Float64Array(3);
		const tc = turnCoeffs(S, ut);
		const ok2 = integrateAdaptive(
			(s, o) => {
				const s2 = s * s;
				const u = ut - s2;
				const lnr = Math.log1p(-s2 / ut);
				const P = E2 === 0 ? 0 : pFromTurn(S, tc, lnr);
				if (!(P > 0)) return false;
				const sq = Math.sqrt(P);
				const f = 1 - Math.exp(S.lnmu + S.d * Math.log(u));
				const jac = 2 * s;
				o[0] = (2 * jac) / sq;
				o[1] = (2 * jac * Math.exp(-n * Math.log(u))) / sq;
				o[2] = (jac * 2 * E) / (f * sq);
				return true;
			},
			0,
			Math.sqrt(ut - zeta),
			3,
			climb,
			quadTol
		);
		if (!ok2) return null;
		dw += climb[0];
		da += climb[1];
		tt += climb[2];
	}
	return surfaceFromParts(d, zstar, zeta, { dw, da, tt }, { E, a: S.a, zturn, behindHorizon: fmin < 0 });
}

/**
 * R − 1 = u^{−n} − 1 as (1 − u)·Σ_{j<n} u^j / u^n (n = 2d − 2), a sum of positive terms, exact near u = 1 when
 * 1 − u is given exactly (`omu`), with products only; out[0] = R − 1, out[1] = u^d. The integrands of this file
 * and of climb.ts call it at every node.
 */
export function rMinus1(u: number, omu: number, d: number, out: Float64Array): void {
	const n = 2 * d - 2;
	let sum = 0;
	let un = 1;
	let ud = 1;
	for (let j = 0; j < n; j++) {
		sum += un;
		un *= u;
		if (j === d - 1) ud = un;
	}
	out[0] = (omu * sum) / un;
	out[1] = ud;
}

/**
 * A Surface from the integrals relative to the vacuum surface of the same tip (dw: width, da: area, tt: time, in
 * units of the tip) — the one assembly for the (z*, ζ) family here and the critical surfaces of climb.ts. Null
 * when the width is not a positive finite number (the integrals failed).
 */
export function surfaceFromParts(
	d: number,
	zstar: number,
	zeta: number,
	parts: { dw: number; da: number; tt: number },
	rest: Pick<Surface, 'E' | 'a' | 'zturn' | 'behindHorizon' | 'critical'>
): Surface | null {
	const W0 = vacuumWidthFactor(d);
	const wrel = (2 * parts.dw) / W0;
	const l = zstar * W0 * (1 + wrel);
	if (!(l > 0) || !Number.isFinite(l)) return null;
	return { d, zstar, zeta, l, t: zstar * parts.tt, dA: deltaFromParts(d, l, wrel, parts.da), ...rest, wrel, dS: parts.da };
}
