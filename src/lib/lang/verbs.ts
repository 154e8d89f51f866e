/**
 * What each verb asks of the engine at one point (one bulk, one set of quantity keys, one order). The
 * language layer adds no physics: every number here comes from src/lib/holo. Analysis parts of the engine that
 * have not landed yet are detected at run time and answer "… is not available yet" instead of a made-up value.
 */
import * as holo from '../holo/index';
import type { Bulk } from '../holo/index';
import type { Order } from './result';
import type { Verb } from './vocab';

export type VerbKind = 'scalar' | 'record' | 'series' | 'check';

export const VERB_KIND: Record<Verb, VerbKind> = {
	zstar: 'scalar',
	width: 'scalar',
	area: 'scalar',
	darea: 'scalar',
	entropy: 'scalar',
	dentropy: 'scalar',
	tent: 'scalar',
	mu: 'scalar',
	resum: 'scalar',
	energy: 'record',
	stress: 'record',
	thermo: 'record',
	validity: 'record',
	mi: 'record',
	phases: 'record',
	coeffs: 'series',
	firstlaw: 'check'
};

/** Verbs whose numeric orders are series truncations (they carry a warning outside the reliable range). */
export const SERIES_VERBS: ReadonlySet<Verb> = new Set<Verb>(['area', 'darea', 'entropy', 'dentropy', 'tent', 'mu', 'resum', 'firstlaw']);

/** Verbs that report in units of G (the pad's units, or a G= key on the line). */
export const USES_G: ReadonlySet<Verb> = new Set<Verb>(['entropy', 'dentropy', 'energy', 'stress', 'thermo', 'mi', 'firstlaw']);

export interface Point {
	bulk: Bulk;
	/** quantity keys of the line at this point: l, R, gap, zstar, tol */
	q: Record<string, number>;
	/** word-valued keys of the line: of (mu), phase (soliton strips) */
	words?: Record<string, string>;
	order: Order;
	shape: string;
	G: number;
}

/** Thrown for a verb or form whose engine part has not landed; the evaluator points it at the verb. */
export class NotAvailable extends Error {}

/**
 * The engine's analysis half (holo/analysis.ts), reached through the public index, which re-exports it.
 * Looked up by name at run time so that an index without it is not a build error: the verb then says
 * "… is not available yet" instead of answering.
 */
type Analysis = typeof import('../holo/analysis');
const surface = holo as unknown as Partial<Analysis>;
function need<K extends keyof Analysis>(name: K, what: string): Analysis[K] {
	const f = surface[name];
	if (typeof f !== 'function') throw new NotAvailable(`${what} is not available yet`);
	return f as Analysis[K];
}

function requireSeries(p: Point): number {
	if (p.order === 'exact') throw new Error('unreachable: exact order asked of a series');
	if (!p.bulk.hasSeries) {
		throw new holo.HoloError(`the ${p.bulk.name} bulk has no closed-form series: use o=exact`, 'o');
	}
	return p.order;
}

function stripDeltaArea(p: Point): number {
	const l = p.q.l!;
	if (p.bulk.name === 'soliton' && p.order === 'exact') return solitonSurfaceAt(p).areaFinite - holo.vacuumAreaFinite(p.bulk.d, l);
	if (p.order === 'exact') return holo.deltaArea(p.bulk, l);
	return holo.deltaAreaSeries(p.bulk, l, requireSeries(p));
}

function stripArea(p: Point): number {
	const l = p.q.l!;
	if (p.bulk.name === 'soliton' && p.order === 'exact') return solitonSurfaceAt(p).areaFinite;
	if (p.order === 'exact') return holo.areaFinite(p.bulk, l);
	return holo.vacuumAreaFinite(p.bulk.d, l) + holo.deltaAreaSeries(p.bulk, l, requireSeries(p));
}

/** The soliton's strip surface in the line's phase (rt by default); other bulks have one phase, the connected. */
function solitonSurfaceAt(p: Point): holo.SolitonSurface {
	const phase = (p.words?.phase ?? 'rt') as holo.SolitonPhaseChoice;
	return need('solitonSurface', 'soliton phases')({ d: p.bulk.d, z0: Number(p.bulk.params.z0) }, p.q.l!, phase);
}

