import { HoloError } from '../errors';
import { solveStrip, vacuumWidthFactor } from '../strip';
import { braneSlice, buildCurve, completeCurve, surfacesAt, type Curve } from './curve';
import type { Surface } from './family';
import { saturationTime } from './solve';

/** One candidate extremal surface at (l, t), in the user's units. */
export interface HrtSurface {
	kind: 'vacuum' | 'shell' | 'static';
	dA: number;
	zstar: number;
	/** shell crossing z_c (NaN for the static and vacuum surfaces) */
	zc: number;
	/** deepest point reached outside the shell (z_t > z_c when the refracted surface climbs) */
	zturn: number;
	/** some of the surface lies at z > zh after the shell */
	behindHorizon: boolean;
	/** conserved E (units zh^{d−1}·… as in PHYSICS.md) — dΔA/dt = 2|E|/z*^{d−1} */
	E: number;
	/** a near-critical family member's label (climb.ts), so its profile is traced in the same variables */
	critical?: { branch: 'climb' | 'pass'; lam: number };
}

export interface HrtAnswer {
	d: number;
	zh: number;
	l: number;
	t: number;
	/** ΔA(t) of the smallest extremal surface */
	dA: number;
	regime: 'before' | 'growing' | 'saturated';
	winner: HrtSurface;
	/** all extremal surfaces found, smallest area first */
	surfaces: HrtSurface[];
	/** ΔA(runner-up) − ΔA(winner), NaN when there is one surface */
	gap: number;
	/** the static surface's first time t_sat = ∫₀^{z*} dz/f (it is a solution for t ≥ t_sat) */
	tsat: number;
}

const CACHE = new Map<string, Curve>();
const CACHE_MAX = 16;

/** The brane strip of the saturated candidate per (d, zh, l): a growth sweep asks it at every late time. */
const STATIC = new Map<string, ReturnType<typeof solveStrip>>();

/** Forgets the cached family curves and static strips: at the start of every pad line (lang/evaluate.ts runLine,
 * so a line's numbers do not depend on earlier lines), and in benchmarks that time cold points. */
export function clearQuenchCache(): void {
	CACHE.clear();
	STATIC.clear();
}

function staticStrip(d: number, zh: number, l: number): ReturnType<typeof solveStrip> {
	const key = `${d}:${zh}:${l}`;
	let st = STATIC.get(key);
	if (!st) {
		st = solveStrip(braneSlice(d, zh), l);
		if (STATIC.size >= CACHE_MAX) STATIC.delete(STATIC.keys().next().value as string);
		STATIC.set(key, st);
	}
	return st;
}

/**
 * The family curve of width L = l/zh as far as it is built (cached: a growth sweep at one width reuses it for every
 * time). A single point leaves its extrema pending (curve.ts: they are located only for times near them), so a cold
 * point costs the grid; later points locate what they need in the same cached curve.
 */
function cachedCurve(d: number, L: number): Curve {
	const key = `${d}:${L}`;
	let c = CACHE.get(key);
	if (!c) {
		c = buildCurve(d, L, false);
		if (CACHE.size >= CACHE_MAX) CACHE.delete(CACHE.keys().next().value as string);
		CACHE.set(key, c);
	}
	return c;
}

/** The whole family curve of width L = l/zh, every extremum located (growth.ts reads all of it). */
export function curveFor(d: number, L: number): Curve {
	const c = cachedCurve(d, L);
	completeCurve(c);
	return c;
}

function checkInputs(d: number, zh: number, l: number, t: number): void {
	if (!Number.isInteger(d) || d < 2 || d > 6) throw new HoloError('vaidya needs an integer d from 2 to 6', 'd');
	if (!(zh > 0) || !Number.isFinite(zh)) throw new HoloError('zh must be a positive number', 'zh');
	if (!(l > 0) || !Number.isFinite(l)) throw new HoloError('l must be a positive number', 'l');
	if (!Number.isFinite(t)) throw new HoloError('t must be a finite number', 't');
}

/**
 * The smallest width (in zh) the family curve is built for: below it m z*^d and the shell-crossing integrals
 * approach the doubles' range (d = 2 lost ΔA between 1e−10 and 1e−20 zh, d = 6 had no curve below 1e−60 zh), and
 * the answer is of order (m/2) t² ≤ m l²/8 anyway. Checked down to it (tests/unit/holo/vaidya-wide.test.ts): ΔA/l²
 * is a function of t/l alone for l ≪ zh (first order in m), and the early law (m/2) t².
 */
export const MIN_WIDTH = 1e-8;

