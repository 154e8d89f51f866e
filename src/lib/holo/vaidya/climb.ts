import { traceProfile, type ProfilePoint } from '../profile';
import { findRootBrent } from '../numeric/brent';
import { minimumOfP, rMinus1, surfaceFromParts, type Surface } from './family';
import { QUAD_TOL, integrateAdaptive } from './quad';

/**
 * Near-critical surfaces of the quench family (units zh = 1; notation of family.ts: u = z/z*, n = 2(d−1),
 * μ = z*^d, g(u) = f(R − 1), P = E² + g, u_m the one minimum of g). Wide strips need surfaces that hug the
 * critical surface z_m = u_m z* for a long stretch: P(u_m) → 0 and the width diverges like −C ln|P(u_m)|^{½}. In
 * (z*, ζ) that limit is the family's edge, where a double ln z* cannot get closer than rounding, which bounds the
 * reachable width. Here such a surface is labelled instead by (z*, λ) and a branch:
 *  - 'climb' (a > 1, ζ < u_t < u_m): the turning point u_t = u_m − e^λ, and E² := −g(u_t) exactly;
 *  - 'pass' (a < 1, u_m < ζ): the surface passes z_m on its way out with P(u_m) = G(u_m − e^λ), G = g − g(u_m)
 *    (the mirror of the climbing one's |P(u_m)|).
 * The crossing ζ then follows from a²(R_c − 1) = E², i.e. h(ζ) := (μ²/4) ζ² (1 − ζ^{2d−2}) = E² (a root bracketed
 * on the branch's side of a = 1: P(ζ) = (R_c − 1)(a − 1)² ≥ 0 makes h − E² change sign there). Every width is then
 * linear in λ, so λ → −∞ reaches any width, and nothing small is formed by subtraction: P near u_m is
 * P(u_m) + G(u) with G = Σ ±c_k φ(α_k ln(u/u_m)), φ(x) = eˣ − 1 − x (the linear terms cancel exactly at the
 * minimum), and near the turning point it is G(u) − G(u_t) written from ln(u/u_t) (diffFrom below). The peaks of
 * 1/√P are mapped away: u = u_m + ε sinh τ across z_m (pass), u = u_m − ε cosh τ from the turning point (climb).
 */
export type Branch = 'climb' | 'pass';

/** 1/k! for k = 2…20: the Taylor coefficients of φ(x)/x² (phiSeries). */
const [P0, P1, P2, P3, P4, P5, P6, P7, P8, P9, P10, P11, P12, P13, P14, P15, P16, P17, P18] = (() => {
	const c: number[] = [];
	let f = 1;
	for (let k = 1; k <= 20; k++) {
		f /= k;
		if (k >= 2) c.push(f);
	}
	return c;
})();

/**
 * φ(x) = eˣ − 1 − x for |x| < 1 by its Taylor series, x² Σ_{k=2}^{20} x^{k−2}/k!: the next term is below 1e−18
 * of the sum there (φ(x) ≥ 0.73 x²/2), and the alternating terms of negative x stay well conditioned. A fixed
 * degree in Estrin's form (pairs, then powers x², x⁴, x⁸, x¹⁶: five dependent steps where Horner's rule has
 * nineteen) — the critical integrands call this three times per node.
 */
function phiSeries(x: number): number {
	const x2 = x * x;
	const x4 = x2 * x2;
	const x8 = x4 * x4;
	const q0 = P0 + P1 * x + (P2 + P3 * x) * x2;
	const q1 = P4 + P5 * x + (P6 + P7 * x) * x2;
	const q2 = P8 + P9 * x + (P10 + P11 * x) * x2;
	const q3 = P12 + P13 * x + (P14 + P15 * x) * x2;
	const q4 = P16 + P17 * x + P18 * x2;
	return (q0 + q1 * x4 + (q2 + q3 * x4) * x8 + q4 * (x8 * x8)) * x2;
}

/**
 * φ(x) with eˣ already known as `ex` (a power of a ratio of u's, formed by multiplication, so the integrands need
 * no exp per term): the series for |x| < 1, where ex − 1 − x would cancel; beyond, ex − 1 − x loses at most
 * α·e/(e − 2) ≈ 4α ulps (α ≤ 10 the power's exponent, e^{±1} against φ(±1)), below the integrals' 1e−14.
 */
export function phiPow(x: number, ex: number): number {
	return Math.abs(x) < 1 ? phiSeries(x) : ex - 1 - x;
}

/** w^{−n}, w^{d−n}, w^d (n = 2d − 2, the exponents α of Critical) by multiplication, into `out`. */
function powersOf(w: number, d: number, out: Float64Array): void {
	let wd1 = 1;
	for (let k = 1; k < d; k++) wd1 *= w;
	const wmn = 1 / (wd1 * wd1);
	const wd = wd1 * w;
	out[0] = wmn;
	out[1] = wd * wmn;
	out[2] = wd;
}

