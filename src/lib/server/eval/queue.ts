/**
 * The queue in front of the evaluation processes. Its interface is what a fleet would implement too (a
 * Redis/BullMQ queue with workers on other machines): `enqueue(job, owner, priority, { signal })` resolves
 * with the answer; aborting the signal cancels the line whether it is waiting or running.
 *
 * Policy, so one person's lines never cost anyone else much:
 * - the owner with the fewest lines running goes first, so a flood of lines from one owner (even light ones)
 *   cannot starve another owner's line;
 * - between owners running as many, light lines go first; heavy lines (sweeps, balls, metric bulks, macros,
 *   compare) and replays then take turns by owner (whose last line started longest ago), heavy before replay
 *   only between equals; then first come first served;
 * - one heavy line per owner runs at a time, and heavy lines run only in the low-CPU-priority processes, so
 *   with two or more processes one is always left for light lines (a replay's light step counts as light);
 * - a line waits at most `queueWaitMs`, then answers 503 "queued behind N lines" (code 'busy'); an owner
 *   with `pendingPerOwner` lines already waiting gets 429 (code 'throttled'). Waiting never counts against a
 *   line's time budget: the budget starts when its process starts it.
 */
import type { PoolAnswer, PoolJob, Slot } from './pool';
import type { EvalAnswer } from './worker';

export type Priority = 'light' | 'heavy' | 'replay';
const RANK: Record<Priority, number> = { light: 0, heavy: 1, replay: 2 };

export type QueueJob = Omit<PoolJob, 'budgetMs' | 'signal' | 'onProgress' | 'killOnCancel'>;

export interface EnqueueOptions {
	/**
	 * What the line costs, apart from its place in line: a replay's light step needs no heavy process. Heavy
	 * unless the priority is 'light', when not given.
	 */
	weight?: 'light' | 'heavy';
	budgetMs?: number;
	signal?: AbortSignal;
	onProgress?: (p: { done: number; total: number }) => void;
}

export interface QueueAnswer extends PoolAnswer {
	/** time spent waiting for a process, reported apart from the running time */
	waitMs: number;
}

export interface EvalQueue {
	enqueue(job: QueueJob, owner: string, priority: Priority, opts?: EnqueueOptions): Promise<QueueAnswer>;
	stats(): { waiting: number; running: number };
}

/** What the queue needs from a pool of evaluators (pool.ts's ProcessPool, or a fake in the unit tests). */
export interface Runner {
	readonly size: number;
	/** a free evaluator; heavy lines get only those that run at low CPU priority */
	take(heavy: boolean): Slot | undefined;
	run(slot: Slot, job: PoolJob): Promise<PoolAnswer>;
	onIdle(cb: () => void): void;
}

interface Waiting {
	seq: number;
	heavy: boolean;
	job: QueueJob;
	owner: string;
	priority: Priority;
	opts: EnqueueOptions;
	enqueuedAt: number;
	done: (a: QueueAnswer) => void;
	timer: ReturnType<typeof setTimeout>;
	onAbort: () => void;
}

export interface QueueSettings {
	budgetMs: number;
	queueWaitMs: number;
	pendingPerOwner: number;
}

function refusal(input: string, code: 'busy' | 'throttled' | 'limit', message: string, retryAfter?: number): EvalAnswer {
	return { ok: false, error: { message, start: 0, end: input.length, code, retryAfter } };
}

