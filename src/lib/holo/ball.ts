/**
 * Balls: the RT surface of a ball of radius R on a constant-t slice (whole ball, not per unit volume).
 *
 * Slice: (1/z²)(dz²/f + dr² + r² dΩ²_{d−2}) with f = 1 − w z^d, w = zh^{−d} (the brane, PHYSICS.md).
 * Area: A = Ω_{d−2} ∫ r^{d−2} z^{1−d} √(dr² + dz²/f), Ω_{d−2} = 2π^{(d−1)/2}/Γ((d−1)/2).
 *
 * Vacuum (f = 1): the hemisphere r² + z² = R² (Ryu & Takayanagi, JHEP 08 (2006) 045). With x = z/R,
 *   A = Ω_{d−2} ∫_{ε/R}^{1} (1−x²)^{(d−3)/2} x^{1−d} dx.
 * Finite part (our scheme, stated because a ball has several divergences): drop every negative power of ε
 * and, for even d, the term proportional to ln(R/ε); what remains as ε → 0 is R-independent:
 *   odd d:  A_fin = (Ω_{d−2}/2) Γ(1−d/2) Γ((d−1)/2) / Γ(1/2)                (analytic continuation of B/2)
 *   even d: A_fin = (Ω_{d−2}/2) (−1)^m Γ((d−1)/2) [ψ(m+1) − ψ(1/2)] / (m! Γ(1/2)),  m = d/2 − 1
 * (the constant of the Laurent expansion of B(s,(d−1)/2)/2 at s = 1 − d/2; derived, checked against a
 * direct mpmath integration in tests/fixtures/holo/analysis/ball_vacuum.py).
 *
 * First order in the brane: ΔA = Ω_{d−2} R^d/(2(d+1) zh^d), and with ΔE = (volume)·ε the first law holds
 * with T_ent = (d+1)/(2πR) (Blanco, Casini, Hung & Myers, JHEP 08 (2013) 060).
 *
 * Exact ΔA in the brane — method. ΔA(R) = ∫_0^{zh^{−d}} ∂_w A(R; w) dw. By extremality, at fixed R the
 * derivative is the explicit w-derivative of the functional on the solution (the boundary data are held
 * fixed), ∂_w A = (Ω_{d−2}/2) ∫ r^{d−2} z sin²φ / f ds — an integrand with no divergence, so ΔA comes out
 * cutoff-free with no subtraction of large numbers. The w-integral runs in t = (w zh^d)^{1/d}. The profile is found by shooting from the tip: in the
 * flat coordinates (r, y), dy = dz/√f, the surface is a geodesic of Ω²(dr² + dy²) with Ω = r^{d−2} z^{1−d};
 * with s the (r, y) arclength and φ the tangent angle,
 *   r' = cos φ,  z' = √f sin φ,  φ' = −(d−2) sin φ / r + (1−d) √f cos φ / z,  (√f)' = f'(z) sin φ / 2
 * (geodesic curvature of a conformally flat metric = normal derivative of ln Ω). The tip r = 0 is a
 * regular-singular point; the series start φ = c s, c = −√f(z0)/z0 (from φ' at s → 0), r = s,
 * z = z0 + √f0 c s²/2 is used at s0 = 1e-4 z0 (error O(s0³)). The integration (Dormand–Prince, numeric/ode)
 * stops at z = z_m = 1e-5 z0; the landing radius is R = √(r_m² + z_m²) (error O(z_m^d), the first order at
 * which the brane surface differs from a hemisphere near the boundary) and the missing piece of ∂_w A is
 * R^{d−2} z_m²/2. z0(R) comes from Brent's method; the w-integral from Gauss–Legendre with 16 and 24
 * nodes, whose difference is returned as the error estimate.
 * Accuracy: ≈1e-9 relative for R ≲ 2 zh (measured in the tests by halving the ODE tolerance and comparing
 * rules); degrades slowly as R/zh grows (the tip approaches the horizon).
 */
import { HoloError } from './errors';
import { gamma } from './special/gamma';
import { integrateOde } from './numeric/ode';
import { findRootBrent } from './numeric/brent';
import { gaussLegendre } from './numeric/gauss';

