import { makeBrane } from '../bulks/brane';
import { findRootBrent } from '../numeric/brent';
import { minimizeBrent } from '../numeric/minimize';
import { solveStrip, vacuumWidthFactor } from '../strip';
import { criticalBetween, criticalForWidth } from './climb';
import { QUAD_TOL } from './quad';
import { surfaceAt, surfaceExists, type Surface } from './family';
import type { Slice } from '../types';
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
 *
 * The grid is traced by continuation along ζ (each tip predicted from its neighbours, tipAt), and an extremum is
 * located only when a time asks for it (`pending`, prepareFor): a time below a sampled maximum (above a sampled
 * minimum) already has its solutions bracketed by the grid, and one far above it (below) has none there, so a
 * single point of a growth curve usually skips that search. A full curve (completeCurve) locates them all.
 */
export interface Curve {
	d: number;
	l: number;
	points: CurvePoint[];
	static: { zstar: number; eta: number; dA: number; tsat: number };
	/** interior extrema of t seen on the grid and not located yet (b between its grid neighbours a and c) */
	pending: Pending[];
	/** refinement thresholds (1/16 of the grid's range of t and of ΔA) and the midpoints that had no surface */
	jumpT: number;
	jumpA: number;
	/** no refinement where both ends of an interval are later than this (refineScales) */
	tFar: number;
	failed: Set<number>;
	/** every interval refined and every extremum located */
	complete: boolean;
	/** new points are solved loosely (LOOSE): a lazily built curve, until completeCurve */
	loose: boolean;
}

interface Pending {
	a: CurvePoint;
	b: CurvePoint;
	c: CurvePoint;
	/** +1 a maximum of t, −1 a minimum */
	sgn: number;
}

const GRID = 24;
const MAX_POINTS = 400;

/** A point of the curve as curve.ts keeps it: `slope` is dF/dx at its tip (F = ln(l(x)/l), x = ln z*) from the
 * last secant step that found it (the neighbours' slopes start the next tip's secant with a near-Newton step);
 * `located` marks an extremum found by the minimiser (not a grid sample). */
interface GridPoint extends CurvePoint {
	slope?: number;
	located?: boolean;
	/** solved to LOOSE only (its t and ΔA good to ~1e−7 relative): it may bracket, not answer */
	loose?: boolean;
}

/**
 * The tolerance of a lazily built curve's points (|ln(l(z*)/l)| and the integrals' relative tolerance): they only
 * bracket the solutions at a time, which are then solved exactly, so the grid of a cold point need not be exact —
 * about half the integrand calls per surface and one or two secant steps less per point (a cold d = 4, l = 4 zh
 * point 2.6× faster with the critical solves' own savings). A point whose time is within UPGRADE of an asked time
 * is solved exactly before the brackets are read (its t is off by ~1e−7 relative at most, a thousandth of that
 * margin), and a loosely located extremum that close is located again (relocate), so no bracket's sign depends on
 * a loose value; completeCurve makes every point exact. Checked: 540 cold points at d = 2…6 against exact curves
 * (the same surfaces, ΔA to 1e−11), and the pair just below each fold (tests/unit/holo/vaidya.test.ts).
 */
const LOOSE = 1e-7;
const UPGRADE = 1e-4;

/**
 * The brane slice per (d, zh), kept: the strip solver prepares its quadrature nodes once per slice object (~0.2 ms,
 * a tenth of a cold quench point), so a fresh makeBrane per call would pay that every time.
 */
const SLICES = new Map<string, Slice>();

export function braneSlice(d: number, zh: number): Slice {
	const key = `${d}:${zh}`;
	let s = SLICES.get(key);
	if (!s) {
		s = makeBrane({ d, zh }).slice;
		if (SLICES.size >= 16) SLICES.delete(SLICES.keys().next().value as string);
		SLICES.set(key, s);
	}
	return s;
}

function tipOf(curve: { l: number; d: number; static: { zstar: number } }, p: CurvePoint): number {
	return p.surface ? p.surface.zstar : p.zeta <= 0 ? curve.l / vacuumWidthFactor(curve.d) : curve.static.zstar;
}

/**
 * The surface of width l at ζ from a predicted tip x0 = ln z* and slope m ≈ dF/dx (F = ln(l(x)/l)): secant steps
 * from a Newton-like first step. The grid's neighbours predict the tip to ~1e−4 and the slope to a few per cent,
 * so three to five surface evaluations reach |F| < GRID_TOL, where the general solver (surfaceForWidth, from one
 * guess and slope 1) takes ~7. Anything unusual — no surface at a trial tip (the family's edge: wide strips), a
 * step that does not shrink |F| — hands over to surfaceForWidth from the best tip so far, so the answer is the
 * same surface either way.
 */
