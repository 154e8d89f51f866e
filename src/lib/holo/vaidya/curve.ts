import { makeBrane } from '../bulks/brane';
import { findRootBrent } from '../numeric/brent';
import { minimizeBrent } from '../numeric/minimize';
import { solveStrip, vacuumWidthFactor } from '../strip';
import { criticalBetween } from './climb';
import { surfaceAt, surfaceExists, type Surface } from './family';
import { saturationTime, surfaceForWidth, type CurvePoint } from './solve';

/**
 * All extremal surfaces of one strip width l (units zh = 1) as a curve ζ ↦ (z*, t, ΔA), ζ = z_c/z* from 0 (the
 * vacuum surface at t = 0) to 1 (the static brane surface, reached at t_sat = ∫₀^{z*} dz/f). At fixed l the
 * boundary time is not monotonic in ζ for d ≥ 3 (Liu & Suh 2014): near saturation it overshoots t_sat and comes
 * back, so a time can have up to three surfaces (two of the family and the static one); the linear-growth part
 * of a wide strip is steep in ζ. The curve is sampled on a grid clustered at ζ = 1, refined by bisection where
 * t or ΔA jumps, and its interior extrema of t are located (Brent's minimiser to 1e−6 in ζ, so t_max to ~1e−12), so
 * every solution of t(ζ) = t lies in
 * a bracket of the grid and is then refined by Brent's method in ζ — never by continuation in t.
 */
export interface Curve {
	d: number;
	l: number;
	points: CurvePoint[];
	static: { zstar: number; eta: number; dA: number; tsat: number };
}

const GRID = 24;
const MAX_POINTS = 400;

function pointAt(d: number, l: number, zeta: number, guess?: number | Surface): CurvePoint | null {
	const s = surfaceForWidth(d, l, zeta, guess);
	return s ? { zeta, t: s.t, dA: s.dA, surface: s } : null;
}

export function buildCurve(d: number, l: number): Curve {
	const st = solveStrip(makeBrane({ d, zh: 1 }).slice, l);
	const tsat = saturationTime(d, st.zstar, st.point.eta);
	const stat = { zstar: st.zstar, eta: st.point.eta, dA: st.deltaArea, tsat };
	const pts: CurvePoint[] = [{ zeta: 0, t: 0, dA: 0, surface: null }];
	let guess: number | Surface = l / vacuumWidthFactor(d);
	for (let k = 1; k < GRID; k++) {
		const p = k / GRID;
		const zeta = 1 - (1 - p) * (1 - p);
		const c = pointAt(d, l, zeta, guess);
		if (!c) continue;
		guess = c.surface!;
		pts.push(c);
	}
	pts.push({ zeta: 1, t: tsat, dA: stat.dA, surface: null });
	refine(d, l, pts);
	addExtrema(d, l, pts);
	return { d, l, points: pts, static: stat };
}

/** Bisects grid intervals where t or ΔA moves by more than 1/16 of its range (the steep linear-growth part). */
function refine(d: number, l: number, pts: CurvePoint[]): void {
	const { tr, ar, tFar } = refineScales(pts);
	for (let i = 0; i + 1 < pts.length && pts.length < MAX_POINTS;) {
		const A = pts[i];
		const B = pts[i + 1];
		const jump = (Math.abs(B.t - A.t) > tr / 16 || Math.abs(B.dA - A.dA) > ar / 16) && Math.min(A.t, B.t) < tFar;
		if (jump && B.zeta - A.zeta > 1e-12 * B.zeta && B.zeta < 1) {
			const c = pointAt(d, l, 0.5 * (A.zeta + B.zeta), A.surface ?? B.surface ?? undefined);
			if (c) {
				pts.splice(i + 1, 0, c);
				continue;
			}
		}
		i++;
	}
}

/**
 * The ranges of t and ΔA that refine() resolves to 1/16: the curve's own, but at most twice the static surface's
 * (the last point), and no refinement where both ends are later than that (tFar). A wide strip's family reaches
 * times far beyond saturation (surfaces that stay on the critical surface z_m for a long time, climb.ts: t ~ 4000
 * at d = 4, l = 20 zh, against t_sat ≈ 13): those would leave the whole rise before saturation inside one grid
 * interval, and refining them would only bracket times no growth curve asks (one bracket per root suffices there).
 */