export function createEvalQueue(runner: Runner, settings: QueueSettings): EvalQueue {
	const waiting: Waiting[] = [];
	const runningBy = new Map<string, { all: number; heavy: number }>();
	/**
	 * When each owner's latest light and latest heavy line started (pruned with the owners that have nothing
	 * running or waiting): turns are taken per kind, so a replay's light steps do not use up its heavy turn.
	 */
	const lastStart = new Map<string, number>();
	const turnKey = (w: Waiting) => `${w.heavy ? 'h' : 'l'}:${w.owner}`;
	let starts = 0;
	let running = 0;
	let heavyRunning = 0;
	let seq = 0;
	const heavyCap = runner.size > 1 ? runner.size - 1 : 1;

	const countsOf = (owner: string) => runningBy.get(owner) ?? { all: 0, heavy: 0 };
	const isHeavy = (p: Priority) => p !== 'light';

	function eligible(w: Waiting): boolean {
		if (!w.heavy) return true;
		return heavyRunning < heavyCap && countsOf(w.owner).heavy === 0;
	}

	/**
	 * Fewest lines running first (so one owner's flood never starves another), then light lines before the
	 * rest, then owners in turn (so a stream of one member's heavy lines cannot starve a replay either), then
	 * heavy before replay, then arrival.
	 */
	function ahead(a: Waiting, b: Waiting): boolean {
		const byRunning = countsOf(a.owner).all - countsOf(b.owner).all;
		if (byRunning !== 0) return byRunning < 0;
		const byLight = Number(a.heavy) - Number(b.heavy);
		if (byLight !== 0) return byLight < 0;
		const byTurn = (lastStart.get(turnKey(a)) ?? 0) - (lastStart.get(turnKey(b)) ?? 0);
		if (byTurn !== 0) return byTurn < 0;
		const byClass = RANK[a.priority] - RANK[b.priority];
		if (byClass !== 0) return byClass < 0;
		return a.seq < b.seq;
	}

	/** The first waiting line, in the order above, that may run now and finds an evaluator of its kind. */
	function pick(): [Waiting, Slot] | undefined {
		const order = waiting.filter(eligible).sort((a, b) => (ahead(a, b) ? -1 : ahead(b, a) ? 1 : 0));
		for (const w of order) {
			const slot = runner.take(w.heavy);
			if (slot) return [w, slot];
		}
		return undefined;
	}

	function remove(w: Waiting) {
		const i = waiting.indexOf(w);
		if (i >= 0) waiting.splice(i, 1);
		clearTimeout(w.timer);
		w.opts.signal?.removeEventListener('abort', w.onAbort);
	}

	function pump() {
		for (;;) {
			if (!waiting.length) return;
			const next = pick();
			if (!next) return;
			const [w, slot] = next;
			remove(w);
			start(w, slot);
		}
	}

	function start(w: Waiting, slot: Slot) {
		const c = { ...countsOf(w.owner) };
		c.all++;
		if (w.heavy) c.heavy++;
		runningBy.set(w.owner, c);
		lastStart.set(turnKey(w), ++starts);
		running++;
		if (w.heavy) heavyRunning++;
		const waitMs = performance.now() - w.enqueuedAt;
		runner
			.run(slot, {
				...w.job,
				budgetMs: w.opts.budgetMs ?? settings.budgetMs,
				signal: w.opts.signal,
				onProgress: w.opts.onProgress,
				killOnCancel: w.heavy
			})
			.then((a) => w.done({ ...a, waitMs }))
			.finally(() => {
				const now = countsOf(w.owner);
				const next = { all: now.all - 1, heavy: now.heavy - (w.heavy ? 1 : 0) };
				if (next.all === 0) {
					runningBy.delete(w.owner);
					if (!waiting.some((o) => o.owner === w.owner)) {
						lastStart.delete(`h:${w.owner}`);
						lastStart.delete(`l:${w.owner}`);
					}
				} else runningBy.set(w.owner, next);
				running--;
				if (w.heavy) heavyRunning--;
				pump();
			});
	}

	runner.onIdle(pump);

	return {
		enqueue(job, owner, priority, opts = {}) {
			return new Promise<QueueAnswer>((done) => {
				if (opts.signal?.aborted) return done({ answer: refusal(job.input, 'limit', 'evaluation cancelled'), runMs: 0, waitMs: 0 });
				const mine = waiting.filter((w) => w.owner === owner).length;
				if (mine >= settings.pendingPerOwner) {
					return done({
						answer: refusal(job.input, 'throttled', `you have ${mine} lines waiting already; wait for them to finish`, 5),
						runMs: 0,
						waitMs: 0
					});
				}
				const w: Waiting = {
					seq: ++seq,
					heavy: opts.weight ? opts.weight === 'heavy' : isHeavy(priority),
					job,
					owner,
					priority,
					opts,
					enqueuedAt: performance.now(),
					done,
					timer: setTimeout(() => {
						const behind = running + waiting.filter((o) => o !== w && ahead(o, w)).length;
						remove(w);
						const s = Math.round(settings.queueWaitMs / 1000);
						done({
							answer: refusal(job.input, 'busy', `evaluation not started: queued behind ${behind} lines for ${s} s; try again shortly`, 5),
							runMs: 0,
							waitMs: settings.queueWaitMs
						});
					}, settings.queueWaitMs),
					onAbort: () => {
						remove(w);
						done({ answer: refusal(job.input, 'limit', 'evaluation cancelled'), runMs: 0, waitMs: performance.now() - w.enqueuedAt });
					}
				};
				opts.signal?.addEventListener('abort', w.onAbort, { once: true });
				waiting.push(w);
				pump();
			});
		},
		stats: () => ({ waiting: waiting.length, running })
	};
}