/** K = g″(u_m)/2 in units of the tip: P ≈ P(u_m) + K (u − u_m)² near z_m. */
function halfCurvature(C: Critical): number {
	let K = 0;
	for (let k = 0; k < 3; k++) K += SIGN[k] * C.c[k] * C.alpha[k] * C.alpha[k];
	return K / (2 * C.um * C.um);
}

/** The integral-free part of a critical surface: everything but the integrals. */
export interface Critical {
	d: number;
	n: number;
	mu: number;
	lnmu: number;
	branch: Branch;
	lam: number;
	um: number;
	/** G(u) − G(u_m) coefficients at u_m: g − g(u_m) = Σ s_k c_k expm1(α_k r), r = ln(u/u_m) */
	c: Float64Array;
	alpha: Float64Array;
	/** P(u_m) (< 0 when climbing) */
	Pm: number;
	E2: number;
	E: number;
	zeta: number;
	a: number;
	/** turning point (climb), else NaN; ln(u_t/u_m) */
	ut: number;
	rt: number;
	/** expm1(α_k r_t) and exp(α_k r_t) of a climbing surface (diffFrom): per surface rather than per node, and
	 * only once its integrals are asked for (turnConstants), not for every trial tip of tipForCrossing */
	em1y: Float64Array | null;
	ey: Float64Array | null;
}

/** The exponents α of g's three powers per d (−n, d − n, d), shared by every Critical of that d. */
const ALPHAS: Float64Array[] = [];
function alphasOf(d: number): Float64Array {
	return (ALPHAS[d] ??= Float64Array.of(-2 * (d - 1), 2 - d, d));
}

/** Scratch for powersOf: the integrands of one surface run one at a time and none calls another. */
const PW = new Float64Array(3);

/** Sets em1y and ey of a climbing surface (diffFrom needs them). */
function turnConstants(C: Critical): void {
	if (C.ey) return;
	C.em1y = new Float64Array(3);
	C.ey = new Float64Array(3);
	for (let k = 0; k < 3; k++) {
		C.em1y[k] = Math.expm1(C.alpha[k] * C.rt);
		C.ey[k] = Math.exp(C.alpha[k] * C.rt);
	}
}

const SIGN = [1, -1, 1];
/** ln of the closeness to z_m below which a surface is taken as on it (see criticalSurface). */
const TAU_MODEL = 184;

/** G(r) = g(u) − g(u_m), r = ln(u/u_m), w = u/u_m, with the (exactly cancelling) linear terms dropped. */
function gFromMin(C: Critical, r: number, w: number): number {
	const pw = PW;
	powersOf(w, C.d, pw);
	let s = 0;
	for (let k = 0; k < 3; k++) s += SIGN[k] * C.c[k] * phiPow(C.alpha[k] * r, pw[k]);
	return s;
}

/**
 * G(u) − G(u_t) = g(u) − g(u_t) from ρ = ln(u/u_t), w = u/u_t (exact near the turning point): with φ(x + y) − φ(y) =
 * expm1(y) x + e^y φ(x), the term linear in ρ carries u_t g′(u_t) ~ e^λ as a sum of terms of that size.
 */
function diffFrom(C: Critical, rho: number, w: number): number {
	const pw = PW;
	const em1y = C.em1y!;
	const ey = C.ey!;
	powersOf(w, C.d, pw);
	let s = 0;
	for (let k = 0; k < 3; k++) {
		const x = C.alpha[k] * rho;
		s += SIGN[k] * C.c[k] * (em1y[k] * x + ey[k] * phiPow(x, pw[k]));
	}
	return s;
}

/** h(ζ) = a²(R_c − 1) = (μ²/4) ζ² (1 − ζ^{2d−2}), the E² of the surface refracted at ζ. */
function hOf(d: number, mu: number, zeta: number): number {
	return 0.25 * mu * mu * zeta * zeta * -Math.expm1((2 * d - 2) * Math.log(zeta));
}

/**
 * The integral-free data of the critical surface (z*, λ, branch), or null when there is none: the turning point
 * must lie behind the horizon (E² > 0) and the crossing must exist on the branch's side of a = 1.
 */
