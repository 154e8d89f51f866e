import { findRootBrent } from '../numeric/brent';
import { vacuumWidthFactor } from '../strip';
import { surfaceAt, type Surface } from './family';
import { integrateAdaptive } from './quad';

/** ln(l(z*)/l) past the edge of the family (no surface): l grows without bound towards that edge (the surface
 * then hugs a critical surface z_m and its width diverges like −ln of the distance), so "too wide" is the
 * right side to put it on. */
const PAST_EDGE = 40;

/**
 * The surface of width l (units zh = 1) that crosses the shell at fraction ζ: Brent in x = ln z* on
 * ln(l(x)/l), bracketed from `guess` (the previous ζ's tip in a scan, else the vacuum tip l/W₀). At fixed ζ the
 * width grows monotonically with the tip up to the family's edge (checked by the scans in the tests).
 */
export function surfaceForWidth(d: number, l: number, zeta: number, guess?: number): Surface | null {
	const lnl = Math.log(l);
	const g = (x: number): { v: number; s: Surface | null } => {
		const s = surfaceAt(d, Math.exp(x), zeta);
		return s ? { v: Math.log(s.l) - lnl, s } : { v: PAST_EDGE, s: null };
	};
	let x0 = Math.log(guess ?? l / vacuumWidthFactor(d));
	let g0 = g(x0);
	// secant from the guess (ln l is close to linear in ln z*, slope ≈ 1 far from the edge); Brent's bracketed
	// search below takes over if it leaves the family or stalls
	if (g0.s) {
		let xa = x0;
		let ga = g0;
		let xb = x0 - Math.min(Math.max(g0.v, -0.5), 0.5);
		for (let k = 0; k < 12; k++) {
			const gb = g(xb);
			if (!gb.s) break;
			if (Math.abs(gb.v) < 1e-15) return gb.s;
			const den = gb.v - ga.v;
			if (den === 0) break;
			const xn = xb - (gb.v * (xb - xa)) / den;
			if (Math.abs(xn - xb) < 1e-14 * Math.max(1, Math.abs(xb))) {
				const gn = g(xn);
				return gn.s ?? gb.s;
			}
			xa = xb;
			ga = gb;
			xb = xn;
		}
	}
	let step = g0.v < 0 ? 0.25 : -0.25;
	let x1 = x0 + step;
	let g1 = g(x1);
	for (let k = 0; g0.v * g1.v > 0; k++) {
		if (k > 80) return null;
		x0 = x1;
		g0 = g1;
		if (!g1.s) step = -Math.abs(step);
		else step *= 1.6;
		x1 = x0 + step;
		g1 = g(x1);
	}
	let best: Surface | null = null;
	const r = findRootBrent(
		(x) => {
			const q = g(x);
			if (q.s && (!best || Math.abs(q.v) < Math.abs(Math.log(best.l) - lnl))) best = q.s;
			return q.v;
		},
		x0,
		x1,
		1e-15,
		200,
		g0.v,
		g1.v
	);
	return surfaceAt(d, Math.exp(r.x), zeta) ?? best;
}

/** One point of the family at fixed width: ζ = 1 is the static brane surface (reached at t = t_sat). */
export interface CurvePoint {
	zeta: number;
	t: number;
	dA: number;
	surface: Surface | null;
}

/**
 * ∫₀^{z*} dz/f for the brane (units zh = 1): the boundary time at which the static surface of tip z* first lies
 * wholly after the shell (v ≥ 0 at its tip). With 1 − u^d = (1 − u) q(u), q = Σ_{j<d} u^j:
 *   ∫₀^x du/(1 − u^d) = −ln(1 − x)/d + ∫₀^x (d − q)/(d q (1 − u)) du,
 * and (d − q)/(1 − u) = Σ_{j=1}^{d−1} Σ_{i<j} u^i is a polynomial, so the rest is smooth; −ln(1 − x) comes from
 * η = 1 − x kept exact by the strip solver. d = 2: artanh(x) = l/2.
 */
export function saturationTime(d: number, zstar: number, eta: number): number {
	const lead = -Math.log(eta) / d;
	const out = new Float64Array(1);
	integrateAdaptive(
		(u, o) => {
			let q = 0;
			let num = 0;
			let pw = 1;
			for (let j = 0; j < d; j++) {
				q += pw;
				num += (d - 1 - j) * pw; // coefficient of u^i in Σ_{j=1}^{d−1} Σ_{i<j} u^i is d − 1 − i
				pw *= u;
			}
			o[0] = num / (d * q);
			return true;
		},
		0,
		zstar,
		1,
		out
	);
	return lead + out[0];
}
