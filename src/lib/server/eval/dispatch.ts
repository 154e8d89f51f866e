/**
 * From a planned line to an answer: picks its priority, names the datasets it can reach (by reference; rows
 * are read only for a process that lacks them), and hands it to the one queue in front of the pool.
 */
import type { PadContext } from '../../lang/result';
import { datasetRefs, datasetTexts } from '../datasets';
import { getPool } from './pool';
import { isHeavyLine, reachableWords } from './plan';
import { createEvalQueue, type EvalQueue, type Priority, type QueueAnswer } from './queue';
import { evalSettings } from './settings';
import { queueWithFleet } from './fleet'; // fleet mode (BULKPAD_QUEUE): see fleet/index.ts

let queue: EvalQueue | undefined;

export function getQueue(): EvalQueue {
	// fleet: BULKPAD_QUEUE sends lines to the evaluation fleet while it answers; unset, this is the local queue alone
	queue ??= queueWithFleet(() => createEvalQueue(getPool(), evalSettings));
	return queue;
}

export interface EvalOptions {
	budgetMs?: number;
	onProgress?: (p: { done: number; total: number }) => void;
	signal?: AbortSignal;
	/** replays pass 'replay'; otherwise the line's own weight decides */
	priority?: Priority;
}

type DatasetRefs = ReturnType<typeof datasetRefs>;

/**
 * Queues one line of `owner` (a user id, or a replay's client) with the pad context it runs in. `ownerId`
 * is whose datasets the line may use (null: none); `refs` lets a replay read the dataset list once.
 */
export function evaluateLine(
	input: string,
	ctx: PadContext,
	owner: string,
	ownerId: string | null,
	opts: EvalOptions = {},
	refs?: () => DatasetRefs
): Promise<QueueAnswer> {
	const heavy = isHeavyLine(input, ctx.bulk.name);
	const priority = opts.priority ?? (heavy ? 'heavy' : 'light');
	let named: DatasetRefs = [];
	let others: string[] = [];
	if (ownerId) {
		const words = reachableWords(input, ctx.macros ?? {});
		// only `compare` reads a dataset: most lines never query the dataset table at all
		if (words.has('compare')) {
			const all = refs ? refs() : datasetRefs(ownerId);
			named = all.filter((d) => words.has(d.name));
			others = all.filter((d) => !words.has(d.name)).map((d) => d.name);
		}
	}
	const { datasets: _unused, ...rest } = ctx;
	return getQueue().enqueue(
		{
			input,
			ctx: rest,
			datasets: named,
			otherDatasets: others,
			loadDatasets: ownerId ? (ids) => datasetTexts(ownerId, ids) : undefined
		},
		owner,
		priority,
		{ ...opts, weight: heavy ? 'heavy' : 'light' }
	);
}