export function criticalAt(d: number, zstar: number, lam: number, branch: Branch, zetaGuess?: number): Critical | null {
	const n = 2 * (d - 1);
	const lnmu = d * Math.log(zstar);
	const mu = Math.exp(lnmu);
	const um = minimumOfP(d, mu);
	const eps = Math.exp(lam);
	if (!(eps < um) || !(um < 1)) return null;
	const lnum = Math.log(um);
	const c = Float64Array.of(Math.exp(-n * lnum), Math.exp(lnmu + (d - n) * lnum), Math.exp(lnmu + d * lnum));
	const alpha = alphasOf(d);
	// g(u_m) = (u_m^{−n} − 1)(1 − μ u_m^d)
	const gm = Math.expm1(-n * lnum) * -Math.expm1(lnmu + d * lnum);
	if (!(gm < 0)) return null;
	const C: Critical = {
		d,
		n,
		mu,
		lnmu,
		branch,
		lam,
		um,
		c,
		alpha,
		Pm: 0,
		E2: 0,
		E: 0,
		zeta: NaN,
		a: NaN,
		ut: NaN,
		rt: NaN,
		em1y: null,
		ey: null
	};
	const r = Math.log1p(-eps / um);
	const G = gFromMin(C, r, 1 - eps / um);
	C.Pm = branch === 'climb' ? -G : G;
	C.E2 = C.Pm - gm;
	if (!(C.E2 > 0)) return null;
	C.E = -Math.sqrt(C.E2);
	const z1 = Math.exp((Math.LN2 - lnmu) / d); // a = 1
	let lo: number;
	let hi: number;
	if (branch === 'climb') {
		C.ut = um - eps;
		C.rt = r;
		lo = z1;
		hi = C.ut;
	} else {
		lo = um;
		hi = Math.min(z1, 1);
	}
	if (!(lo < hi)) return null;
	const q = (z: number) => hOf(d, mu, z) - C.E2;
	const qlo = q(lo);
	const qhi = q(hi);
	if (qlo * qhi > 0) return null;
	C.zeta = crossing(d, mu, C.E2, lo, hi, qlo, qhi, zetaGuess) ?? findRootBrent(q, lo, hi, 1e-17, 200, qlo, qhi).x;
	C.a = 0.5 * Math.exp(lnmu + d * Math.log(C.zeta));
	if (branch === 'climb' ? !(C.a > 1) : !(C.a < 1)) return null;
	return C;
}

/**
 * The root of h(ζ) = E² in (lo, hi) by Newton's method from a guess inside (tipForCrossing asks for ζ near its
 * target), safeguarded by the bracket (a step leaving it bisects; common practice): h′ = (μ²/4)(2ζ − (n+2)ζ^{n+1}) in
 * closed form, so three or four steps where Brent's method took ~12 evaluations of h. Null without a guess or when
 * it does not settle (Brent's method then).
 */
function crossing(d: number, mu: number, E2: number, lo: number, hi: number, qlo: number, qhi: number, guess?: number): number | null {
	if (guess === undefined || !(guess > lo && guess < hi)) return null;
	const n = 2 * d - 2;
	const c = 0.25 * mu * mu;
	const rising = qlo < 0;
	let z = guess;
	for (let k = 0; k < 40; k++) {
		const q = hOf(d, mu, z) - E2;
		if (q === 0) return z;
		if (q < 0 === rising) lo = z;
		else hi = z;
		const dq = c * (2 * z - (n + 2) * Math.pow(z, n + 1));
		let zn = z - q / dq;
		if (!(zn > lo && zn < hi)) zn = 0.5 * (lo + hi);
		if (Math.abs(zn - z) <= 4e-16 * z) return zn;
		z = zn;
	}
	return null;
}

/** The critical surface (z*, λ, branch) with its width, time and ΔA, or null when there is none. */
export function criticalSurfaceAt(d: number, zstar: number, lam: number, branch: Branch): Surface | null {
	const C = criticalAt(d, zstar, lam, branch);
	return C ? criticalSurface(C, zstar) : null;
}

