/**
 * Exact ball ΔA in the brane from one shot per Newton step (the method behind ball.ts's ballDeltaArea).
 *
 * Slice and area as in ball.ts: (1/z²)(dz²/f + dr² + r² dΩ²_{d−2}), f = 1 − w z^d, A = Ω_{d−2} ∫ r^{d−2} z^{1−d} ds,
 * with s the arclength of the flat (r, y) plane, dy = dz/√f. The shooting equations from the tip are ball.ts's:
 *   r' = cos φ,  z' = q sin φ,  φ' = −(d−2) sin φ / r + (1−d) q cos φ / z,  q' = −(d/2) w z^{d−1} sin φ,  q = √f.
 *
 * Scaling: AdS is scale invariant, so with the tip at z0 = 1 the only parameter is τ = w z0^d = (z0/zh)^d ∈ (0, 1):
 * R = z0 R̂(τ) and ΔA = ΔÂ(τ). Newton runs on v = logit τ (1 − τ is carried exactly, so tips hugging the horizon
 * keep their digits): g(v) = ln(τ^{1/d} R̂(τ)) − ln(R/zh), near-linear in v both for small balls (τ ≈ (R/zh)^d)
 * and large ones (1 − τ ∝ e^{−κ R/zh}).
 *
 * ΔA in the same pass, cutoff-free. Let F(r, z) be the area of the vacuum hemisphere through (r, z) between that
 * point and its top, F = Ω ∫_{x}^{1} (1−t²)^{(d−3)/2} t^{1−d} dt with x = z/ρ, ρ = √(r²+z²). On a vacuum surface
 * dA = −dF exactly; on the brane's the divergences of A and F agree (f differs from 1 at order z^d), so
 *   ΔA = lim_{z→0} [A(z ≥ ε) + F(r_ε, ε)] = Ω ∫ r^{d−2} z^{1−d} (1 + ρ θ') ds,   θ = atan2(z, r),
 * because A_vac(ρ_ε, ε) − A_vac(R, ε) = O(ε²) and F vanishes at the tip. The integrand is written without the
 * cancellation of 1 + ρθ': with r'² + z'²/f = 1, 1 − ρ²θ'² = w z^d sin²φ + ρ'², so
 *   1 + ρθ' = (w z^d sin²φ + ρ'²) / (1 − ρθ'),  ρ' = (r cos φ + z q sin φ)/ρ,  ρθ' = (r q sin φ − z cos φ)/ρ,
 * and the integrand is O(z) at the boundary (derived here; checked against an independent mpmath evaluation by
 * direct subtraction of the cut-off areas in tests/fixtures/holo/ball_runner.py, and against ball-w.ts's
 * ∂_w A method in the tests). The shot stops at z_m = 1e-5…10^{−2.5} (tip units, by d); the rest of the integral,
 * R̂^{d−2} τ (z_m²/4 − (d−1) z_m⁴/(16 R̂²)) + O(z_m^d, z_m^6), is added; R = ρ(z_m) + O(z_m^d).
 *
 * dR̂/dτ and dΔÂ/dτ come from the variational equations along the same shot (the event's shift in s included), so
 * Newton needs no second shot; the last Newton step (≲ 1e-10 in v) is applied to ΔÂ linearly.
 * Integration: Dormand–Prince 5(4) (Dormand & Prince 1980; Hairer, Nørsett & Wanner, Solving ODEs I, §II.5),
 * written out here for this 10-component state without allocation per step; the error is controlled on the
 * profile and ΔA, not on the variations (Newton only needs them roughly).
 * The angle is carried as ψ = φ + π/2 so that cos φ keeps its relative precision where the surface turns vertical.
 * Start: the tip series of ball.ts at s0 = 1e-5 (error O(s0³) in the profile, O(s0^{d+1}) in ΔA).
 * Accuracy: ≤ 1e-9 relative against the mpmath fixtures for d = 3…5, R/zh = 0.1…3 at rtol = 1e-12 (most cases
 * ≤ 3e-10); for d ≥ 8 halving rtol moves answers by ~1e-9 (rounding near the boundary, where z^{1−d} is large),
 * and for d = 10 balls just above the small-ball switch are good to ~3e-8 only (the tests pin these figures).
 * Small balls ((R/zh)^d below 1e-6, or 1e-4 for d ≥ 6) take ΔA⁽¹⁾(1 + b (R/zh)^d), b read off one shot.
 */
