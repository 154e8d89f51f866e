import { gaussLegendre } from './numeric/gauss';
import { solveStrip } from './strip';
import type { Slice } from './types';

/**
 * Points of a surface profile, from the tip (x = 0) to the boundary (x = l/2, z = 0); the other half is the mirror
 * image x → −x. v is the ingoing time coordinate (present for time-dependent bulks).
 */
export interface ProfilePoint {
	x: number;
	z: number;
	v?: number;
}

/**
 * Cumulative integrals along a parameter p on [p0, p1], sampled at `count` equal steps, with an 8-point
 * Gauss–Legendre rule on each step (the integrands handed in are smooth in p: endpoint singularities are mapped
 * away by the caller's choice of p). `rates(p)` gives [dx/dp, dv/dp] and `zOf(p)` the depth.
 */
export function traceProfile(
	p0: number,
	p1: number,
	count: number,
	rates: (p: number) => [number, number],
	zOf: (p: number) => number,
	start: ProfilePoint,
	withV: boolean
): ProfilePoint[] {
	const rule = gaussLegendre(8);
	const out: ProfilePoint[] = [];
	let x = start.x;
	let v = start.v ?? 0;
	const h = (p1 - p0) / count;
	for (let k = 1; k <= count; k++) {
		const a = p0 + (k - 1) * h;
		const c = a + 0.5 * h;
		for (let i = 0; i < 8; i++) {
			const [dx, dv] = rates(c + 0.5 * h * rule.x[i]);
			x += 0.5 * h * rule.w[i] * dx;
			v += 0.5 * h * rule.w[i] * dv;
		}
		const pt: ProfilePoint = { x, z: zOf(a + h) };
		if (withV) pt.v = v;
		out.push(pt);
	}
	return out;
}

/**
 * The RT profile x(z) of a strip of width l on any static slice (PHYSICS.md, "Strip"): x′² = H_* / (f (H − H_*)),
 * H = h/z^{2(d−1)}, written in u = z/z* = 1 − s² so the tip's 1/√ singularity is gone:
 *   dx/ds = 2 s z_* / √(f (H/H_* − 1)),  H/H_* − 1 = expm1(ln(h/h_*) − 2(d−1) ln u).
 * The last point is put at x = l/2 exactly (the quadrature reaches it to ~1e−10).
 */
export function staticProfile(slice: Slice, l: number, count = 80): { zstar: number; points: ProfilePoint[] } {
	const sol = solveStrip(slice, l);
	const zs = sol.zstar;
	const n = 2 * (slice.d - 1);
	const hs = slice.h(zs);
	const rates = (s: number): [number, number] => {
		const lnu = Math.log1p(-s * s);
		const u = 1 - s * s;
		const q = Math.expm1(Math.log(slice.h(u * zs) / hs) - n * lnu);
		return [(2 * s * zs) / Math.sqrt(slice.f(u * zs) * q), 0];
	};
	const pts = [{ x: 0, z: zs }, ...traceProfile(0, 1, count, rates, (s) => zs * (1 - s * s), { x: 0, z: zs }, false)];
	pts[pts.length - 1] = { x: l / 2, z: 0 };
	return { zstar: zs, points: pts };
}