/** phase=… outside the soliton: only the connected surface exists there (and it is the RT one). */
function checkPhase(p: Point): void {
	const phase = p.words?.phase;
	if (phase === undefined || p.bulk.name === 'soliton' || phase !== 'disconnected') return;
	throw new holo.HoloError(
		`the ${p.bulk.name} bulk has one strip surface (connected): phase=disconnected is for the soliton`,
		'phase',
		'use phase=rt or leave it out'
	);
}

/** What a soliton answer is about: its phase, whether that is the RT surface, and l_c, l_max beside it. */
function solitonTag(p: Point): { tag: string; note: string; fields: Record<string, number> } | undefined {
	if (p.bulk.name !== 'soliton' || p.shape === 'ball' || p.q.l === undefined) return undefined;
	const s = solitonSurfaceAt(p);
	const ph = need('solitonPhases', 'soliton phases')({ d: p.bulk.d, z0: Number(p.bulk.params.z0) });
	const which = `${s.phase}${s.minimal ? ', the RT surface' : ', not minimal'}`;
	const note =
		`${s.phase} surface (${s.minimal ? 'minimal: the RT surface' : 'not the minimal one: not the entanglement entropy'}); ` +
		`l_c = ${fmt(ph.lc)}: connected below, disconnected above; connected surfaces exist up to l_max = ${fmt(ph.lmax)}` +
		(s.phase === 'disconnected' ? '; the two sheets reach the cap z0, given as z*' : '');
	return { tag: ` [${which}]`, note, fields: { l_c: ph.lc, l_max: ph.lmax, connected: s.phase === 'connected' ? 1 : 0 } };
}

const fmt = (x: number) => String(Number(x.toPrecision(6)));

/** Which terms the finite part drops, in which scheme (PHYSICS.md, "Strip"; holo/ball.ts for balls). */
function finitePartNote(p: Point): string {
	if (p.shape === 'ball') {
		return 'S_fin = A_fin/(4G): every negative power of ε and, for even d, the ln(R/ε) term are dropped (cutoff z ≥ ε; holo/ball.ts)';
	}
	const d = p.bulk.d;
	const term = d === 2 ? '2 ln(1/ε)' : `2/(${d - 2} ε^${d - 2})`;
	return `S_fin = A_fin/(4G): the area-law term ${term} per unit transverse volume is subtracted from A (cutoff z ≥ ε, minimal subtraction: no finite term removed); ΔS needs no scheme`;
}

/** The conventions of tent and mu, per bulk (firstlaw.ts; PHYSICS.md, "First law of entanglement"). */
function firstLawNote(p: Point, verb: 'tent' | 'mu'): string | undefined {
	const n = p.bulk.name;
	if (n === 'boosted' || n === 'wave') {
		return (
			'from δΔS = α δΔE + ζ δΔP_y over (zh, v) at fixed l, ΔP_y = l T^{ty} (> 0 for v > 0): T_ent = 1/α, μ = −ζ/α. ' +
			'At small l the sign and size of μ are a convention of this split (μ < 0 and |μ| > 1 occur); the large-l limit is the thermodynamic one: ' +
			'μ → v, T_ent → T/γ'
		);
	}
	if (n === 'charged' && p.bulk.d > 2) {
		return (
			'from δΔS = α δΔE + β δΔQ over (zh, q) at fixed l: T_ent = 1/α, μ_Q = −β/α; ΔQ = l ρ with the action (R + d(d−1) − F²)/16πG, ' +
			'μ = √((d−1)/(2(d−2))) q/zh (only μ_Q ΔQ is convention-free). Large l: T_ent → T_H, μ_Q → μ'
		);
	}
	return verb === 'tent' ? 'T_ent = 1/α of δΔS = α δΔE at fixed l; large l: T_ent → T_H' : undefined;
}

/** The engine's balls live in the brane (and trivially in vacuum); its series is known to order 1. */
function ballZh(p: Point, verb: string): number | undefined {
	if (p.bulk.name === 'vacuum') return undefined;
	if (p.bulk.name !== 'brane') throw new holo.HoloError(`${verb} ball needs the brane or vacuum bulk`, 'bulk', 'use brane …');
	return p.bulk.horizon!;
}

function ballDeltaArea(p: Point, verb: string): number {
	const R = p.q.R!;
	const zh = ballZh(p, verb);
	if (zh === undefined || p.order === 0) return 0;
	if (p.order === 'exact') return need('ballDeltaArea', `${verb} ball`)(p.bulk.d, R, zh).value;
	if (p.order === 1) return need('ballDeltaAreaFirstOrder', `${verb} ball`)(p.bulk.d, R, zh);
	throw new holo.HoloError('the ball series is known to order 1: use o=1 or o=exact', 'o');
}

