/**
 * The earlier exact ball ΔA in the brane, kept as an independent check of ball-shot.ts in the tests (slow: hundreds
 * of shots per answer). Slice, area and shooting equations as in ball.ts.
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
import { integrateOde } from './numeric/ode';
import { findRootBrent } from './numeric/brent';
import { gaussLegendre } from './numeric/gauss';
import { sphereArea, ballDeltaAreaFirstOrder } from './ball';

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
export function ballTipByW(d: number, R: number, zh: number, rtol = 1e-12): number {
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

export interface BallDeltaAreaByW {
	value: number;
	/** |difference between the 16- and 24-node w-rules| */
	error: number;
	firstOrder: number;
}

/** Exact ΔA = A_fin(brane) − A_fin(vacuum) of a ball of radius R, cutoff-free (see module comment). */
export function ballDeltaAreaByW(d: number, R: number, zh: number, rtol = 1e-12): BallDeltaAreaByW {
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
			const z0 = ballTipByW(d, R, zh / t, rtol);
			s += w[i] * d * W * Math.pow(t, d - 1) * shootBall(d, wi, z0, rtol).dAdw;
		}
		return (s / 2) * (om / 2);
	};
	const a = rule(16);
	const b = rule(24);
	return { value: b, error: Math.abs(b - a), firstOrder: ballDeltaAreaFirstOrder(d, R, zh) };
}
