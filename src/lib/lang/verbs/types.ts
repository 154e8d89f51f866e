/**
 * What a verb is: one object per verb (its forms and keys, the kind of answer, its symbol, its help with
 * method, accuracy and source, its examples) and the function that evaluates it at one point. The runner
 * (../run-verb.ts) does everything else — keys, sweeps, orders, tables, sinks — the same way for every verb.
 *
 * Types only at run time: a verb module reaches the engine through `Point.holo`, never by import, so that
 * the registry ships to the browser without the numerics.
 */
import type { Engine } from '../engine';
import type { BallTrail, Bulk } from '../../holo/index';
import type { Order, PlotGuide } from '../result';

export interface VerbForm {
	/** quantity keys this form takes (bulk keys are always allowed) */
	keys: readonly string[];
	required: readonly string[];
}

/** One evaluation point: one bulk, one set of quantity keys, one order. */
export interface Point {
	holo: Engine;
	bulk: Bulk;
	/** quantity keys of the line at this point: l, R, gap, zstar, tol */
	q: Record<string, number>;
	/** word-valued keys of the line: of (mu), phase (soliton strips) */
	words: Record<string, string>;
	order: Order;
	/** the form's subject: strip, ball, pair, darea, or '' */
	shape: string;
	/** Newton's constant in force on this line (a G= key, or the pad's units for verbs that use G) */
	G: number;
	/** the pad's relative validity tolerance (series warnings, `validity` without tol=) */
	validityTol: number;
	/**
	 * What the previous point of the same sweep and order left for this one (a sweep walks its points in order):
	 * one object per line and order, absent for a single point. Only a start, never the answer: a verb must give
	 * the same value with or without it.
	 */
	carry?: PointCarry;
}

/** Per-sweep state passed from point to point (run-verb.ts makes one per order column). */
export interface PointCarry {
	/** the exact balls found so far (their tips), where Newton starts the next one */
	ballTrail?: BallTrail;
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
	/**
	 * what this one point alone is (which of several surfaces won): said after the note beside a single value,
	 * never under a table, where it would describe the first row only (a growth curve is not all "before the quench")
	 */
	pointNote?: string;
}

export interface RecordAt {
	/** named as API.md lists them */
	fields: Record<string, number>;
	/** what the fields mean where their names alone do not say */
	note?: string;
}

export interface SeriesTerms {
	terms: { k: number; coeff: number; latex: string; power: number }[];
	d: number;
	/** the length the series variable is measured in: z_h, or z_p for the plane wave; '1': terms multiply ℓ^K (a metric's named parameters) */
	scale: 'z_h' | 'z_p' | '1';
}

/** A table verb's answer at one point (a surface profile): columns, numeric rows, which column the plot's x is. */
export interface TableAt {
	columns: string[];
	rows: number[][];
	/** the plot's x column (the first column when absent) */
	x?: string;
	note?: string;
	/** what `#n.field` exposes of the answer (the table itself has many rows) */
	fields?: Record<string, number>;
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

/** What the palette, completion and `help` show about a verb. */
export interface VerbHelp {
	/** one line */
	summary: string;
	/** how the engine computes it */
	method: string;
	/** how far to trust it, as measured in the tests */
	accuracy: string;
	/** published source, or "derived here" / "common practice" */
	source: string;
	/** two or more lines that work on a fresh pad */
	examples: readonly string[];
}

interface VerbBase {
	name: string;
	/** forms by subject; the first is the default when the line names none; '' = the verb takes no subject */
	forms: Readonly<Record<string, VerbForm>>;
	/** plain-text and LaTeX symbol for labels */
	symbol: { text: string; tex: string };
	help: VerbHelp;
	/** numeric orders are series truncations: they carry a warning outside the reliable range */
	series?: boolean;
	/** reports in units of G (the pad's units, or a G= key on the line) */
	usesG?: boolean;
	/** needs a whole order (o=exact is refused) */
	wholeOrder?: boolean;
	/** the symbol a table's label uses when it differs by bulk (μ_Q on the charged brane) */
	tableSymbol?: (bulkName: string, params: Record<string, number | string>) => string | undefined;
	/**
	 * Reference curves for the plot of a sweep of this verb over `xKey` (a growth curve's thermal value, early law
	 * and linear line): asked once per plotted sweep at its first point, with the swept values; none = undefined.
	 */
	guides?: (p: Point, xKey: string, xs: number[]) => PlotGuide[] | undefined;
}

export interface ScalarVerb extends VerbBase {
	kind: 'scalar';
	/** a field of the answer shown as its own `<order>_err` column in tables (resum's error estimate) */
	errorField?: string;
	at(p: Point): ScalarAt;
}
export interface RecordVerb extends VerbBase {
	kind: 'record';
	at(p: Point): RecordAt;
}
export interface SeriesVerb extends VerbBase {
	kind: 'series';
	at(p: Point): SeriesTerms;
}
export interface CheckVerb extends VerbBase {
	kind: 'check';
	at(p: Point): CheckAt;
}

/** One table per point (a profile): sweeps and orders do not apply. */
export interface TableVerb extends VerbBase {
	kind: 'table';
	at(p: Point): TableAt;
}

export type VerbSpec = ScalarVerb | RecordVerb | SeriesVerb | CheckVerb | TableVerb;
export type VerbKind = VerbSpec['kind'];

/** Identity, so a verb module's object literal is checked (and its `at` typed) by its kind. */
export function defineVerb(spec: VerbSpec): VerbSpec {
	return spec;
}
