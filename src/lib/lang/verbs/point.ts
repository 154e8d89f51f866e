/**
 * Engine questions several verbs ask at one point: the strip's and the ball's areas at an order, the
 * soliton's surface in the line's phase, the warning a series value carries. The engine comes with the point
 * (`p.holo`), as everywhere in the registry.
 */
import type { HrtAnswer, SolitonPhaseChoice, SolitonSurface } from '../../holo/index';
import type { Point, ScalarAt } from './types';
import { shortNumber } from '../format';

/** A line's order as a whole number, for verbs and forms that need a series truncation. */
export function requireSeries(p: Point): number {
	if (p.order === 'exact') throw new Error('unreachable: exact order asked of a series');
	if (!p.bulk.series) throw new p.holo.HoloError(`the ${p.bulk.name} bulk has no closed-form series: use o=exact`, 'o');
	return p.order;
}

/**
 * The quench answer at this point (the vaidya bulk: PHYSICS.md, "Quench"), or undefined for a static bulk.
 * The key t belongs to time-dependent bulks only; in vaidya it is required and the answer is exact only.
 */
export function quenchAt(p: Point): HrtAnswer | undefined {
	const t = p.q.t;
	if (p.bulk.name !== 'vaidya') {
		if (t !== undefined) {
			throw new p.holo.HoloError(`t is the time since a quench: the ${p.bulk.name} bulk is static`, 't', 'use vaidya d=… zh=… first');
		}
		return undefined;
	}
	if (t === undefined) throw new p.holo.HoloError('vaidya needs t= (the boundary time since the quench)', 't', 'e.g. darea l=2 t=1');
	if (p.order !== 'exact') throw new p.holo.HoloError('orders do not apply to the quench: it is exact only', 'o', 'leave o= out');
	return p.holo.hrtDeltaArea(p.bulk.d, p.bulk.horizon!, p.q.l!, t);
}

/** What a quench answer carries beside its value: the winning surface's data and how it won. */
export function quenchFields(a: HrtAnswer): Pick<ScalarAt, 'fields' | 'pointNote'> {
	const w = a.winner;
	const fields: Record<string, number> = {
		t: a.t,
		zstar: w.zstar,
		surfaces: a.surfaces.length,
		behind_horizon: w.behindHorizon ? 1 : 0,
		saturated: a.regime === 'saturated' ? 1 : 0,
		t_c: a.tsat
	};
	if (Number.isFinite(w.zc)) fields.zc = w.zc;
	if (w.kind === 'shell') fields.zturn = w.zturn;
	if (Number.isFinite(a.gap)) fields.gap = a.gap;
	const which =
		w.kind === 'vacuum'
			? 'before the quench: the vacuum surface'
			: w.kind === 'static'
				? 'saturated: the static brane surface'
				: `the surface crossing the shell at z_c${w.behindHorizon ? ' (partly behind the horizon)' : ''}`;
	const of = a.surfaces.length > 1 ? `; smallest of ${a.surfaces.length} extremal surfaces, next by ${Number(a.gap.toPrecision(4))}` : '';
	return { fields, pointNote: `HRT surface: ${which}${of}` };
}

export function stripDeltaArea(p: Point): number {
	const l = p.q.l!;
	const quench = quenchAt(p);
	if (quench) return quench.dA;
	if (p.bulk.name === 'soliton' && p.order === 'exact') return solitonSurfaceAt(p).areaFinite - p.holo.vacuumAreaFinite(p.bulk.d, l);
	if (p.order === 'exact') return p.holo.deltaArea(p.bulk, l);
	return p.holo.deltaAreaSeries(p.bulk, l, requireSeries(p));
}

export function stripArea(p: Point): number {
	const l = p.q.l!;
	if (p.bulk.name === 'soliton' && p.order === 'exact') return solitonSurfaceAt(p).areaFinite;
	if (p.order === 'exact') return p.holo.areaFinite(p.bulk, l);
	return p.holo.vacuumAreaFinite(p.bulk.d, l) + p.holo.deltaAreaSeries(p.bulk, l, requireSeries(p));
}

/** The soliton's strip surface in the line's phase (rt by default); other bulks have one phase, the connected. */
export function solitonSurfaceAt(p: Point): SolitonSurface {
	const phase = (p.words.phase ?? 'rt') as SolitonPhaseChoice;
	return p.holo.solitonSurface({ d: p.bulk.d, z0: Number(p.bulk.params.z0) }, p.q.l!, phase);
}