function ballArea(p: Point, verb: string): number {
	return need('ballVacuumAreaFinite', `${verb} ball`)(p.bulk.d) + ballDeltaArea(p, verb);
}

/** A scalar verb's value at one point, with the warning and side fields it carries. */
export interface ScalarAt {
	value: number;
	warning?: string;
	fields?: Record<string, number>;
	/** replaces the verb's symbol in the label (μ_Q for the charge chemical potential) */
	symbol?: string;
	/** appended to the label's symbol: the phase, the approximant and its error */
	tag?: string;
	/** what the value is: scheme, phase, convention */
	note?: string;
}

export function scalarAt(verb: Verb, p: Point): ScalarAt {
	const ball = p.shape === 'ball';
	checkPhase(p);
	const plain = (value: number, extra: Omit<ScalarAt, 'value'> = {}): ScalarAt => {
		const warning = ball ? undefined : warningAt(verb, p);
		const out: ScalarAt = { value, ...extra };
		if (warning) out.warning = warning;
		const sol = ['zstar', 'area', 'darea', 'entropy', 'dentropy'].includes(verb) ? solitonTag(p) : undefined;
		if (sol) {
			out.tag = (out.tag ?? '') + sol.tag;
			out.note = out.note ? `${out.note}. ${sol.note}` : sol.note;
			out.fields = { ...(out.fields ?? {}), ...sol.fields };
		}
		return out;
	};
	switch (verb) {
		case 'zstar':
			return plain(p.bulk.name === 'soliton' ? solitonSurfaceAt(p).zstar : holo.zstarOf(p.bulk, p.q.l!));
		case 'width':
			// a turning point below the cap is by definition the connected surface's
			return plain(holo.widthOf(p.bulk, p.q.zstar!), p.bulk.name === 'soliton' ? { tag: ' [connected surface]' } : {});
		case 'area':
			return plain(ball ? ballArea(p, verb) : stripArea(p));
		case 'darea':
			return plain(ball ? ballDeltaArea(p, verb) : stripDeltaArea(p));
		case 'entropy':
			return plain(holo.entropy(ball ? ballArea(p, verb) : stripArea(p), p.G), { note: finitePartNote(p) });
		case 'dentropy':
			return plain(holo.entropy(ball ? ballDeltaArea(p, verb) : stripDeltaArea(p), p.G));
		case 'tent':
			if (ball) {
				// Blanco, Casini, Hung & Myers 2013: the ball's first law holds with T = (d+1)/(2πR) at order 1
				if (p.order !== 1) throw new holo.HoloError('tent ball is known at order 1: use o=1', 'o');
				return plain(need('ballTent', 'tent ball')(p.bulk.d, p.q.R!));
			}
			{
				const note = firstLawNote(p, 'tent');
				return plain(need('tent', 'tent')(p.bulk, p.q.l!, p.order).value, note ? { note } : {});
			}
		case 'mu': {
			const r = need('mu', 'mu')(p.bulk, p.q.l!, p.order, p.words?.of as holo.MuOf | undefined);
			const note = firstLawNote(p, 'mu');
			const tag = r.of === 'charge' ? ' (conjugate to ΔQ)' : ' (conjugate to ΔP_y)';
			return plain(r.value, { symbol: r.of === 'charge' ? 'μ_Q' : 'μ', tag, ...(note ? { note } : {}) });
		}
		case 'resum': {
			const r = need('resum', 'resum')(p.bulk, p.q.l!, requireSeries(p));
			const fields: Record<string, number> = { error: r.error, series: r.series, exact: r.exact, L: r.L, M: r.M, froissart: r.froissart };
			if (r.pole) fields.pole_l = r.pole.l;
			// no resummed value without its error estimate: it is in the label, the fields and (when large) the warning
			const out: ScalarAt = { value: r.value, fields, tag: ` [${r.L}/${r.M}] ± ${Number(r.error.toPrecision(2))}` };
			out.note = 'error estimate: the largest difference from the neighbouring approximants [L−1/M], [L/M−1]';
			if (r.warning) out.warning = r.warning;
			return out;
		}
		default:
			throw new Error(`unreachable: ${verb} is not a scalar verb`);
	}
}

