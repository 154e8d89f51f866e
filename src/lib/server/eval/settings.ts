/**
 * Evaluation knobs from the environment, read once (listed in DEVELOPERS.md). The two older ones keep their
 * meaning: BULKPAD_EVAL_THREADS is the number of evaluation processes (formerly threads) and
 * BULKPAD_EVAL_BUDGET_MS the running time one line may use, counted from when it starts, never while it waits.
 */
import { env } from '../env';

function intFrom(name: string, fallback: number): number {
	const raw = process.env[name];
	const n = raw === undefined ? NaN : Number(raw);
	return Number.isFinite(n) && n > 0 ? n : fallback;
}

export const evalSettings = {
	processes: env.evalThreads,
	budgetMs: env.evalBudgetMs,
	/** heap of one evaluation process; a line past it kills that process only */
	memoryMb: intFrom('BULKPAD_EVAL_MEMORY_MB', 256),
	/** longest wait in the queue before a line is answered 503 "queued behind N lines" */
	queueWaitMs: intFrom('BULKPAD_EVAL_QUEUE_MS', 30_000),
	/** lines one author may have waiting at once before more are answered 429 */
	pendingPerOwner: intFrom('BULKPAD_EVAL_PENDING_PER_USER', 100),
	/** running time of a whole replay, summed over its steps */
	replayBudgetMs: intFrom('BULKPAD_REPLAY_BUDGET_MS', 60_000),
	/** fresh (uncached) replays of one transcript per minute, whoever asks */
	replayPerTranscriptPerMinute: intFrom('BULKPAD_REPLAY_PER_TRANSCRIPT_PER_MINUTE', 6),
	/** dataset bytes one evaluation process keeps between lines */
	datasetCacheBytes: intFrom('BULKPAD_EVAL_DATASET_CACHE_BYTES', 32_000_000)
};