/** phase=… outside the soliton: only the connected surface exists there (and it is the RT one). */
function checkPhase(p: Point): void {
	const phase = p.words.phase;
	if (phase === undefined || p.bulk.name === 'soliton' || phase !== 'disconnected') return;
	throw new p.holo.HoloError(
		`the ${p.bulk.name} bulk has one strip surface (connected): phase=disconnected is for the soliton`,
		'phase',
		'use phase=rt or leave it out'
	);
}

/**
 * What a soliton strip answer is about: its phase, whether that is the RT surface, and l_c, l_max beside it.
 * Every verb with a phase= key passes its answer through here, so a phase the bulk lacks is refused here too.
 */
export function withSolitonPhase(p: Point, out: ScalarAt): ScalarAt {
	checkPhase(p);
	if (p.bulk.name !== 'soliton' || p.shape === 'ball' || p.q.l === undefined) return out;
	const s = solitonSurfaceAt(p);
	const ph = p.holo.solitonPhases({ d: p.bulk.d, z0: Number(p.bulk.params.z0) });
	const which = `${s.phase}${s.minimal ? ', the RT surface' : ', not minimal'}`;
	const note =
		`${s.phase} surface (${s.minimal ? 'minimal: the RT surface' : 'not the minimal one: not the entanglement entropy'}); ` +
		`l_c = ${shortNumber(ph.lc)}: connected below, disconnected above; connected surfaces exist up to l_max = ${shortNumber(ph.lmax)}` +
		(s.phase === 'disconnected' ? '; the two sheets reach the cap z0, given as z*' : '');
	return {
		...out,
		tag: `${out.tag ?? ''} [${which}]`,
		note: out.note ? `${out.note}. ${note}` : note,
		fields: { ...(out.fields ?? {}), l_c: ph.lc, l_max: ph.lmax, connected: s.phase === 'connected' ? 1 : 0 }
	};
}

/** The engine's balls live in the brane (and trivially in vacuum). */
export function ballZh(p: Point, verb: string): number | undefined {
	if (p.bulk.name === 'vacuum') return undefined;
	if (p.bulk.name !== 'brane') throw new p.holo.HoloError(`${verb} ball needs the brane or vacuum bulk`, 'bulk', 'use brane …');
	return p.bulk.horizon!;
}

/** The ball's ΔA: exact by shooting, or its series, known to order 1 (Blanco, Casini, Hung & Myers 2013). */
export function ballDeltaArea(p: Point, verb: string): number {
	const R = p.q.R!;
	const zh = ballZh(p, verb);
	if (zh === undefined || p.order === 0) return 0;
	if (p.order === 'exact') return exactBall(p, R, zh);
	if (p.order === 1) return p.holo.ballDeltaAreaFirstOrder(p.bulk.d, R, zh);
	throw new p.holo.HoloError('the ball series is known to order 1: use o=1 or o=exact', 'o');
}

/**
 * The exact ball, started from the previous point's tip in a sweep (holo/ball.ts, ballStartFrom).
 * A warm start that fails is retried cold, so a sweep answers whatever its points would answer one by one.
 */
function exactBall(p: Point, R: number, zh: number): number {
	const c = p.carry;
	const d = p.bulk.d;
	const from = p.holo.ballStartFrom(c?.ballTrail, d, R, zh);
	let r: ReturnType<Point['holo']['ballDeltaArea']>;
	try {
		r = p.holo.ballDeltaArea(d, R, zh, undefined, from);
	} catch (e) {
		if (from === undefined || !(e instanceof p.holo.HoloError)) throw e;
		r = p.holo.ballDeltaArea(d, R, zh);
	}
	if (c) c.ballTrail = p.holo.extendBallTrail(c.ballTrail, d, R, zh, r.from);
	return r.value;
}

export function ballArea(p: Point, verb: string): number {
	return p.holo.ballVacuumAreaFinite(p.bulk.d) + ballDeltaArea(p, verb);
}

/** The warning a series value of a strip carries at this point, if any. */
export function seriesWarningAt(p: Point): string | undefined {
	if (p.order === 'exact' || !p.bulk.series || p.shape === 'ball') return undefined;
	const l = p.q.l;
	if (l === undefined) return undefined;
	return p.holo.seriesWarning(p.bulk, l, p.order, p.validityTol) ?? undefined;
}

/** `along=m,q` as the list of names the engine takes (undefined when the line has no along=). */
export function alongOf(p: Point): string[] | undefined {
	const a = p.words.along;
	return a === undefined ? undefined : a.split(',');
}

/** A value with the series warning of its point attached (when the verb's orders are truncations). */
export function valueAt(p: Point, value: number, extra: Omit<ScalarAt, 'value'> = {}): ScalarAt {
	const warning = seriesWarningAt(p);
	return warning ? { value, ...extra, warning } : { value, ...extra };
}
