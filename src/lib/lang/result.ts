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
/**
 * A reference curve drawn under a table's plot for comparison, not data (a growth curve's thermal value, early-time
 * law and linear-growth line): a dashed polyline in plot coordinates, labelled in the legend. LaTeX label.
 */
export interface PlotGuide {
	label: string;
	points: [number, number][];
}
export interface TableResult {
	kind: 'table';
	label: string;
	columns: string[];
	rows: (number | string | null)[][];
	/**
	 * plot hints: which column is x, whether a plot was asked, the validity region per order column and the
	 * relative tolerance it was found with (`tol`, the pad's validity tolerance)
	 */
	plot?: {
		x: string;
		log?: boolean;
		validity?: Record<string, number>;
		tol?: number;
		dataset?: string;
		show?: boolean;
		guides?: PlotGuide[];
	};
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
	/** the coefficients for a paper: an aligned LaTeX list, one per line, every symbol defined (lang/coeff-list.ts) */
	list?: string;
	/** the same list in plain text (full-precision numbers) */
	text?: string;
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
	/** a line that does what the note suggests (the console offers to put it in the input) */
	fix?: string;
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
	/** step names (`#btz`) → step numbers; a name follows its step, so it survives renumbering */
	names?: Record<string, number>;
	lets: Record<string, LetValue>;
	/**
	 * approved macros by name: parameter defaults, body lines with `{param}` placeholders, and the header's
	 * `effects` — what the macro may leave changed in the pad ('bulk', 'units'); anything else is put back
	 */
	macros?: Record<string, { params: Record<string, string>; body: string[]; effects?: MacroEffect[] }>;
	/** datasets by name: numeric columns from an uploaded CSV */
	datasets?: Record<string, { columns: string[]; rows: number[][] }>;
	/**
	 * the pad's validity tolerance (relative): series warnings, `validity` without tol= and the plot's shading
	 * all use it; absent means DEFAULT_VALIDITY_TOL (1e-3, lang/verbs/validity.ts)
	 */
	validityTol?: number;
}

/** What a macro's header may declare it leaves changed in the pad; everything else is restored after it runs. */
export type MacroEffect = 'bulk' | 'units';
export const MACRO_EFFECTS: readonly MacroEffect[] = ['bulk', 'units'];

/** The outcome of one line: results in order, and the pad state after it. */
export interface LineOutcome {
	results: Result[];
	bulk: BulkState;
	units: UnitsState;
	lets: Record<string, LetValue>;
	/** the main value and fields this step exposes to `#n` */
	ref: StepRef;
}

/**
 * Why a line has no answer, and its HTTP status: 'language' 400, 'limit' 422, 'throttled' 429 (its author
 * already has too many lines waiting), 'busy' 503 (the queue was too long for too long), 'internal' 500.
 * Neither 'busy' nor 'throttled' is a verdict on the line itself.
 */
export type EvalErrorCode = 'language' | 'limit' | 'internal' | 'busy' | 'throttled';

/** The error of POST /api/eval (API.md), pointing at the offending characters of the line. */
export interface EvalError {
	message: string;
	start: number;
	end: number;
	hint?: string;
	code: EvalErrorCode;
	/** seconds, with 'busy' and 'throttled' (also sent as Retry-After) */
	retryAfter?: number;
}

/** The error a failed step keeps (an imported step may carry no code). */
export type StepError = Omit<EvalError, 'code' | 'retryAfter'> & { code?: EvalErrorCode };

/** The JSON body of POST /api/eval, declared once for the server that sends it and the browser that reads it. */
export interface EvalBody {
	ok: boolean;
	/** the step the line became (pad evaluations; version > 1 when it re-ran an existing step) */
	step?: { id: string; n: number; version?: number };
	/** a failed line in a pad: kept as an attempt, with no step number */
	attempt?: { id: string };
	/** the pad's bulk and units after the line */
	bulk?: BulkState;
	units?: UnitsState;
	/** wall time of the request, time waiting in the queue, time evaluating */
	ms?: number;
	queuedMs?: number;
	runMs?: number;
	results?: Result[];
	error?: EvalError;
}

/** A language or engine error that points at the offending characters of the line (LangError's shape). */
export type LineErrorShape = Omit<EvalError, 'code' | 'retryAfter'> & { code: Extract<EvalErrorCode, 'language' | 'limit'> };