/**
 * |ln(l(z*)/l)| accepted for a point of the curve: the width's own integrals are accurate to ~1e−14 (quad.ts), so
 * this is as close as they can tell, and the points only bracket the solutions — each answer at (l, t) is then
 * polished to 2e−15 by newtonIn (or the bracketed path), whatever tip its bracket started from.
 */
const GRID_TOL = 1e-13;

function tipAt(d: number, l: number, zeta: number, x0: number, m0: number, loose?: number, hint?: CurvePoint): CurvePoint | null {
	// a neighbour that is a critical surface (climb.ts) on the side of a = 1 the predicted tip is on: the critical
	// solve at once, from its λ (λ moves by ~0.2 between grid points, against ~2 from a fixed start: a secant step
	// less), where the (z*, ζ) probes below would only meet the family's edge first. Only then: a climbing surface
	// far from z_m (a > 1 but λ near its largest value) has no crossing at some ζ in (z*, λ), and a probe's branch
	// alone would send it there; and only from a neighbour that hugs z_m (λ < DEEP): one nearer its branch's end is
	// solved faster in (z*, ζ), as before
	const side = 0.5 * Math.exp(d * (x0 + Math.log(zeta))) > 1 ? 'climb' : 'pass';
	const near = hint?.surface?.critical?.branch === side ? hint.surface.critical.lam : undefined;
	if (near !== undefined && near < DEEP) {
		const c = criticalForWidth(d, l, zeta, x0, side, near, loose);
		if (c) return made(zeta, c, m0, loose);
	}
	const lnl = Math.log(l);
	const tol = loose ?? GRID_TOL;
	const quadTol = loose ?? QUAD_TOL;
	let x = x0;
	let s = surfaceAt(d, Math.exp(x), zeta, quadTol);
	let m = m0 > 0 && Number.isFinite(m0) ? m0 : 1;
	if (s) {
		let F = Math.log(s.l) - lnl;
		for (let k = 0; k < 8; k++) {
			if (Math.abs(F) < tol) return made(zeta, s, m, loose);
			const xn = x - F / m;
			const small = Math.abs(xn - x) < 1e-14 * Math.max(1, Math.abs(x));
			const c = surfaceAt(d, Math.exp(xn), zeta, quadTol);
			if (!c) break;
			const Fn = Math.log(c.l) - lnl;
			// rounding reached (as surfaceForWidth's own stop): keep the better of the two
			if (small) return made(zeta, Math.abs(Fn) < Math.abs(F) ? c : s, m, loose);
			if (!(Math.abs(Fn) < Math.abs(F))) break;
			const mn = (Fn - F) / (xn - x);
			if (!(mn > 0) || !Number.isFinite(mn)) break;
			m = mn;
			x = xn;
			F = Fn;
			s = c;
		}
	}
	const r = surfaceForWidth(d, l, zeta, Math.exp(x), loose);
	return r ? made(zeta, r, m, loose) : null;
}

/** λ below which a critical neighbour's λ starts the next grid point's critical solve (tipAt). */
const DEEP = -5;

function made(zeta: number, s: Surface, slope: number, loose?: number): GridPoint {
	return loose === undefined ? { zeta, t: s.t, dA: s.dA, surface: s, slope } : { zeta, t: s.t, dA: s.dA, surface: s, slope, loose: true };
}

/** The exact point at a loose one's ζ, from its tip (and λ when critical): one or two secant steps. */
function exactAt(curve: Curve, p: GridPoint): GridPoint | null {
	const s = p.surface!;
	if (s.critical) {
		const c = criticalForWidth(curve.d, curve.l, p.zeta, Math.log(s.zstar), s.critical.branch, s.critical.lam, undefined, true);
		if (c) return { ...made(p.zeta, c, p.slope ?? 1), located: p.located };
	}
	const q = tipAt(curve.d, curve.l, p.zeta, Math.log(s.zstar), p.slope ?? 1);
	return q ? { ...q, located: p.located } : null;
}

/**
 * Makes every loose point that `which` selects exact, in place; a point with no exact surface (a loose solve at the
 * family's edge that rounding cannot confirm) is dropped, as a grid point without a surface would have been.
 */
