/** Shapes the console passes between its server load and its components. */
import type { BulkState, Result, UnitsState } from '$lib/lang/result';

export interface StepError {
	message: string;
	start: number;
	end: number;
	hint?: string;
}

export interface StepData {
	/** server id; a step cancelled before the server answered has none yet */
	id: string | null;
	n: number | null;
	input: string;
	status: 'pending' | 'ok' | 'error' | 'cancelled';
	results: Result[];
	error: StepError | null;
	ms: number | null;
	/** `#btz`: the name later lines may use instead of the number */
	name?: string | null;
	/** folded away in the pad, still numbered and referable */
	hidden?: boolean;
	/** 1, +1 per re-run with an edited line */
	version?: number;
	/** earlier versions, newest first */
	versions?: StepVersionData[];
	/** labels typed in the label editor of the step's figures, by result index */
	figureLabels?: Record<string, { xlabel?: string; ylabel?: string; legends?: Record<string, string> }> | null;
}

export interface StepVersionData {
	version: number;
	input: string;
	status: string;
	results: Result[];
	error: StepError | null;
}

/** A failed line: dimmed, dismissable, no step number; shown after step `afterN`. */
export interface AttemptData {
	/** null until the server answered (a line cancelled on the way) */
	id: string | null;
	input: string;
	status: 'pending' | 'error' | 'cancelled';
	error: StepError | null;
	afterN: number;
	/** set when the line was a re-run of that step */
	forN: number | null;
	dismissed: boolean;
}

export interface PadSummary {
	id: string;
	title: string;
	bulk: BulkState;
	updatedAt: number;
}

export interface PadState {
	id: string;
	title: string;
	bulk: BulkState;
	units: UnitsState;
	history: string[];
	/** false for a pad the user was only invited to: read it, but type nothing */
	own: boolean;
	/** the pad's relative validity tolerance; null: the default 1e-3 */
	validityTol?: number | null;
}

/** `boosted d=4 zh=1 v=0.6` */
export function bulkText(b: BulkState | null | undefined): string {
	if (!b) return '';
	const ps = Object.entries(b.params ?? {}).map(([k, v]) => `${k}=${typeof v === 'string' ? JSON.stringify(v) : v}`);
	return [b.name, ...ps].join(' ');
}

export function unitsText(u: UnitsState | null | undefined): string {
	if (!u) return '';
	if (u.system === 'geo') return `geo G=${u.G}`;
	if (u.system === 'cft') return `cft c=${u.c}`;
	return `sym N=${u.N}`;
}

/** Something the palette can do besides filling the input line. */
export interface PaletteAction {
	id: string;
	label: string;
	hint?: string;
	run: () => void;
}