/** A record verb's fields at one point, named as API.md lists them. */
export function recordAt(verb: Verb, p: Point): Record<string, number> {
	switch (verb) {
		case 'stress': {
			const t = holo.stressTensor(p.bulk, p.G);
			return { tt: t.tt, ty: t.ty, xx: t.xx, yy: t.yy };
		}
		case 'thermo': {
			const t = holo.thermo(p.bulk, p.G);
			const out: Record<string, number> = { T: t.T, s: t.s, e: t.e, p: t.p };
			if (t.py !== undefined) out.py = t.py;
			if (t.mu !== undefined) out.mu = t.mu;
			if (t.rho !== undefined) out.rho = t.rho;
			return out;
		}
		case 'energy': {
			if (p.shape === 'ball') {
				const zh = ballZh(p, verb);
				return { E: zh === undefined ? 0 : need('ballEnergy', 'energy ball')(p.bulk.d, p.q.R!, zh, p.G), P: 0 };
			}
			const e = holo.energy(p.bulk, p.q.l!, p.G);
			const rho = p.bulk.name === 'charged' ? holo.thermo(p.bulk, p.G).rho : undefined;
			return rho === undefined ? { E: e.E, P: e.P } : { E: e.E, P: e.P, Q: rho * p.q.l! };
		}
		case 'validity': {
			const v = holo.validity(p.bulk, requireSeries(p), p.q.tol ?? DEFAULT_TOL);
			return { l_max: v.l_max, radius: v.radius, radius_err: v.radius_err };
		}
		case 'phases': {
			if (p.bulk.name !== 'soliton')
				throw new holo.HoloError(
					`phases is for the soliton, whose strips have two surfaces (got ${p.bulk.name})`,
					'bulk',
					'use soliton d=4 z0=1'
				);
			const ph = need('solitonPhases', 'phases')({ d: p.bulk.d, z0: Number(p.bulk.params.z0) });
			return { l_c: ph.lc, l_max: ph.lmax, zstar_c: ph.zstarC, zstar_max: ph.zstarMax, dA_dl_jump: ph.jump };
		}
		case 'mi': {
			// the engine answers I·4G (area units) and s_c/l; API.md's fields are I (entropy) and gap_crit
			const m = need('mutualInformation', 'mi')(p.bulk, p.q.l!, p.q.gap!);
			return { I: holo.entropy(m.I, p.G), gap_crit: m.gapCrit };
		}
		default:
			throw new Error(`unreachable: ${verb} is not a record verb`);
	}
}

/** validity's default tolerance: relative 1e-3, the accuracy of a quick check on a plot. */
export const DEFAULT_TOL = 1e-3;

export interface SeriesTerms {
	terms: { k: number; coeff: number; latex: string; power: number }[];
	d: number;
	/** the length the series variable is measured in: z_h, or z_p for the plane wave */
	scale: 'z_h' | 'z_p';
}

export function seriesAt(p: Point): SeriesTerms {
	const n = requireSeries(p);
	const c = holo.seriesCoeffs(p.bulk, n);
	const d = p.bulk.d;
	return {
		terms: c.map((t) => ({ k: t.k, coeff: t.value, latex: t.latex, power: t.power ?? t.k * d })),
		d,
		scale: p.bulk.name === 'wave' ? 'z_p' : 'z_h'
	};
}

export interface CheckAt {
	/** the relation checked, for the label */
	relation?: string;
	note?: string;
	lhs: number;
	rhs: number;
	residual: number;
	tolerance: number;
	pass: boolean;
	fields?: Record<string, number>;
}

/** firstlaw's default tolerance: |residual| ≤ 1e-3 · |δΔS|, relative, as for validity. */
export const FIRSTLAW_TOL = 1e-3;