function upgrade(curve: Curve, which: (p: GridPoint) => boolean): void {
	const pts = curve.points as GridPoint[];
	for (let i = pts.length - 1; i >= 0; i--) {
		const p = pts[i];
		if (!p.loose || !which(p)) continue;
		const q = exactAt(curve, p);
		if (q) pts[i] = q;
		else pts.splice(i, 1);
	}
}

/**
 * Lagrange interpolation (or extrapolation) at ζ through up to four solved points, in q = √(1 − ζ): the grid is
 * uniform in q, and the tip and the slope are smooth in q up to ζ = 1 where they vary fastest in ζ.
 */
function lagrange(near: CurvePoint[], ys: number[], zeta: number): number {
	const q = Math.sqrt(1 - zeta);
	const qs = near.map((p) => Math.sqrt(1 - p.zeta));
	let y = 0;
	for (let i = 0; i < near.length; i++) {
		let w = 1;
		for (let j = 0; j < near.length; j++) if (j !== i) w *= (q - qs[j]) / (qs[i] - qs[j]);
		y += w * ys[i];
	}
	return y;
}

/** The grid point at ζ predicted from its solved neighbours `near` (those with a family surface, or ζ = 0). */
function pointNear(curve: Curve, near: CurvePoint[], zeta: number): CurvePoint | null {
	const use = near.filter((p) => p.surface || p.zeta <= 0);
	const loose = curve.loose ? LOOSE : undefined;
	if (!use.length) return tipAt(curve.d, curve.l, zeta, Math.log(curve.l / vacuumWidthFactor(curve.d)), 1, loose);
	const x = lagrange(
		use,
		use.map((p) => Math.log(tipOf(curve, p))),
		zeta
	);
	// the slope is 1 for the vacuum (ζ = 0); a neighbour solved by the fallback has none: start from 1 then
	const ms = use.map((p) => (p.zeta <= 0 ? 1 : (p as GridPoint).slope));
	const m = ms.every((v) => v !== undefined) ? lagrange(use, ms as number[], zeta) : 1;
	// the neighbour nearest in ζ (on either side when refining) lends its λ to a critical solve
	const hint = use.reduce((a, b) => (Math.abs(b.zeta - zeta) < Math.abs(a.zeta - zeta) ? b : a));
	return tipAt(curve.d, curve.l, zeta, x, m, loose, hint);
}

/**
 * The family curve of width l: the grid and (full = true) every refinement and extremum; with full = false only
 * the grid, the rest done near the times asked (surfacesAt) or all at once (completeCurve).
 */
export function buildCurve(d: number, l: number, full = true): Curve {
	const st = solveStrip(braneSlice(d, 1), l);
	const tsat = saturationTime(d, st.zstar, st.point.eta);
	const stat = { zstar: st.zstar, eta: st.point.eta, dA: st.deltaArea, tsat };
	const pts: CurvePoint[] = [{ zeta: 0, t: 0, dA: 0, surface: null }];
	const curve: Curve = {
		d,
		l,
		points: pts,
		static: stat,
		pending: [],
		jumpT: 0,
		jumpA: 0,
		tFar: Infinity,
		failed: new Set(),
		complete: false,
		loose: !full
	};
	for (let k = 1; k < GRID; k++) {
		const p = k / GRID;
		const zeta = 1 - (1 - p) * (1 - p);
		const c = pointNear(curve, pts.slice(-4), zeta);
		if (!c) continue;
		pts.push(c);
	}
	pts.push({ zeta: 1, t: tsat, dA: stat.dA, surface: null });
	const { tr, ar, tFar } = refineScales(pts);
	curve.jumpT = tr / 16;
	curve.jumpA = ar / 16;
	curve.tFar = tFar;
	curve.pending = extremaOf(pts);
	if (full || !simple(pts)) completeCurve(curve);
	return curve;
}

/**
 * At most two interior extrema of t (the fold near saturation and its partner minimum): the shape the laziness
 * of prepareFor relies on. More means rounding noise (PHYSICS.md's pitfalls; wide strips in d ≥ 5 showed it before
 * the critical surfaces of climb.ts): there the whole curve is built, exactly as for a growth analysis, and no time
 * skips a search.
 */