/** `quadTol`: the integrals' relative tolerance (family.ts surfaceAt). */
export function criticalSurface(C: Critical, zstar: number, quadTol = QUAD_TOL): Surface | null {
	if (C.branch === 'climb') turnConstants(C);
	const { d, n, E, E2, zeta, um } = C;
	const lam = C.lam;
	const eps = Math.exp(lam);
	// outside the shell on [0, ζ]: P^{−½} − (R−1)^{−½}, R(…) and dv/dz = (R−1)/(√P(√P − E)) (no 1/f)
	// r = ln(u/u_m) and w = u/u_m are given apart: across z_m of a passing surface u − u_m is far below the
	// rounding of u; 1 − u too, so R − 1 = (1 − u) Σ_{j<n} u^j / u^n is exact near the shell as in family.ts.
	// Only products, one log (r) and square roots per node: this is the wide strips' hot loop.
	const mu = C.mu;
	const ru = new Float64Array(2);
	const outer = (u: number, omu: number, r: number, w: number, jac: number, o: Float64Array): boolean => {
		rMinus1(u, omu, d, ru);
		const R1 = ru[0];
		const ud = ru[1];
		const P = C.Pm + gFromMin(C, r, w);
		if (!(P > 0) || !(R1 > 0)) return false;
		const sq = Math.sqrt(P);
		const sr = Math.sqrt(R1);
		let dw: number;
		if (P < 0.5 * R1) dw = 1 / sq - 1 / sr;
		else {
			// near the boundary P ≈ R − 1: the difference from X = (P − (R−1))/(R−1) = E²/(R−1) − μu^d, as
			// (1 + X)^{−½} − 1 = −X/(ρ(1 + ρ)), ρ = √(1 + X)
			const X = E2 / R1 - mu * ud;
			const rr = Math.sqrt(1 + X);
			dw = -X / (rr * (1 + rr) * sr);
		}
		o[0] = jac * dw;
		o[1] = jac * (1 + R1) * dw;
		o[2] = (jac * R1) / (sq * (sq - E));
		return true;
	};
	// ε sinh τ, ε cosh τ and ε(cosh τ − 1) are formed from e^{λ±τ} (or their square roots): λ may be far below
	// the doubles' exponent range (a wide strip's far members need λ ~ −10³…−10⁵) while τ runs to ~ −λ
	// |τ| < τ_s, where ε e^{|τ|} < e^{−TAU_MODEL}: the surface is within 1e−80 of z_m and the integrands equal their
	// limits there (P = K ε² cosh²τ or K ε² sinh²τ up to a relative 1e−80, K = G″(u_m)/2), so that stretch
	// is the limit times its length — the part of the width and time that grows linearly in −λ
	const tauS = Math.max(0, -TAU_MODEL - lam);
	const K = halfCurvature(C);
	const Rm = Math.exp(-n * Math.log(um));
	const fm = -Math.expm1(C.lnmu + d * Math.log(um));
	const sqK = Math.sqrt(K);
	let dw = 0;
	let da = 0;
	let tt = 0;
	const part = new Float64Array(3);
	const add = () => {
		dw += part[0];
		da += part[1];
		tt += part[2];
	};
	let zturn = zstar;
	let fmin = -Math.expm1(C.lnmu + d * Math.log(zeta));
	if (C.branch === 'pass') {
		// u = u_m + ε sinh τ: the 1/√P ≈ 1/√(K (ε² + (u − u_m)²)) peak becomes flat in τ
		const omum = 1 - um;
		const g = (tau: number, o: Float64Array) => {
			const ep = Math.exp(lam + tau);
			const em = Math.exp(lam - tau);
			const du = 0.5 * (ep - em);
			const z = du / um;
			return outer(um + du, omum - du, Math.log1p(z), 1 + z, 0.5 * (ep + em), o);
		};
		const t0 = lam - Math.log(um + Math.hypot(um, eps));
		const t1 = Math.log(zeta - um + Math.hypot(zeta - um, eps)) - lam;
		if (!(t0 < -tauS && t1 > tauS)) return null;
		if (tauS > 0) {
			if (!integrateAdaptive(g, t0, -tauS, 3, part, quadTol)) return null;
			add();
			if (!integrateAdaptive(g, tauS, t1, 3, part, quadTol)) return null;
			add();
			dw += (2 * tauS) / sqK;
			da += (2 * tauS * Rm) / sqK;
			tt += (2 * tauS * (Rm - 1)) / (sqK * -E);
		} else {
			if (!integrateAdaptive(g, t0, t1, 3, part, quadTol)) return null;
			add();
		}
	} else {
		// no peak on [0, ζ] (P ≥ P(ζ) = (R_c − 1)(a − 1)² there): w = ln √(1 − u) as in family.ts
		const ok = integrateAdaptive(
			(w, o) => {
				const s2 = Math.exp(2 * w);
				// 1 − s2 is exact enough where it is ≥ ½; nearer the boundary u is formed without cancellation
				const u = s2 <= 0.5 ? 1 - s2 : -Math.expm1(2 * w);
				return outer(u, s2, Math.log(u / um), u / um, 2 * s2, o);
			},
			0.5 * Math.log1p(-zeta),
			0,
			3,
			part,
			quadTol
		);
		if (!ok) return null;
		add();
		const ut = C.ut;
		zturn = ut * zstar;
		fmin = -Math.expm1(C.lnmu + d * Math.log(ut));
		// u = u_m − ε cosh τ from the turning point (τ = 0) back to the shell: flat across the 1/√P peak at z_m
		const A = um - zeta;
		if (!(A > eps)) return null;
		const T = Math.log(A + Math.sqrt((A - eps) * (A + eps))) - lam;
		if (!(T > tauS)) return null;
		const ok2 = integrateAdaptive(
			(tau, o) => {
				const hp = Math.exp(0.5 * (lam + tau));
				const hm = Math.exp(0.5 * (lam - tau));
				const q = hp - hm;
				const gapT = 0.5 * q * q; // u_t − u = ε(cosh τ − 1)
				const jac = 0.5 * q * (hp + hm); // ε sinh τ
				const u = ut - gapT;
				const z = gapT / ut;
				const P = diffFrom(C, Math.log1p(-z), 1 - z);
				if (!(P > 0)) return false;
				const sq = Math.sqrt(P);
				let ud1 = 1;
				for (let k = 1; k < d; k++) ud1 *= u;
				const f = 1 - mu * ud1 * u;
				o[0] = (2 * jac) / sq;
				o[1] = (2 * jac) / (ud1 * ud1 * sq); // u^{−n} = (u^{d−1})^{−2}
				o[2] = (jac * 2 * E) / (f * sq);
				return true;
			},
			tauS,
			T,
			3,
			part,
			quadTol
		);
		if (!ok2) return null;
		add();
		dw += (2 * tauS) / sqK;
		da += (2 * tauS * Rm) / sqK;
		tt += (2 * tauS * E) / (fm * sqK);
	}
	return surfaceFromParts(
		d,
		zstar,
		zeta,
		{ dw, da, tt },
		{
			E,
			a: C.a,
			zturn,
			behindHorizon: fmin < 0,
			critical: { branch: C.branch, lam: C.lam }
		}
	);
}