import { HoloError } from './errors';
import { findRootNewton } from './numeric/newton';

const S0 = 1e-5;

/**
 * Where the shot stops, z_m (tip units), per d: below it the rest of ΔA is the closed-form tail, whose first neglected
 * term is O(z_m^d) (from ρ'²), while the rounding of ρ' integrates to ~1e-32 z_m^{4−d}; both stay below 1e-15.
 */
function landingDepth(d: number): number {
	return Math.pow(10, -Math.min(5, Math.max(2.5, 16 / (d - 1))));
}
const N = 10; // r z φ q K, then ∂_τ of r z φ q K

let shotsTaken = 0;

/**
 * Shots taken by this process so far (one per Newton step): what a sweep's continuation saves is counted with it
 * in the tests, since timings cannot be asserted on a busy machine.
 */
export function ballShotsTaken(): number {
	return shotsTaken;
}

/** One shot from the tip (z0 = 1) in f = 1 − τ z^d: R̂, ΔÂ/Ω and their τ-derivatives. */
export interface BallTipShot {
	R: number;
	dR: number;
	/** ΔÂ / Ω_{d−2} */
	K: number;
	dK: number;
	/** the part of K below z_m, added in closed form */
	tail: number;
	steps: number;
}

function rhs(d: number, w: number, y: Float64Array, out: Float64Array): void {
	const r = y[0];
	const z = y[1];
	const q = y[3];
	const sn = -Math.cos(y[2]); // sin φ, with y[2] = ψ = φ + π/2
	const cs = Math.sin(y[2]); // cos φ, to full relative precision as the surface turns vertical at the boundary
	const zd1 = powInt(z, d - 1);
	const zd = zd1 * z;
	const rd2 = powInt(r, d - 2);
	const rho = Math.sqrt(r * r + z * z);
	const Pa = r * cs;
	const Pb = z * q * sn;
	// ρ' = (Pa + Pb)/ρ is O(z^{d−1}) from two O(z) terms: below its rounding it is taken as 0 (its square times
	// z^{1−d} would otherwise feed rounding noise into ΔA for large d; the true term there is O(z^{d−1}))
	const small = Math.abs(Pa + Pb) < 1e-15 * (Math.abs(Pa) + Math.abs(Pb));
	const P = small ? 0 : (Pa + Pb) / rho;
	const T = (r * q * sn - z * cs) / rho;
	const A1 = rd2 / zd1;
	const Nn = w * zd * sn * sn + P * P;
	const D = 1 - T;
	out[0] = cs;
	out[1] = q * sn;
	out[2] = (-(d - 2) * sn) / r + ((1 - d) * q * cs) / z;
	out[3] = -0.5 * d * w * zd1 * sn;
	out[4] = (A1 * Nn) / D;
	// variations along ∂_τ (w = τ in tip units)
	const dr = y[5];
	const dz = y[6];
	const dphi = y[7];
	const dq = y[8];
	out[5] = -sn * dphi;
	out[6] = dq * sn + q * cs * dphi;
	out[7] = -(d - 2) * ((cs * dphi) / r - (sn * dr) / (r * r)) + (1 - d) * ((dq * cs - q * sn * dphi) / z - (q * cs * dz) / (z * z));
	out[8] = -0.5 * d * (zd1 * sn + w * (d - 1) * (zd1 / z) * dz * sn + w * zd1 * cs * dphi);
	const drho = (r * dr + z * dz) / rho;
	const dP = small ? 0 : (dr * cs - r * sn * dphi + dz * q * sn + z * dq * sn + z * q * cs * dphi - P * drho) / rho;
	const dT = (dr * q * sn + r * dq * sn + r * q * cs * dphi - dz * cs + z * sn * dphi - T * drho) / rho;
	const dA1 = A1 * (((d - 2) * dr) / r + ((1 - d) * dz) / z);
	const dN = zd * sn * sn + w * d * zd1 * dz * sn * sn + 2 * w * zd * sn * cs * dphi + 2 * P * dP;
	out[9] = (dA1 * Nn + A1 * dN) / D + (A1 * Nn * dT) / (D * D);
}

function powInt(x: number, n: number): number {
	let p = 1;
	for (let i = 0; i < n; i++) p *= x;
	return p;
}