function simple(pts: CurvePoint[]): boolean {
	let n = 0;
	for (let i = 1; i + 1 < pts.length; i++) {
		const a = pts[i - 1].t;
		const b = pts[i].t;
		const c = pts[i + 1].t;
		if (!((b > a && b >= c) || (b < a && b <= c))) continue;
		// a wiggle no larger than the points' own accuracy is no fold: refinement deep in a wide strip's steep rise
		// puts points 1e−13 apart in ζ, whose times then differ by their integrals' noise alone
		const noise = ((pts[i] as GridPoint).loose ? 10 * LOOSE : 1e-12) * Math.max(1, Math.abs(b));
		if (Math.abs(b - 0.5 * (a + c)) > noise) n++;
	}
	return n <= 2;
}

/** Refines every interval and locates every extremum (a growth analysis reads the whole curve). */
export function completeCurve(curve: Curve): void {
	if (curve.complete) return;
	if (curve.loose) {
		// every point exact, and the extrema located again on exact points (a loose one is good to ~1e−5 in ζ)
		curve.points = curve.points.filter((p) => !((p as GridPoint).located && (p as GridPoint).loose));
		upgrade(curve, () => true);
		curve.loose = false;
		curve.pending = extremaOf(curve.points);
	}
	if (refine(curve, NaN)) curve.pending = extremaOf(curve.points);
	locate(curve, curve.pending);
	curve.pending = [];
	curve.complete = true;
}

/**
 * Makes the curve ready for the solutions of t(ζ) = t: refines the intervals near t, then locates the pending
 * extrema near which t could have solutions that the grid does not bracket. A maximum b hides crossings only when
 * t ≥ t_b and t is below the true maximum, which is bounded by the parabola through a, b, c (t_max − t_b ≤
 * Δt_c h_a²/(4h_c²) with the vertex on a's side, Δt_a h_c²/(4h_a²) on c's; t(ζ) is smooth there); four times that
 * bound is the margin beyond which no solution can hide. Minima mirror this.
 */
function prepareFor(curve: Curve, t: number): void {
	if (curve.complete) return;
	if (refine(curve, t)) {
		if (!simple(curve.points)) return completeCurve(curve);
		curve.pending = extremaOf(curve.points);
	}
	const hidden = (p: Pending): boolean => {
		const { a, b, c, sgn } = p;
		const up = sgn * (t - b.t);
		if (up < 0) return false;
		const ha = b.zeta - a.zeta;
		const hc = c.zeta - b.zeta;
		const da = sgn * (b.t - a.t);
		const dc = sgn * (b.t - c.t);
		const margin = Math.max((dc * ha * ha) / (hc * hc), (da * hc * hc) / (ha * ha));
		return up <= margin;
	};
	const now = curve.pending.filter(hidden);
	if (now.length) {
		locate(curve, now);
		curve.pending = curve.pending.filter((p) => !now.includes(p));
	}
	const margin = UPGRADE * Math.max(1, Math.abs(t));
	relocate(curve, (p) => Math.abs(p.t - t) <= margin);
	upgrade(curve, (p) => Math.abs(p.t - t) <= margin);
}

/**
 * Locates again, on exact points, every loosely located extremum that `which` selects: a loose minimiser finds
 * t_max only to ~1e−7 (its points' own accuracy), and a time between that and the true t_max would find its
 * pair of surfaces near the fold unbracketed. Costs ~10 exact tips, paid only by times that close to a fold.
 */