/**
 * The tip (x = ln z*) of the critical surface (λ, branch) that crosses the shell at ζ: a safeguarded secant in x on
 * ζ(x) − ζ from x0 (the family's edge tip at this ζ, which is the λ → −∞ limit). At fixed λ the crossing falls
 * smoothly with the tip (the map (z*, λ) → ζ has no edge; seen in every scan), so a few steps reach rounding.
 */
export function tipForCrossing(d: number, zeta: number, lam: number, branch: Branch, x0: number): { x: number; C: Critical } | null {
	const at = (x: number) => criticalAt(d, Math.exp(x), lam, branch, zeta);
	let xa = x0;
	let ca = at(xa);
	// a start where the surface exists: towards smaller tips first (the edge tip lies just inside for λ ≪ 0)
	for (let k = 0; !ca && k < 60; k++) {
		xa = x0 + (k % 2 ? 1 : -1) * 1e-3 * Math.pow(2, k >> 1);
		ca = at(xa);
	}
	if (!ca) return null;
	let lo = -Infinity; // ζ(lo) > ζ: tip too small
	let hi = Infinity;
	const side = (x: number, z: number) => {
		if (z > zeta) lo = Math.max(lo, x);
		else hi = Math.min(hi, x);
	};
	side(xa, ca.zeta);
	let xb = xa + (ca.zeta > zeta ? 1e-3 : -1e-3);
	for (let k = 0; k < 100; k++) {
		if (Math.abs(ca.zeta - zeta) <= 2e-16 * zeta) return { x: xa, C: ca };
		const cb = at(xb);
		if (!cb) {
			// no surface there: come back halfway (the existence range in x is an interval around the answer)
			xb = 0.5 * (xa + xb);
			if (Math.abs(xb - xa) < 1e-15) break;
			continue;
		}
		side(xb, cb.zeta);
		let xn = cb.zeta === ca.zeta ? NaN : xb - ((cb.zeta - zeta) * (xb - xa)) / (cb.zeta - ca.zeta);
		if (!(xn > lo && xn < hi)) xn = Number.isFinite(lo) && Number.isFinite(hi) ? 0.5 * (lo + hi) : xb + (cb.zeta > zeta ? 0.1 : -0.1);
		xa = xb;
		ca = cb;
		if (Math.abs(xn - xb) <= 1e-16 * Math.max(1, Math.abs(xb))) return { x: xb, C: cb };
		xb = xn;
	}
	return Math.abs(ca.zeta - zeta) <= 1e-12 * zeta ? { x: xa, C: ca } : null;
}

/**
 * The critical surface of width l crossing the shell at ζ (units zh = 1), for a tip solve that met the family's edge
 * x_e at this ζ (solve.ts): the branch is the edge's (climbing when a > 1 there), the tip follows λ (tipForCrossing),
 * and λ is found by a safeguarded secant on l(λ)/l − 1, which is close to linear (the width diverges like −C λ), so
 * any width is reached with the accuracy of the integrals. Null when no λ gives the width on this branch.
 */