/** Area of the unit sphere S^{n}: 2π^{(n+1)/2}/Γ((n+1)/2). */
export function sphereArea(n: number): number {
	return (2 * Math.pow(Math.PI, (n + 1) / 2)) / gamma((n + 1) / 2);
}

function digamma(x: number): number {
	// ψ at the integer and half-integer points needed here, exactly from the recurrences.
	const EULER = 0.5772156649015329;
	if (x === Math.floor(x) && x > 0) {
		let s = -EULER;
		for (let k = 1; k < x; k++) s += 1 / k;
		return s;
	}
	if (x - 0.5 === Math.floor(x - 0.5) && x > 0) {
		let s = -EULER - 2 * Math.LN2;
		for (let k = 0; k < x - 0.5; k++) s += 1 / (k + 0.5);
		return s;
	}
	throw new RangeError('digamma: only integers and half-integers are needed here');
}

function checkD(d: number): void {
	if (!Number.isInteger(d) || d < 3 || d > 10)
		throw new HoloError('a ball needs an integer d with 3 ≤ d ≤ 10', 'd', 'for d = 2 a ball is an interval: use strip');
}

/** Finite part of the ball's RT area in AdS_{d+1} (scheme in the module comment); independent of R. */
export function ballVacuumAreaFinite(d: number): number {
	checkD(d);
	const om = sphereArea(d - 2);
	const b = (d - 1) / 2;
	if (d % 2 === 1) return ((om / 2) * (gamma(1 - d / 2) * gamma(b))) / Math.sqrt(Math.PI);
	const m = d / 2 - 1;
	return ((om / 2) * Math.pow(-1, m) * gamma(b) * (digamma(m + 1) - digamma(0.5))) / (gamma(m + 1) * Math.sqrt(Math.PI));
}

/** Coefficient of ln(R/ε) in the vacuum ball area (0 for odd d): Ω_{d−2}·(−1)^m·binom((d−3)/2, m). */
export function ballLogCoefficient(d: number): number {
	checkD(d);
	if (d % 2 === 1) return 0;
	const m = d / 2 - 1;
	let binom = 1;
	for (let k = 0; k < m; k++) binom *= ((d - 3) / 2 - k) / (k + 1);
	return sphereArea(d - 2) * Math.pow(-1, m) * binom;
}

/** First-order change of the ball area in the brane, whole ball (Blanco–Casini–Hung–Myers 2013). */
export function ballDeltaAreaFirstOrder(d: number, R: number, zh: number): number {
	checkD(d);
	return (sphereArea(d - 2) * Math.pow(R, d)) / (2 * (d + 1) * Math.pow(zh, d));
}

/** Entanglement temperature of a ball, T = (d+1)/(2πR) (Blanco, Casini, Hung & Myers, JHEP 08 (2013) 060). */
export function ballTent(d: number, R: number): number {
	if (!(R > 0)) throw new HoloError('R must be > 0', 'R');
	return (d + 1) / (2 * Math.PI * R);
}

/** ΔE of a ball in the brane: energy density (d−1)/(16πG zh^d) times the ball's volume Ω_{d−2}R^{d−1}/(d−1). */
export function ballEnergy(d: number, R: number, zh: number, G = 1): number {
	checkD(d);
	return (sphereArea(d - 2) * Math.pow(R, d - 1)) / (16 * Math.PI * G * Math.pow(zh, d));
}

export interface BallShot {
	/** landing radius */
	R: number;
	/** ∂_w A / (Ω_{d−2}/2) on this surface */
	dAdw: number;
	steps: number;
}