function relocate(curve: Curve, which: (p: GridPoint) => boolean): void {
	const pts = curve.points as GridPoint[];
	const redo: Pending[] = [];
	for (let i = 1; i + 1 < pts.length; i++) {
		const b = pts[i];
		if (!b.located || !b.loose || !which(b)) continue;
		redo.push({ a: pts[i - 1], b, c: pts[i + 1], sgn: b.t >= pts[i - 1].t ? 1 : -1 });
	}
	if (!redo.length) return;
	curve.points = pts.filter((p) => !redo.some((r) => r.b === p));
	const loose = curve.loose;
	curve.loose = false;
	locate(curve, redo);
	curve.loose = loose;
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

/**
 * Bisects grid intervals where t or ΔA moves by more than 1/16 of its range (the steep linear-growth part); with
 * a time t (not NaN) only those whose range of t, widened by that 1/16, contains t — the others cannot hold a
 * solution at this resolution, and a later time or completeCurve refines them. True when points were added.
 */
function refine(curve: Curve, t: number): boolean {
	const pts = curve.points;
	const near = (A: CurvePoint, B: CurvePoint) =>
		Number.isNaN(t) || (t >= Math.min(A.t, B.t) - curve.jumpT && t <= Math.max(A.t, B.t) + curve.jumpT);
	let added = false;
	for (let i = 0; i + 1 < pts.length && pts.length < MAX_POINTS;) {
		const A = pts[i];
		const B = pts[i + 1];
		const jump = (Math.abs(B.t - A.t) > curve.jumpT || Math.abs(B.dA - A.dA) > curve.jumpA) && Math.min(A.t, B.t) < curve.tFar;
		const mid = 0.5 * (A.zeta + B.zeta);
		if (jump && B.zeta - A.zeta > 1e-12 * B.zeta && B.zeta < 1 && near(A, B) && !curve.failed.has(mid)) {
			const c = pointNear(curve, pts.slice(Math.max(0, i - 1), i + 3), mid);
			if (c) {
				pts.splice(i + 1, 0, c);
				added = true;
				continue;
			}
			curve.failed.add(mid);
		}
		i++;
	}
	return added;
}

/**
 * The interior local extrema of t on the grid worth locating: the family has one fold near saturation (and its
 * partner minimum when t overshoots), so the two most prominent; rounding wiggles in the steep part of a wide
 * strip's curve are not folds.
 */
function extremaOf(pts: CurvePoint[]): Pending[] {
	const cand: { p: Pending; prom: number }[] = [];
	for (let i = 1; i + 1 < pts.length; i++) {
		const a = pts[i - 1];
		const b = pts[i];
		const c = pts[i + 1];
		const sgn = b.t > a.t && b.t >= c.t ? 1 : b.t < a.t && b.t <= c.t ? -1 : 0;
		if (!sgn || c.zeta >= 1 || a.zeta <= 0) continue;
		cand.push({ p: { a, b, c, sgn }, prom: Math.abs(b.t - 0.5 * (a.t + c.t)) });
	}
	cand.sort((x, y) => y.prom - x.prom);
	// located ones keep their place among the two (they are the folds) but need no second search
	return cand
		.slice(0, 2)
		.map((c) => c.p)
		.filter((p) => !(p.b as GridPoint).located);
}

/** Inserts each extremum of `which` (Brent's minimiser on its three grid points), located to 1e−6 in ζ. */
function locate(curve: Curve, which: Pending[]): void {
	const pts = curve.points;
	const found: CurvePoint[] = [];
	for (const { a, b, c, sgn } of which) {
		// Brent's minimiser of −sgn·t(ζ) on the bracket (parabolic steps on this smooth extremum: ~8 evaluations
		// where golden section alone took ~25), to 1e−6 in ζ, so t at the extremum to ~1e−12; each tip is
		// predicted from the three grid points around it
		let best: CurvePoint | null = null;
		minimizeBrent(
			(zeta) => {
				const p = pointNear(curve, [a, b, c], zeta);
				if (!p) return NaN;
				if (!best || sgn * p.t > sgn * best.t) best = p;
				return -sgn * p.t;
			},
			a.zeta,
			c.zeta,
			1e-6,
			60
		);
		if (best) {
			found.push(best);
			(best as GridPoint).located = true;
		}
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
	prepareFor(curve, t);
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
	const w = (t - A.t) / (B.t - A.t);
	if (!(w >= 0 && w <= 1)) return null;
	let zeta = A.zeta + w * (B.zeta - A.zeta);
	let x = (1 - w) * Math.log(tipOf(curve, A)) + w * Math.log(tipOf(curve, B));
	const lnl = Math.log(l);
	const inBracket = (z: number) => z > A.zeta && z < B.zeta && z > 0 && z < 1;
	if (!inBracket(zeta)) return null;
	let s = surfaceAt(d, Math.exp(x), zeta);
	if (!s) return null;
	let f0 = Math.log(s.l) - lnl;
	let f1 = s.t - t;
	const atRounding = () => Math.abs(f0) < NEWTON_TOL && Math.abs(f1) < NEWTON_TOL * Math.max(1, Math.abs(t));
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
		// no descent: at the integrals' rounding (|F| ~ 1e−14; t itself carries a few ulps) that is convergence, as
		// in climb.ts newtonCritical; else a dead end for the bracketed path
		if (!next) return atRounding() ? s : null;
		s = next;
	}
	// steps that still "descend" at rounding level (the damped step takes any trial once it is short) end here
	return atRounding() ? s : null;
}

/** The residual (ln of the width, time in zh) newtonIn accepts once its steps stop descending. */
const NEWTON_TOL = 1e-13;