export function criticalForWidth(
	d: number,
	l: number,
	zeta: number,
	xe: number,
	branch: Branch,
	lamGuess = -8,
	loose?: number,
	near = false
): Surface | null {
	// a loose solve (a curve's bracketing point, curve.ts) stops at |l/l₀ − 1| < loose, its integrals to the same
	const stop = loose ?? 1e-15;
	const base = loose ?? QUAD_TOL;
	// the integrals of a step need only resolve the residual the next step leaves, ~|v|² for the secant: 1e−8 of
	// the last |v| (at most 1e−6, at least the solve's own tolerance), so the first steps from a rough λ (|v| ~ 0.1)
	// cost about half a full surface; a surface is returned only when its own integrals were to `base` (below)
	const tolAfter = (v: number) => Math.max(base, Math.min(1e-6, 1e-8 * Math.abs(v)));
	let x = xe;
	let dvdl = NaN; // d(l/l_target)/dλ on z_m: −4 z*/(√K l), the first secant step's slope
	const g = (lam: number, tol: number): { v: number; s: Surface | null; tol: number; lam: number } => {
		const tip = tipForCrossing(d, zeta, lam, branch, x);
		const s = tip ? criticalSurface(tip.C, Math.exp(tip.x), tol) : null;
		if (!tip || !s) return { v: -Infinity, s: null, tol, lam }; // past the narrow end of the branch
		x = tip.x;
		dvdl = (-4 * s.zstar) / (Math.sqrt(halfCurvature(tip.C)) * l);
		return { v: s.l / l - 1, s, tol, lam };
	};
	let lwide = -Infinity; // v > 0
	let lnarrow = Infinity; // v < 0 or no surface
	let la = lamGuess;
	// `near`: the guess is a solution already (a loose point made exact), so its residual is small from the start
	let pa = g(la, near ? base : 1e-6);
	// no surface at the guess (past the branch's narrow end, where λ nears its largest value): back off by ¼, ½, 1,
	// 2, 4, … — a guess from a neighbour is usually just past that end, and a failed trial costs no integrals
	for (let k = 0, step = 0.25; !pa.s && k < 40; k++, step = Math.min(2 * step, 4)) {
		lnarrow = Math.min(lnarrow, la);
		la -= step;
		pa = g(la, 1e-6);
	}
	if (!pa.s) return null;
	let best = pa;
	let stalled = 0;
	if (pa.v > 0) lwide = la;
	else lnarrow = Math.min(lnarrow, la);
	// the first step from the width's slope on z_m (exact as λ → −∞, a fair guess elsewhere), at most 20 in λ
	let lb = la + Math.max(-20, Math.min(20, Number.isFinite(dvdl) && dvdl < 0 ? -pa.v / dvdl : pa.v > 0 ? 2 : -2));
	if (lb === la) lb = la + (pa.v > 0 ? 1e-3 : -1e-3);
	for (let k = 0; k < 100; k++) {
		if (Math.abs(pa.v) < stop) {
			if (pa.tol <= base) return pa.s;
			// converged on integrals looser than the solve's: the same λ to the full tolerance, then go on from there
			const again = g(la, base);
			if (!again.s) break;
			if (Math.abs(again.v) < stop) return again.s;
			pa = again;
			best = again;
			lb = Number.isFinite(dvdl) && dvdl < 0 ? la - pa.v / dvdl : la + (pa.v > 0 ? 1e-9 : -1e-9);
		}
		const pb = g(lb, tolAfter(pa.v));
		if (!pb.s) {
			lnarrow = Math.min(lnarrow, lb);
			lb = Number.isFinite(lwide) ? 0.5 * (lwide + lnarrow) : 0.5 * (la + lb);
			continue;
		}
		if (Math.abs(pb.v) < 0.5 * Math.abs(best.v)) stalled = 0;
		else if (++stalled > 8) break; // no λ on this branch gives the width (the residual stays put at its end)
		if (Math.abs(pb.v) < Math.abs(best.v) || best.tol > base) best = pb;
		if (pb.v > 0) lwide = Math.max(lwide, lb);
		else lnarrow = Math.min(lnarrow, lb);
		let ln = pb.v === pa.v ? NaN : lb - (pb.v * (lb - la)) / (pb.v - pa.v);
		if (!(ln > lwide && ln < lnarrow)) {
			if (Number.isFinite(lwide) && Number.isFinite(lnarrow)) ln = 0.5 * (lwide + lnarrow);
			else ln = lb + (pb.v > 0 ? 4 : -4);
		}
		if (Math.abs(ln - lb) <= 1e-15 * Math.max(1, Math.abs(lb))) break;
		la = lb;
		pa = pb;
		lb = ln;
	}
	// rounding in λ reached on integrals looser than the solve's: the best λ once more to the full tolerance
	if (best.tol > base) best = g(best.lam, base);
	return best.s && Math.abs(best.v) < Math.max(WIDTH_TOL, loose ?? 0) ? best.s : null;
}

/** A critical solve that stops short of the asked width (rounding in λ) is kept when this close (relative). */
const WIDTH_TOL = 1e-13;

/** Two neighbouring points of a family curve (curve.ts's CurvePoint, without importing it). */
interface Bracket {
	zeta: number;
	t: number;
	surface: Surface | null;
}

/**
 * The surface of width l at time t between two critical members A, B of one branch of the family curve, by Newton's
 * method in (x = ln z*, λ) on (l(x, λ)/l − 1, t(x, λ) − t) from the bracket's interpolation; null unless it converges
 * to rounding with its crossing ζ inside the bracket. In (z*, λ) the width and time are smooth (the edge of the
 * (z*, ζ) labelling is λ → −∞), so three or four steps of ~3 surfaces each replace a bracketed search in ζ whose
 * every step solves the tip (the caller's fallback).
 */
export function criticalBetween(d: number, l: number, t: number, A: Bracket, B: Bracket): Surface | null {
	const ca = A.surface?.critical;
	const cb = B.surface?.critical;
	const w = (t - A.t) / (B.t - A.t);
	if (!(w >= 0 && w <= 1)) return null;
	if (ca && cb && ca.branch === cb.branch) {
		const x = (1 - w) * Math.log(A.surface!.zstar) + w * Math.log(B.surface!.zstar);
		return newtonCritical(d, l, t, A, B, ca.branch, x, (1 - w) * ca.lam + w * cb.lam);
	}
	// a bracket across a = 1 (or with one end not critical): from each critical end on its own branch
	for (const [P, c] of [
		[A, ca],
		[B, cb]
	] as const) {
		if (!c) continue;
		const s = newtonCritical(d, l, t, A, B, c.branch, Math.log(P.surface!.zstar), c.lam);
		if (s) return s;
	}
	return null;
}