export function checkAt(verb: Verb, p: Point): CheckAt {
	if (verb !== 'firstlaw') throw new Error(`unreachable: ${verb} is not a check verb`);
	if (p.shape === 'ball') return ballFirstLaw(p);
	const c = need('firstLaw', 'firstlaw')(p.bulk, p.q.l!, p.order, p.G);
	const tol = p.q.tol ?? FIRSTLAW_TOL;
	// the scale direction (δ ln zh) is the one every bulk has; a boosted bulk's second direction must hold too
	const dirs = c.shape ? [c.scale, c.shape] : [c.scale];
	const pass = dirs.every((d) => Math.abs(d.residual) <= tol * Math.abs(d.lhs));
	const fields: Record<string, number> = { alpha: c.alpha, zeta: c.zeta, tent: c.tent, mu: c.mu, residual_exact: c.scale.residualExact };
	// the second direction: δv for the boost, δ(temperature) for the wave, δq at fixed zh for the charge
	const sfx = c.conjugate === 'charge' ? 'q' : 'v';
	if (c.shape) Object.assign(fields, { [`lhs_${sfx}`]: c.shape.lhs, [`rhs_${sfx}`]: c.shape.rhs, [`residual_${sfx}`]: c.shape.residual });
	const relation =
		c.conjugate === 'charge' ? 'T_ent δΔS = δΔE − μ_Q δΔQ' : c.conjugate === 'momentum' ? 'T_ent δΔS = δΔE − μ δΔP_y' : 'T_ent δΔS = δΔE';
	const dirs2 =
		c.conjugate === 'charge'
			? 'along δzh (shown) and δq (fields *_q)'
			: c.conjugate === 'momentum'
				? 'along δzh (shown) and the second parameter (fields *_v)'
				: 'along δzh';
	const note = `${relation}, ${dirs2}; residual = the next order's term (o=exact: the relation's own rounding)`;
	return {
		relation,
		note,
		lhs: c.scale.lhs,
		rhs: c.scale.rhs,
		residual: c.scale.residual,
		tolerance: tol * Math.abs(c.scale.lhs),
		pass,
		fields
	};
}

/** What a record verb's fields mean where the names alone do not say (its scheme or convention). */
export function recordNote(verb: Verb, p: Point): string | undefined {
	if (verb === 'validity')
		return 'radius ± radius_err: Domb–Sykes extrapolation of the coefficient ratios in 1/k (charged: a fit of their growth)';
	if (verb === 'phases')
		return 'soliton strip: connected surface below l_c, disconnected (two sheets to the cap) above; dA_dl_jump = ∂A/∂l above l_c minus below';
	if (verb === 'thermo' && p.bulk.name === 'charged' && p.bulk.d > 2)
		return 'μ, ρ in the normalisation of the action (R + d(d−1) − F²)/16πG: μ = √((d−1)/(2(d−2))) q/zh, e + p = T s + μ ρ';
	if (verb === 'energy' && p.bulk.name === 'charged' && p.bulk.d > 2) return 'Q = ρ l, ρ as in thermo';
	if (verb === 'mi' && p.bulk.name === 'soliton')
		return 'each strip area is the RT (minimal) one of the connected and disconnected surfaces';
	return undefined;
}

/**
 * The ball's first law (Blanco, Casini, Hung & Myers, JHEP 08 (2013) 060): ΔS = ΔE/T with T = (d+1)/(2πR)
 * holds at first order in R^d/zh^d. The check sets the exact ΔS (shooting) against ΔE/T; the residual is the
 * second-order part, which grows like (R/zh)^{2d}.
 */
function ballFirstLaw(p: Point): CheckAt {
	const zh = p.bulk.horizon;
	if (zh === undefined) throw new NotAvailable('firstlaw ball needs a bulk with a horizon (brane)');
	const { d } = p.bulk;
	const R = p.q.R!;
	const tol = p.q.tol ?? FIRSTLAW_TOL;
	const exact = need('ballDeltaArea', 'firstlaw ball')(d, R, zh).value / (4 * p.G);
	const T = need('ballTent', 'firstlaw ball')(d, R);
	const rhs = need('ballEnergy', 'firstlaw ball')(d, R, zh, p.G) / T;
	const residual = exact - rhs;
	return {
		lhs: exact,
		rhs,
		residual,
		tolerance: tol * Math.abs(exact),
		pass: Math.abs(residual) <= tol * Math.abs(exact),
		fields: { tent: T }
	};
}

/** The warning a series value carries at this point, if any. */
export function warningAt(verb: Verb, p: Point): string | undefined {
	if (p.order === 'exact' || !SERIES_VERBS.has(verb) || !p.bulk.hasSeries) return undefined;
	const l = p.q.l;
	if (l === undefined) return undefined;
	return holo.seriesWarning(p.bulk, l, p.order) ?? undefined;
}

export function newtonG(units: holo.Units, d: number): number {
	return holo.newtonG(units, d);
}

export function makeBulk(name: string, params: Record<string, number | string>): Bulk {
	return holo.makeBulk(name, params);
}

export function isHoloError(e: unknown): e is { message: string; key?: string; hint?: string } {
	return e instanceof holo.HoloError;
}
