import type { Result } from '$lib/lang/result';

export interface TranscriptStep {
	n: number;
	input: string;
	status: string;
	results: unknown;
	error: unknown;
}

/** One step of a replay answer (API.md): whether it drifts and by how much, and what it gives now. */
export interface ReplayMark {
	n: number;
	drift: boolean;
	delta: number | null;
	results?: Result[];
	error?: { message: string };
}