/** Integrate the embedding from the tip z0 to the boundary in f = 1 − w z^d. */
export function shootBall(d: number, w: number, z0: number, rtol = 1e-12): BallShot {
	// ρ = √f is carried as a state variable (ρ' = f'(z) sin φ / 2) so that no square root of f appears in the
	// right-hand side: surfaces whose tip hugs the horizon then need no tiny steps near f = 0.
	const rhs = (_s: number, y: Float64Array) => {
		const [r, z, phi, , rho] = y;
		const sn = Math.sin(phi);
		const cs = Math.cos(phi);
		return Float64Array.of(
			cs,
			rho * sn,
			(-(d - 2) * sn) / r + ((1 - d) * rho * cs) / z,
			(Math.pow(r, d - 2) * z * sn * sn) / (rho * rho),
			-0.5 * d * w * Math.pow(z, d - 1) * sn
		);
	};
	const rho0 = Math.sqrt(1 - w * Math.pow(z0, d));
	if (!(rho0 > 0)) throw new HoloError('the tip must lie outside the horizon', 'R');
	const c = -rho0 / z0;
	const s0 = 1e-4 * z0;
	const dz = (rho0 * c * s0 * s0) / 2;
	const y0 = [
		s0,
		z0 + dz,
		c * s0,
		(Math.pow(s0, d - 1) * z0 * c * c * s0 * s0) / (d + 1) / (rho0 * rho0),
		rho0 - (0.5 * d * w * Math.pow(z0, d - 1) * (c * s0 * s0)) / 2
	];
	const zm = 1e-5 * z0;
	const res = integrateOde(rhs, s0, y0, 1e6 * z0, { rtol, atol: 1e-14 * z0, h0: s0, event: (_s, y) => y[1] - zm });
	if (!res.event) throw new HoloError('the ball surface did not reach the boundary', 'R');
	const [r, z] = res.y;
	const R = Math.sqrt(r * r + z * z);
	return { R, dAdw: res.y[3] + (Math.pow(R, d - 2) * z * z) / 2, steps: res.steps };
}

/** Tip depth z0 of the brane's ball surface of radius R (Brent on the shooting map). */
export function ballTip(d: number, R: number, zh: number, rtol = 1e-12): number {
	checkD(d);
	if (!(R > 0)) throw new HoloError('R must be > 0', 'R');
	const w = Math.pow(zh, -d);
	if (w === 0) return R;
	const miss = (z0: number) => shootBall(d, w, z0, rtol).R - R;
	const hi = Math.min(R * (1 + 1e-6), zh * (1 - 1e-12)); // R(z0) ≥ z0, with room for rounding
	const fhi = miss(hi);
	if (fhi < 0) throw new HoloError(`R=${R} is too large for the shooting (R/zh ≳ ${(shootBall(d, w, hi, rtol).R / zh).toFixed(1)})`, 'R');
	let lo = hi / 2;
	let flo = miss(lo);
	while (flo > 0) {
		lo /= 2;
		flo = miss(lo);
	}
	return findRootBrent(miss, lo, hi, 1e-15 * R, 200, flo, fhi).x;
}

export interface BallDeltaArea {
	value: number;
	/** |difference between the 16- and 24-node w-rules| */
	error: number;
	firstOrder: number;
}

/** Exact ΔA = A_fin(brane) − A_fin(vacuum) of a ball of radius R, cutoff-free (see module comment). */
export function ballDeltaArea(d: number, R: number, zh: number, rtol = 1e-12): BallDeltaArea {
	checkD(d);
	if (!(zh > 0)) throw new HoloError('zh must be > 0', 'zh');
	const W = Math.pow(zh, -d);
	const om = sphereArea(d - 2);
	const rule = (n: number) => {
		const { x, w } = gaussLegendre(n);
		let s = 0;
		for (let i = 0; i < n; i++) {
			// w = W t^d: ∂_w A ∝ w^{−1/d} once the surface hugs the horizon (w ≫ R^{−d}); in t the integrand
			// d W t^{d−1} ∂_w A is then smooth, with no boundary layer at w = 0 for large R/zh.
			const t = (1 + x[i]) / 2;
			const wi = W * Math.pow(t, d);
			const z0 = ballTip(d, R, zh / t, rtol);
			s += w[i] * d * W * Math.pow(t, d - 1) * shootBall(d, wi, z0, rtol).dAdw;
		}
		return (s / 2) * (om / 2);
	};
	const a = rule(16);
	const b = rule(24);
	return { value: b, error: Math.abs(b - a), firstOrder: ballDeltaAreaFirstOrder(d, R, zh) };
}
