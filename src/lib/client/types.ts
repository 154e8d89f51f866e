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
