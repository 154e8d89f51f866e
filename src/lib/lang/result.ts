/**
 * The result shapes of POST /api/eval (../shared/spec/API.md). Shared by the evaluator, the server and the UI,
 * so it imports nothing. Every field API.md names is required; extra fields are allowed.
 */
export type Order = number | 'exact';

export interface ScalarResult {
	kind: 'scalar';
	label: string;
	value: number;
	order: Order;
	unit?: string;
	latex?: string;
	warning?: string;
	/** what the number is, beyond its label: the scheme, the phase, the convention (shown under the value) */
	note?: string;
	/** named side values a later `#n.field` may reference (e.g. T, mu) */
	fields?: Record<string, number>;
}
export interface RecordResult {
	kind: 'record';
	label: string;
	fields: Record<string, number>;
	latex?: string;
	warning?: string;
	note?: string;
}
export interface TableResult {
	kind: 'table';
	label: string;
	columns: string[];
	rows: (number | string | null)[][];
	/** plot hints: which column is x, whether a plot was asked, the validity region per order column */
	plot?: { x: string; log?: boolean; validity?: Record<string, number>; dataset?: string; show?: boolean };
	warning?: string;
	note?: string;
	/** LaTeX of the table (a tabular), present when `| tex` was asked */
	latex?: string;
	/** set by `| csv`: the UI offers the table as a CSV download */
	download?: Download;
}
/** A result marked for download by `| csv`. */
export interface Download {
	format: 'csv';
	filename: string;
}
export interface SeriesResult {
	kind: 'series';
	label: string;
	/** `power`: the exponent of l/scale the term multiplies (k·d, except for the charged brane's mixed powers) */
	terms: { k: number; coeff: number; latex: string; power?: number }[];
	latex: string;
	order?: Order;
	warning?: string;
}
export interface CheckResult {
	kind: 'check';
	label: string;
	pass: boolean;
	lhs: number;
	rhs: number;
	residual: number;
	tolerance: number;
	order?: Order;
	warning?: string;
	note?: string;
	/** the relation checked, `lhs side = rhs side` in plain text (e.g. T_ent δΔS = δΔE − μ δΔP_y); residual = lhs − rhs */
	relation?: string;
	/** compare: χ² per degree of freedom and its p-value, when the dataset gives per-point errors */
	chi2dof?: number;
	pvalue?: number;
}
/**
 * A figure overlaying the tables of earlier steps of the same pad (`plot #9 #35`). It names the steps, not
 * their numbers: the pad (or transcript) that shows it already holds those tables, and a replay redraws it
 * from the fresh ones. Labels are LaTeX; absent means the figure's defaults.
 */
export interface FigureResult {
	kind: 'figure';
	label: string;
	steps: number[];
	xlabel?: string;
	ylabel?: string;
}
export interface NoteResult {
	kind: 'note';
	text: string;
}
export type Result = ScalarResult | RecordResult | TableResult | SeriesResult | CheckResult | FigureResult | NoteResult;

/** A bulk as the pad keeps it: its name and the parameters given to `use`. */
export interface BulkState {
	name: string;
	params: Record<string, number | string>;
}

/** How entropies are reported (`units …`). G is Newton's constant in units L = 1. */
export type UnitsState = { system: 'geo'; G: number } | { system: 'cft'; c: number } | { system: 'sym'; N: number };

/** What a later line may reference from an earlier step: `#n` is value, `#n.field` a field. */
export interface StepRef {
	value?: number;
	fields: Record<string, number>;
	/** the perturbative order of value, when it came from a series (arithmetic on it keeps the order) */
	order?: Order;
}

/** A value kept by `let`. */
export type LetValue = { value?: number; fields: Record<string, number>; order?: Order };

/** Everything a line needs from its pad. Plain JSON, so it can cross into a worker thread. */
export interface PadContext {
	bulk: BulkState;
	units: UnitsState;
	refs: Record<number, StepRef>;
	lets: Record<string, LetValue>;
	/** approved macros by name: parameter defaults and body lines with `{param}` placeholders */
	macros?: Record<string, { params: Record<string, string>; body: string[] }>;
	/** datasets by name: numeric columns from an uploaded CSV */
	datasets?: Record<string, { columns: string[]; rows: number[][] }>;
}

/** The outcome of one line: results in order, and the pad state after it. */
export interface LineOutcome {
	results: Result[];
	bulk: BulkState;
	units: UnitsState;
	lets: Record<string, LetValue>;
	/** the main value and fields this step exposes to `#n` */
	ref: StepRef;
}

/** A language or engine error that points at the offending characters of the line. */
export interface LineErrorShape {
	message: string;
	start: number;
	end: number;
	hint?: string;
	/** 'language' → HTTP 400; 'limit' → HTTP 422 */
	code: 'language' | 'limit';
}
