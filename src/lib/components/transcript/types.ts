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
	/** the fresh run ended in an error: shown as failed, never as reproduced */
	failed?: boolean;
	/** not run (budget, queue, cancelled) */
	skipped?: boolean;
	delta: number | null;
	results?: Result[];
	error?: { message: string };
}

/** A reader's comment on one step of a snapshot (GET /api/t/[slug]/comments). */
export interface SnapshotComment {
	id: string;
	step: number;
	body: string;
	author: { name: string };
	mine?: boolean;
	createdAt: string | Date;
}