function refineScales(pts: CurvePoint[]): { tr: number; ar: number; tFar: number } {
	const end = pts[pts.length - 1];
	const tr = Math.min(Math.max(...pts.map((p) => p.t)), 2 * end.t);
	const ar = Math.min(Math.max(...pts.map((p) => p.dA)), 2 * end.dA);
	return { tr, ar, tFar: 2 * end.t };
}

/** Inserts each interior local extremum of t (Brent’s minimiser on the three grid points around it). */
function addExtrema(d: number, l: number, pts: CurvePoint[]): void {
	const found: CurvePoint[] = [];
	// the family has one fold near saturation (and its partner minimum when t overshoots): refine the two most
	// prominent extrema; rounding wiggles in the steep part of a wide strip's curve are not folds
	const cand: { i: number; sgn: number; prom: number }[] = [];
	for (let i = 1; i + 1 < pts.length; i++) {
		const a = pts[i - 1];
		const b = pts[i];
		const c = pts[i + 1];
		const sgn = b.t > a.t && b.t >= c.t ? 1 : b.t < a.t && b.t <= c.t ? -1 : 0;
		if (!sgn || c.zeta >= 1 || a.zeta <= 0) continue;
		cand.push({ i, sgn, prom: Math.abs(b.t - 0.5 * (a.t + c.t)) });
	}
	cand.sort((x, y) => y.prom - x.prom);
	for (const { i, sgn } of cand.slice(0, 2)) {
		const a = pts[i - 1];
		const b = pts[i];
		const c = pts[i + 1];
		// Brent's minimiser of −sgn·t(ζ) on the bracket (parabolic steps on this smooth extremum: ~8 evaluations
		// where golden section alone took ~25), to 1e−6 in ζ, so t at the extremum to ~1e−12
		let best: CurvePoint | null = null;
		let guess: Surface | undefined = b.surface ?? undefined;
		minimizeBrent(
			(zeta) => {
				const p = pointAt(d, l, zeta, guess);
				if (!p) return NaN;
				guess = p.surface ?? guess;
				if (!best || sgn * p.t > sgn * best.t) best = p;
				return -sgn * p.t;
			},
			a.zeta,
			c.zeta,
			1e-6,
			60
		);
		if (best) found.push(best);
	}
	for (const f of found) {
		const j = pts.findIndex((p) => p.zeta > f.zeta);
		pts.splice(j, 0, f);
	}
}

/**
 * Every surface of the family at time t (ζ < 1), one per grid bracket of t(ζ) − t: when the bracket's ends are
 * critical surfaces, Newton in (ln z*, λ) (climb.ts criticalBetween); else two-dimensional Newton
 * on (ln l − ln l₀, t − t₀) in (ln z*, ζ) from the bracket's interpolated tip and crossing (newtonIn: ~12
 * surface evaluations), and where that does not converge inside the bracket, Brent's method in ζ with the tip
 * solved at each ζ (~70 evaluations, but it cannot leave the bracket).
 */
export function surfacesAt(curve: Curve, t: number): Surface[] {
	const { d, l, points } = curve;
	const out: Surface[] = [];
	for (let i = 0; i + 1 < points.length; i++) {
		const A = points[i];
		const B = points[i + 1];
		const ga = A.t - t;
		const gb = B.t - t;
		if (ga * gb > 0 || (gb === 0 && i + 2 < points.length)) continue;
		if (B.zeta >= 1 && gb === 0) continue; // the static end itself is added by the caller
		const quick = criticalBetween(d, l, t, A, B) ?? newtonIn(curve, A, B, t);
		if (quick) {
			out.push(quick);
			continue;
		}
		let last = null as Surface | null;
		const g = (zeta: number): number => {
			if (zeta <= 0) return -t;
			if (zeta >= 1) return curve.static.tsat - t;
			const s = surfaceForWidth(d, l, zeta, last ?? A.surface ?? B.surface ?? undefined);
			if (!s) return NaN;
			last = s;
			return s.t - t;
		};
		const r = findRootBrent(g, A.zeta, B.zeta, 1e-16, 100, ga, gb);
		if (!(r.x > 0 && r.x < 1)) continue;
		const s = last !== null && (last as Surface).zeta === r.x ? last : surfaceForWidth(d, l, r.x, last ?? A.surface ?? undefined);
		if (s) out.push(s);
	}
	return out;
}