// Dormand–Prince 5(4) tableau (Hairer, Nørsett & Wanner, Table II.5.2); FSAL: stage 7 is the next step's stage 1.
const a21 = 1 / 5;
const a31 = 3 / 40,
	a32 = 9 / 40;
const a41 = 44 / 45,
	a42 = -56 / 15,
	a43 = 32 / 9;
const a51 = 19372 / 6561,
	a52 = -25360 / 2187,
	a53 = 64448 / 6561,
	a54 = -212 / 729;
const a61 = 9017 / 3168,
	a62 = -355 / 33,
	a63 = 46732 / 5247,
	a64 = 49 / 176,
	a65 = -5103 / 18656;
const b1 = 35 / 384,
	b3 = 500 / 1113,
	b4 = 125 / 192,
	b5 = -2187 / 6784,
	b6 = 11 / 84;
const e1 = b1 - 5179 / 57600,
	e3 = b3 - 7571 / 16695,
	e4 = b4 - 393 / 640,
	e5 = b5 + 92097 / 339200,
	e6 = b6 - 187 / 2100,
	e7 = -1 / 40;

class Stepper {
	k1 = new Float64Array(N);
	k2 = new Float64Array(N);
	k3 = new Float64Array(N);
	k4 = new Float64Array(N);
	k5 = new Float64Array(N);
	k6 = new Float64Array(N);
	k7 = new Float64Array(N);
	tmp = new Float64Array(N);
	constructor(
		readonly d: number,
		readonly w: number
	) {}

	/** From y (with k1 = F(y) already in place) take a step h into yn; returns the scaled error norm. */
	step(y: Float64Array, h: number, yn: Float64Array, rtol: number, atol: Float64Array): number {
		const { k1, k2, k3, k4, k5, k6, k7, tmp, d, w } = this;
		for (let i = 0; i < N; i++) tmp[i] = y[i] + h * a21 * k1[i];
		rhs(d, w, tmp, k2);
		for (let i = 0; i < N; i++) tmp[i] = y[i] + h * (a31 * k1[i] + a32 * k2[i]);
		rhs(d, w, tmp, k3);
		for (let i = 0; i < N; i++) tmp[i] = y[i] + h * (a41 * k1[i] + a42 * k2[i] + a43 * k3[i]);
		rhs(d, w, tmp, k4);
		for (let i = 0; i < N; i++) tmp[i] = y[i] + h * (a51 * k1[i] + a52 * k2[i] + a53 * k3[i] + a54 * k4[i]);
		rhs(d, w, tmp, k5);
		for (let i = 0; i < N; i++) tmp[i] = y[i] + h * (a61 * k1[i] + a62 * k2[i] + a63 * k3[i] + a64 * k4[i] + a65 * k5[i]);
		rhs(d, w, tmp, k6);
		for (let i = 0; i < N; i++) yn[i] = y[i] + h * (b1 * k1[i] + b3 * k3[i] + b4 * k4[i] + b5 * k5[i] + b6 * k6[i]);
		rhs(d, w, yn, k7);
		// the rounding of ρ' (~1e-16 z), squared, times z^{1−d}: a floor under K's tolerance near the boundary
		const noise = (Math.abs(h) * powInt(y[0], d - 2) * 1e-28) / powInt(y[1], d - 3);
		let e = 0;
		for (let i = 0; i < 5; i++) {
			const err = h * (e1 * k1[i] + e3 * k3[i] + e4 * k4[i] + e5 * k5[i] + e6 * k6[i] + e7 * k7[i]);
			const sc = atol[i] + (i === 4 ? noise : 0) + rtol * Math.max(Math.abs(y[i]), Math.abs(yn[i]));
			const r = Math.abs(err) / sc;
			if (!(r <= e)) e = r; // NaN propagates as a rejection
		}
		return e;
	}
}

/**
 * Shoot from the tip z0 = 1 in f = 1 − τ z^d to z = z_m; `omt` is 1 − τ given exactly (tips near the horizon).
 * Throws a HoloError when the surface does not come back to the boundary.
 */