function newtonCritical(d: number, l: number, t: number, A: Bracket, B: Bracket, branch: Branch, x: number, lam: number): Surface | null {
	const zLo = Math.min(A.zeta, B.zeta);
	const zHi = Math.max(A.zeta, B.zeta);
	const F = (s: Surface): [number, number] => [s.l / l - 1, s.t - t];
	let s = criticalSurfaceAt(d, Math.exp(x), lam, branch);
	if (!s) return null;
	let [f0, f1] = F(s);
	const HX = 1e-7;
	const HL = 1e-7 * Math.max(1, Math.abs(lam));
	const tScale = Math.max(1, Math.abs(t));
	const inside = (c: Surface) => (c.zeta > zLo && c.zeta < zHi ? c : null);
	const done = () => Math.abs(f0) < NEWTON_TOL && Math.abs(f1) < NEWTON_TOL * tScale;
	// the difference Jacobian is kept while a step gains three digits (the quadratic basin: the chord step then
	// loses little), and recomputed otherwise or when a kept one fails to descend
	let j00 = 0;
	let j01 = 0;
	let j10 = 0;
	let j11 = 0;
	let keep = false;
	for (let k = 0; k < 16; k++) {
		if (Math.abs(f0) < 2e-15 && Math.abs(f1) < 2e-15 * tScale) return inside(s);
		if (!keep) {
			const sx = criticalSurfaceAt(d, Math.exp(x - HX), lam, branch);
			const sl = criticalSurfaceAt(d, Math.exp(x), lam - HL, branch);
			if (!sx || !sl) return null;
			const [gx0, gx1] = F(sx);
			const [gl0, gl1] = F(sl);
			j00 = (f0 - gx0) / HX;
			j10 = (f1 - gx1) / HX;
			j01 = (f0 - gl0) / HL;
			j11 = (f1 - gl1) / HL;
		}
		const kept = keep;
		const det = j00 * j11 - j01 * j10;
		if (!(Math.abs(det) > 0) || !Number.isFinite(det)) return null;
		const dx = -(j11 * f0 - j01 * f1) / det;
		const dl = -(-j10 * f0 + j00 * f1) / det;
		// damped: halve the step until a surface exists and |F| decreases
		const norm = Math.abs(f0) + Math.abs(f1);
		let next: Surface | null = null;
		for (let h = 0, step = 1; h < 12; h++, step *= 0.5) {
			if (step < 1e-3) break;
			const c = criticalSurfaceAt(d, Math.exp(x + step * dx), lam + step * dl, branch);
			if (!c) continue;
			const [g0, g1] = F(c);
			if (Math.abs(g0) + Math.abs(g1) < norm) {
				next = c;
				x += step * dx;
				lam += step * dl;
				f0 = g0;
				f1 = g1;
				keep = step === 1 && Math.abs(g0) + Math.abs(g1) < 1e-3 * norm;
				break;
			}
		}
		if (next) {
			s = next;
			continue;
		}
		// no descent: at the integrals' rounding (|F| ~ 1e−14 near a = 1) that is convergence; with a kept
		// Jacobian, retry with a fresh one; else a dead end
		if (done()) return inside(s);
		if (!kept) return null;
		keep = false;
	}
	return done() ? inside(s) : null;
}

/** The residual (relative width, time in zh) a Newton solve accepts once its steps stop descending. */
const NEWTON_TOL = 1e-13;

/**
 * Whether the surface (z*, ζ) is better labelled as a critical one, and on which branch: every climbing surface
 * (a > 1: its turning point approaches z_m as the width grows, and the (z*, ζ) integrals need ever narrower panels
 * there), and a passing one once P(u_m) < 10⁻³ |g(u_m)| (its peak at z_m is already narrow). Integral-free.
 */
export function criticalBranch(d: number, zstar: number, zeta: number): Branch | null {
	const lnmu = d * Math.log(zstar);
	const a = 0.5 * Math.exp(lnmu + d * Math.log(zeta));
	if (a > 1) return 'climb';
	const mu = Math.exp(lnmu);
	const um = minimumOfP(d, mu);
	if (!(um < zeta)) return null;
	const n = 2 * (d - 1);
	const lnum = Math.log(um);
	const gm = Math.expm1(-n * lnum) * -Math.expm1(lnmu + d * lnum);
	if (!(gm < 0)) return null;
	const E2 = hOf(d, mu, zeta);
	return E2 + gm < 1e-3 * -gm ? 'pass' : null;
}