/**
 * A strip narrower than MIN_WIDTH zh: from the saturation time on the answer is the static brane's ΔA (a tiny width
 * is fine physically), before it an error that says why and what ΔA is of order.
 */
function belowRange(d: number, zh: number, l: number, t: number): HrtAnswer {
	const st = staticStrip(d, zh, l);
	const tsat = saturationTime(d, st.zstar / zh, st.point.eta) * zh;
	if (t >= tsat && Number.isFinite(st.deltaArea)) {
		const s: HrtSurface = { kind: 'static', dA: st.deltaArea, zstar: st.zstar, zc: NaN, zturn: st.zstar, behindHorizon: false, E: 0 };
		return { d, zh, l, t, dA: s.dA, regime: 'saturated', winner: s, surfaces: [s], gap: NaN, tsat };
	}
	const early = 0.5 * Math.pow(zh, -d) * t * t;
	const scale = early > 0 ? `= ${early}` : '≈ 0 (below the smallest double)';
	throw new HoloError(
		`l=${l} is below the quench solver's range (l ≥ ${MIN_WIDTH} zh)`,
		'l',
		Number.isFinite(tsat) && t < tsat
			? `before saturation (t < ${tsat}) ΔA is of order (m/2)t² ${scale} (Liu & Suh 2014, t ≪ l); from t = ${tsat} on it is the brane's ΔA(l)`
			: 'the static ΔA of so narrow a strip is not resolved either'
	);
}

function fromFamily(s: Surface, zh: number, d: number): HrtSurface {
	return {
		kind: 'shell',
		dA: s.dA * Math.pow(zh, 2 - d),
		zstar: s.zstar * zh,
		zc: s.zstar * s.zeta * zh,
		zturn: s.zturn * zh,
		behindHorizon: s.behindHorizon,
		E: s.E,
		...(s.critical ? { critical: s.critical } : {})
	};
}

/**
 * The HRT ΔA of a strip of width l at boundary time t after a thin-shell quench into the brane of horizon zh
 * (PHYSICS.md, "Quench"). Units: everything is computed at zh = 1 and scaled (ΔA ∝ zh^{2−d}, lengths ∝ zh).
 * t ≤ 0: the vacuum surface, ΔA = 0 exactly. Otherwise every extremal surface of the family (curve.ts) and, for
 * t ≥ t_sat, the static brane surface are candidates; the smallest area wins. The static candidate's ΔA is the
 * brane strip's own number (solveStrip on the brane slice at this zh), so a saturated answer equals `use brane`.
 */
export function hrtDeltaArea(d: number, zh: number, l: number, t: number): HrtAnswer {
	checkInputs(d, zh, l, t);
	if (t <= 0) {
		const v: HrtSurface = {
			kind: 'vacuum',
			dA: 0,
			zstar: l / vacuumWidthFactor(d),
			zc: NaN,
			zturn: l / vacuumWidthFactor(d),
			behindHorizon: false,
			E: 0
		};
		return { d, zh, l, t, dA: 0, regime: 'before', winner: v, surfaces: [v], gap: NaN, tsat: NaN };
	}
	if (l / zh < MIN_WIDTH) return belowRange(d, zh, l, t);
	const curve = cachedCurve(d, l / zh);
	const T = t / zh;
	const cands = surfacesAt(curve, T).map((s) => fromFamily(s, zh, d));
	const tsat = curve.static.tsat * zh;
	// the static surface from t_sat on; and within rounding of t_sat when the family's own solution there (ζ → 1,
	// the static surface itself in the limit) is too close to ζ = 1 to resolve (d = 2, t one ulp below t_sat)
	if (T >= curve.static.tsat || (cands.length === 0 && T >= curve.static.tsat * (1 - 1e-13))) {
		const st = staticStrip(d, zh, l);
		cands.push({ kind: 'static', dA: st.deltaArea, zstar: st.zstar, zc: NaN, zturn: st.zstar, behindHorizon: false, E: 0 });
	}
	if (cands.length === 0) {
		// wide strips are resolved (climb.ts); what is left is a curve that did not bracket this time
		throw new HoloError(
			`no extremal surface found for l=${l} at t=${t}`,
			't',
			'the family curve of this width has no surface at this time; a nearby t may have one'
		);
	}
	cands.sort((a, b) => a.dA - b.dA);
	const winner = cands[0];
	return {
		d,
		zh,
		l,
		t,
		dA: winner.dA,
		regime: winner.kind === 'static' ? 'saturated' : 'growing',
		winner,
		surfaces: cands,
		gap: cands.length > 1 ? cands[1].dA - winner.dA : NaN,
		tsat
	};
}
