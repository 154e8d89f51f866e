import { Piscina } from 'piscina';
import { MessageChannel } from 'node:worker_threads';
import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { env } from '../env';
import type { EvalAnswer } from './worker';
import type { PadContext } from '../../lang/result';

/** The worker bundle built by scripts/build-worker.mjs (esbuild), beside the server build. */
export const WORKER_FILE = resolve(process.env.BULKPAD_WORKER ?? 'dist/eval-worker.mjs');

let pool: Piscina | undefined;

/** How long a task may wait for a thread (busy, or booting after a budget overrun) before it is refused. */
const START_GRACE_MS = 30_000;

function getPool(): Piscina {
	if (pool) return pool;
	if (!existsSync(WORKER_FILE)) {
		throw new Error(`The evaluation worker ${WORKER_FILE} is missing: run "node scripts/build-worker.mjs".`);
	}
	pool = new Piscina({
		filename: WORKER_FILE,
		minThreads: env.evalThreads,
		maxThreads: env.evalThreads,
		// a runaway evaluation dies alone instead of taking the server's heap with it
		resourceLimits: { maxOldGenerationSizeMb: 256 },
		idleTimeout: 60_000
	});
	return pool;
}

export interface EvalOptions {
	budgetMs?: number;
	onProgress?: (p: { done: number; total: number }) => void;
	signal?: AbortSignal;
}

/**
 * Evaluates one line off the request thread. Past its time budget the worker thread is terminated (the pool
 * starts a fresh one), so a heavy line costs its author a 422 and nobody else anything.
 */
export async function evaluateInPool(input: string, ctx: PadContext, opts: EvalOptions = {}): Promise<EvalAnswer> {
	const budgetMs = opts.budgetMs ?? env.evalBudgetMs;
	const controller = new AbortController();
	// the budget is timed from the worker's "started" message; the outer timer only guards a thread that
	// never starts at all
	let timer = setTimeout(() => controller.abort('budget'), budgetMs + START_GRACE_MS);
	const onOuterAbort = () => controller.abort('cancelled');
	opts.signal?.addEventListener('abort', onOuterAbort);
	const channel = new MessageChannel();
	channel.port1.on('message', (m: { started?: true; done: number; total: number }) => {
		if (m.started) {
			clearTimeout(timer);
			timer = setTimeout(() => controller.abort('budget'), budgetMs);
		} else opts.onProgress?.(m);
	});
	try {
		return (await getPool().run(
			{ input, ctx, port: channel.port2 },
			{
				signal: controller.signal,
				// piscina types its transfer list with the DOM MessagePort that SvelteKit's lib settings select
				transferList: [channel.port2] as never
			}
		)) as EvalAnswer;
	} catch (e) {
		if (controller.signal.aborted) {
			const cancelled = controller.signal.reason === 'cancelled';
			return {
				ok: false,
				error: {
					message: cancelled
						? 'evaluation cancelled'
						: `evaluation stopped: over the time budget of ${(budgetMs / 1000).toFixed(1)} s`,
					hint: cancelled ? undefined : 'use fewer sweep points or a lower order',
					start: 0,
					end: input.length,
					code: 'limit'
				}
			};
		}
		const message = e instanceof Error ? e.message : String(e);
		return { ok: false, error: { message: `evaluation failed: ${message}`, start: 0, end: input.length, code: 'limit' } };
	} finally {
		clearTimeout(timer);
		opts.signal?.removeEventListener('abort', onOuterAbort);
		channel.port1.close();
	}
}

/** Starts the pool's threads and loads the engine in them, so the first user does not wait for it. */
export async function warmPool(): Promise<void> {
	const ctx: PadContext = { bulk: { name: 'brane', params: { d: 4, zh: 1 } }, units: { system: 'geo', G: 1 }, refs: {}, lets: {} };
	await Promise.all(Array.from({ length: env.evalThreads }, () => evaluateInPool('zstar l=0.5', ctx, { budgetMs: 30_000 })));
}

export async function closePool(): Promise<void> {
	await pool?.destroy();
	pool = undefined;
}