/**
 * The outer part of a critical surface's profile (profile.ts draws the vacuum part inside the shell), in units of
 * z*, from `start` (the crossing: z = ζ, v = 0) to the boundary: for a climbing surface the climb to u_t and back,
 * then the descent; for a passing one the descent across z_m. Traced in the τ of criticalSurface (the peaks
 * flat), the stretch on z_m (|τ| < τ_s) with its limit rates, so a strip of any width is drawn with its own
 * width and time (x → l/2, v → t at the boundary). Null when the surface is not there.
 */
export function criticalTail(
	d: number,
	zstar: number,
	crit: { branch: Branch; lam: number },
	start: ProfilePoint,
	count: number
): ProfilePoint[] | null {
	const C = criticalAt(d, zstar, crit.lam, crit.branch);
	if (!C) return null;
	if (C.branch === 'climb') turnConstants(C);
	const { n, E, um, zeta, lam } = C;
	const eps = Math.exp(lam);
	const R1 = (u: number) => Math.expm1(-n * Math.log(u));
	const K = halfCurvature(C);
	const sqK = Math.sqrt(K);
	const R1m = R1(um);
	const tauS = Math.max(0, -TAU_MODEL - lam);
	const k = Math.max(16, Math.round(count / 3));
	const out: ProfilePoint[] = [];
	let at = start;
	const seg = (p1: number, rates: (p: number) => [number, number], zOf: (p: number) => number, m = k) => {
		if (!(p1 > 0)) return;
		const pts = traceProfile(0, p1, m, rates, zOf, at, true);
		out.push(...pts);
		at = pts[pts.length - 1];
	};
	// on z_m: P = K ε² sinh²τ (climb) or K ε² cosh²τ (pass) times (1 + O(e^{−184})), so dx/dτ = 1/√K and dv/dτ its
	// limit with √P → 0 against |E|
	const onZm = (): [number, number] => [1 / sqK, R1m / (sqK * -E)];
	const descent = (u: number, r: number, w: number, jac: number): [number, number] => {
		const sp = Math.sqrt(C.Pm + gFromMin(C, r, w));
		return [jac / sp, (jac * R1(u)) / (sp * (sp - E))];
	};
	if (C.branch === 'climb') {
		const ut = C.ut;
		const A = um - zeta;
		const T = Math.log(A + Math.sqrt((A - eps) * (A + eps))) - lam;
		const uOf = (tau: number) => ut - eCosh1Of(lam, tau);
		const rates = (tau: number, back: boolean): [number, number] => {
			const gapT = eCosh1Of(lam, tau);
			const u = ut - gapT;
			const sp = Math.sqrt(diffFrom(C, Math.log1p(-gapT / ut), 1 - gapT / ut));
			const jac = 0.5 * (Math.exp(lam + tau) - Math.exp(lam - tau));
			return [jac / sp, (jac * R1(u)) / (sp * (back ? sp - E : -E - sp))];
		};
		// in: τ from T down to τ_s, then along z_m to the turning point; back: the mirror
		seg(
			T - tauS,
			(p) => rates(T - p, false),
			(p) => uOf(T - p)
		);
		seg(tauS, onZm, () => um, 4);
		seg(tauS, onZm, () => um, 4);
		seg(
			T - tauS,
			(p) => rates(tauS + p, true),
			(p) => uOf(tauS + p)
		);
		// then from the shell to the boundary (no peak there), in u
		seg(
			zeta,
			(p) => {
				const u = zeta - p;
				return descent(u, Math.log(u / um), u / um, 1);
			},
			(p) => Math.max(0, zeta - p), // the last node can land an ulp past ζ
			Math.max(10, Math.round(count / 2))
		);
	} else {
		const t1 = Math.log(zeta - um + Math.hypot(zeta - um, eps)) - lam;
		const t0 = lam - Math.log(um + Math.hypot(um, eps));
		const uOf = (tau: number) => um + 0.5 * (Math.exp(lam + tau) - Math.exp(lam - tau));
		const rates = (tau: number): [number, number] => {
			const du = 0.5 * (Math.exp(lam + tau) - Math.exp(lam - tau));
			return descent(um + du, Math.log1p(du / um), 1 + du / um, 0.5 * (Math.exp(lam + tau) + Math.exp(lam - tau)));
		};
		// τ from t1 (the shell) down to t0 (the boundary), flat across z_m
		seg(
			t1 - tauS,
			(p) => rates(t1 - p),
			(p) => uOf(t1 - p)
		);
		seg(2 * tauS, onZm, () => um, 4);
		seg(
			-tauS - t0,
			(p) => rates(-tauS - p),
			(p) => Math.max(0, uOf(-tauS - p)),
			Math.max(10, Math.round(count / 2))
		);
	}
	return out;
}

/** ε(cosh τ − 1) from e^{(λ±τ)/2} (see criticalSurface). */
function eCosh1Of(lam: number, tau: number): number {
	const q = Math.exp(0.5 * (lam + tau)) - Math.exp(0.5 * (lam - tau));
	return 0.5 * q * q;
}