export function shootBallTip(d: number, tau: number, omt: number, rtol = 1e-12): BallTipShot {
	const rho0 = Math.sqrt(omt);
	const drho0 = -0.5 / rho0;
	const c = -rho0;
	const s0 = S0;
	const y = new Float64Array(N);
	// ball.ts's tip series: φ = c s, r = s, z = 1 + ρ0 c s²/2, q = ρ0 − (d/4) τ c s²; ΔA's start O(s0^{d+1}) is dropped
	y[0] = s0;
	y[1] = 1 + (rho0 * c * s0 * s0) / 2;
	y[2] = Math.PI / 2 + c * s0;
	y[3] = rho0 - 0.25 * d * tau * c * s0 * s0;
	y[5] = 0;
	y[6] = (s0 * s0) / 2; // ∂_τ(−(1−τ) s0²/2)
	y[7] = -drho0 * s0;
	y[8] = drho0 * (1 + 0.25 * d * tau * s0 * s0) + 0.25 * d * rho0 * s0 * s0;
	const atol = Float64Array.of(1e-14, 1e-14, 1e-14, 1e-14, 1e-14 * Math.max(tau, 1e-300), 0, 0, 0, 0, 0);
	const st = new Stepper(d, tau);
	rhs(d, tau, y, st.k1);
	const yn = new Float64Array(N);
	let h = s0;
	let s = s0;
	let steps = 0;
	const zm = landingDepth(d);
	for (;;) {
		if (steps > 100000) throw new HoloError('the ball surface needs too many steps (tip too close to the horizon)', 'R');
		const e = st.step(y, h, yn, rtol, atol);
		if (e <= 1) {
			steps++;
			if (yn[1] <= zm) return landing(st, y, h, yn, steps, tau, zm);
			s += h;
			y.set(yn);
			st.k1.set(st.k7);
			if (s > 1e6) throw new HoloError('the ball surface did not reach the boundary', 'R');
		}
		const fac = e === 0 ? 5 : Number.isFinite(e) ? Math.min(5, Math.max(0.2, 0.9 * Math.pow(e, -0.2))) : 0.25;
		h *= fac;
		if (!(h > 1e-14 * s)) throw new HoloError('the ball surface did not reach the boundary (step underflow)', 'R');
	}
}

/** The step that crosses z = z_m is redone with the length that lands on it (Newton on the step length). */
function landing(st: Stepper, y: Float64Array, h: number, yn: Float64Array, steps: number, tau: number, zm: number): BallTipShot {
	const d = st.d;
	const k1 = Float64Array.from(st.k1);
	const out = new Float64Array(N);
	const none = new Float64Array(N);
	let hh = (h * (y[1] - zm)) / (y[1] - yn[1]);
	for (let it = 0; it < 8; it++) {
		st.k1.set(k1);
		st.step(y, hh, yn, 1, none);
		rhs(d, tau, yn, out);
		const g = yn[1] - zm;
		hh -= g / out[1];
		if (Math.abs(g) < 1e-16 * zm) break;
	}
	const [r, z] = yn;
	const rho = Math.sqrt(r * r + z * z);
	const ds = -yn[6] / out[1]; // shift of the landing point in s per unit τ
	const P = (r * out[0] + z * out[1]) / rho;
	const dR = (r * yn[5] + z * yn[6]) / rho + P * ds;
	// ∫_0^{z_m} of the integrand (R^{d−2} w z/2)(1 − (d−1) z²/(2R²) + O(z^{d−2}, z⁴)) dz (derived from the hemisphere)
	const z2 = zm * zm;
	const tail = powInt(rho, d - 2) * tau * (z2 / 4 - ((d - 1) * z2 * z2) / (16 * rho * rho));
	return { R: rho, dR, K: yn[4] + tail, dK: yn[9] + out[4] * ds, tail, steps };
}

export interface BallSolution {
	/** tip depth */
	z0: number;
	/** τ = (z0/zh)^d */
	tau: number;
	/** ΔA / Ω_{d−2} */
	K: number;
	/** |ΔÂ/Ω| of the corrections applied after the last shot: Newton's last step and the tail below z_m */
	correction: number;
	/** shots taken */
	shots: number;
	/** logit τ, to start a neighbouring ball from (sweeps) */
	v: number;
}

/** v = logit τ for R/zh = x: a rough start (τ ≈ x^d for small balls, 1 − τ ∝ e^{−κx} for large ones). */
function startV(d: number, x: number): number {
	return x < 1 ? d * Math.log(x) + 0.5 * x ** d : 0.5 * d * x;
}

/**
 * Solve R(z0) = R by safeguarded Newton on v = logit τ and return the tip and ΔA/Ω; `from` (a neighbour's v)
 * replaces the rough start. Deterministic for the same arguments.
 */