/** Forward-difference steps of the Newton Jacobian (relative in ln z* and in ζ): the Jacobian's error ~1e−7 only
 * slows the last step to a linear rate of ~1e−7, so two or three steps reach rounding from a grid guess. */
const H_X = 1e-7;
const H_Z = 1e-7;

/**
 * The surface of width l at time t in the bracket [A, B] of the curve by Newton's method in (x = ln z*, ζ), or null
 * when it does not converge to rounding inside the bracket — always so near the family's edge, where the width
 * diverges like −ln(x_e − x) and a difference step is wider than the distance to the edge (the caller then takes
 * the bracketed path).
 */
function newtonIn(curve: Curve, A: CurvePoint, B: CurvePoint, t: number): Surface | null {
	const { d, l } = curve;
	const tipOf = (p: CurvePoint): number => (p.surface ? p.surface.zstar : p.zeta <= 0 ? l / vacuumWidthFactor(d) : curve.static.zstar);
	const w = (t - A.t) / (B.t - A.t);
	if (!(w >= 0 && w <= 1)) return null;
	let zeta = A.zeta + w * (B.zeta - A.zeta);
	let x = (1 - w) * Math.log(tipOf(A)) + w * Math.log(tipOf(B));
	const lnl = Math.log(l);
	const inBracket = (z: number) => z > A.zeta && z < B.zeta && z > 0 && z < 1;
	if (!inBracket(zeta)) return null;
	let s = surfaceAt(d, Math.exp(x), zeta);
	if (!s) return null;
	let f0 = Math.log(s.l) - lnl;
	let f1 = s.t - t;
	for (let k = 0; k < 10; k++) {
		if (Math.abs(f0) < 2e-15 && Math.abs(f1) < 2e-15 * Math.max(1, Math.abs(t))) return s;
		// near the edge the difference step would straddle it: leave this bracket to the safe path
		if (!surfaceExists(d, Math.exp(x + 4 * H_X), zeta)) return null;
		const hz = H_Z * Math.min(zeta, 1 - zeta);
		const sx = surfaceAt(d, Math.exp(x - H_X), zeta);
		const sz = surfaceAt(d, Math.exp(x), zeta - hz);
		if (!sx || !sz) return null;
		const j00 = (f0 - (Math.log(sx.l) - lnl)) / H_X;
		const j10 = (f1 - (sx.t - t)) / H_X;
		const j01 = (f0 - (Math.log(sz.l) - lnl)) / hz;
		const j11 = (f1 - (sz.t - t)) / hz;
		const det = j00 * j11 - j01 * j10;
		if (!(Math.abs(det) > 0) || !Number.isFinite(det)) return null;
		const dx = -(j11 * f0 - j01 * f1) / det;
		const dz = -(-j10 * f0 + j00 * f1) / det;
		// damped: halve the step until it stays in the bracket, finds a surface and does not increase |F|
		const norm = Math.abs(f0) + Math.abs(f1);
		let lam = 1;
		let next: Surface | null = null;
		for (let h = 0; h < 12; h++, lam *= 0.5) {
			const zn = zeta + lam * dz;
			if (!inBracket(zn)) continue;
			const c = surfaceAt(d, Math.exp(x + lam * dx), zn);
			if (!c) continue;
			const g0 = Math.log(c.l) - lnl;
			const g1 = c.t - t;
			if (Math.abs(g0) + Math.abs(g1) < norm || lam < 1e-3) {
				next = c;
				x += lam * dx;
				zeta = zn;
				f0 = g0;
				f1 = g1;
				break;
			}
		}
		if (!next) return null;
		s = next;
	}
	return null;
}