export function solveBall(d: number, R: number, zh: number, rtol = 1e-12, from?: number, needTip = true): BallSolution {
	const x = R / zh;
	const lx = Math.log(x);
	const xd = Math.pow(x, d);
	if (xd < smallBelow(d) && !needTip) return smallBall(d, x, NaN, NaN, 0, NaN, rtol);
	let last: { v: number; tau: number; shot: BallTipShot } | undefined;
	let shots = 0;
	const evaluate = (v: number) => {
		const tau = 1 / (1 + Math.exp(-v));
		const omt = 1 / (1 + Math.exp(v));
		// ΔÂ ∝ τ for small tips while the profile's error is not: tighten the tolerance with √τ (measured against
		// the fixtures: at τ = 1e-5, d = 5, rtol 1e-12 alone leaves 2e-9)
		const shot = shootBallTip(d, tau, omt, Math.max(rtol * Math.min(1, Math.sqrt(tau / 0.01)), 1e-15));
		shots++;
		shotsTaken++;
		last = { v, tau, shot };
		const g = Math.log(shot.R) + Math.log(tau) / d - lx;
		const dgdtau = 1 / (d * tau) + shot.dR / shot.R;
		return { g, dg: dgdtau * tau * omt };
	};
	const v0 = from !== undefined && Number.isFinite(from) ? from : startV(d, x);
	const res = findRootNewton(evaluate, v0, { xtol: 1e-11, maxIter: 60, ceiling: 27, limit: 700 });
	if (res.reason === 'ceiling' || (res.reason === 'diverged' && res.x > 0))
		throw new HoloError(`R=${R} is too large for the shooting: its tip would lie within 1e-12 of the horizon`, 'R');
	if (res.reason) throw new HoloError(`the ball surface for R=${R} was not found (${res.reason})`, 'R');
	const L = last!;
	// apply the final Newton step to ΔÂ linearly (the step is below xtol, so the error is its square)
	const dtau = L.tau * (1 - L.tau) * (res.x - L.v);
	const tau = 1 / (1 + Math.exp(-res.x));
	const step = L.shot.dK * dtau;
	const z0 = zh * Math.pow(tau, 1 / d);
	if (xd < smallBelow(d)) return smallBall(d, x, z0, tau, shots, res.x, rtol);
	return { z0, tau, K: L.shot.K + step, correction: Math.abs(step) + L.shot.tail, shots, v: res.x };
}

/** ΔÂ ∝ τ for small balls, while the rounding floor of the integrand is absolute (≈ 1e-32 z^{3−d}): the series. */
function smallBall(d: number, x: number, z0: number, tau: number, shots: number, v: number, rtol: number): BallSolution {
	const xd = Math.pow(x, d);
	const K = (xd / (2 * (d + 1))) * (1 + secondOrder(d, rtol) * xd);
	return { z0, tau, K, correction: K * readAt(d) * xd, shots, v };
}

/**
 * Below this (R/zh)^d, ΔA = ΔA⁽¹⁾ (1 + b (R/zh)^d) + O((R/zh)^{2d}) is closer than the shot: 1e-6 for d ≤ 5, 1e-4
 * above, where the shot's relative error at small τ grows (≈ 1e-9 at (R/zh)^d = 1e-3 for d = 10, measured by
 * halving rtol).
 */
function smallBelow(d: number): number {
	return d <= 5 ? 1e-6 : 1e-4;
}

/** (R/zh)^d where b is read off: its O(readAt) error times (R/zh)^d < smallBelow stays ≲ 1e-10 relative. */
function readAt(d: number): number {
	return d <= 5 ? 1e-4 : 1e-3;
}

const bCache = new Map<string, number>();

/** b(d) of ΔA = ΔA⁽¹⁾(1 + b (R/zh)^d + …), read off one exact ball at (R/zh)^d = readAt(d) (deterministic, cached). */
function secondOrder(d: number, rtol: number): number {
	const key = `${d}:${rtol}`;
	let b = bCache.get(key);
	if (b === undefined) {
		const xb = readAt(d);
		const s = solveBall(d, Math.pow(xb, 1 / d), 1, rtol);
		b = (s.K / (xb / (2 * (d + 1))) - 1) / xb;
		bCache.set(key, b);
	}
	return b;
}
