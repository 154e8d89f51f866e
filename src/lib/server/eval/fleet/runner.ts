/**
 * The server's side of the fleet: a Runner (queue.ts's interface) whose "processes" are the fleet's workers.
 * The fair queue of queue.ts stays the one place that decides whose line goes next: this runner admits only as
 * many lines as the live workers can run at once (one light line per worker, one heavy line per heavy process),
 * so lines wait in the fair queue, in its order, not in Redis. A heavy line's sweep is split into chunks
 * (split.ts) that all go on the heavy queue at once, with BullMQ priority = 1 + the chunk's index: the k-th
 * chunks of two users' sweeps run before either's (k+1)-th, so concurrent sweeps share the workers in turn
 * instead of first come, first served (replays are ordered by the fair queue before they get here).
 */
import { randomUUID } from 'node:crypto';
import { Queue, QueueEvents } from 'bullmq';
import { Redis, type RedisOptions } from 'ioredis';
import type { PoolAnswer, PoolJob, Slot } from '../pool';
import type { Runner } from '../queue';
import type { EvalAnswer } from '../worker';
import { decode, encode } from './codec';
import { keys, queueNames, type WorkerInfo } from './config';
import type { FleetAnswer, FleetJobData, FleetPayload } from './jobs';
import { mergeChunks, splitSweep } from './split';

export type FleetState = 'connecting' | 'fleet' | 'unreachable' | 'no-workers';

/** How long a job may stay active before the server stops waiting: its budget, a start grace, a retry. */
const ACTIVE_GRACE_MS = 30_000;

interface Waiter {
	input: string;
	done: (a: PoolAnswer) => void;
	onProgress?: (done: number, total: number) => void;
	timer?: ReturnType<typeof setTimeout>;
	budgetMs: number;
}

/** A fleet "slot": what the fair queue holds while a line is admitted (never a process of this machine). */
interface FleetSlot {
	fleet: true;
	heavy: boolean;
}

function failure(input: string, message: string, code: 'limit' | 'busy' | 'internal', hint?: string): EvalAnswer {
	return {
		ok: false,
		error: { message, start: 0, end: input.length, code, ...(hint ? { hint } : {}), ...(code === 'busy' ? { retryAfter: 2 } : {}) }
	};
}

export interface FleetRunnerOptions {
	connection: RedisOptions;
	version: string;
	chunks: number;
	lockMs: number;
	/** how often Redis and the workers' heartbeats are checked */
	pollMs?: number;
}

export class FleetRunner implements Runner {
	/** the fair queue's own cap on heavy lines is not the limit here: take() is (see the top of this file) */
	readonly size = Number.MAX_SAFE_INTEGER;
	state: FleetState = 'connecting';
	capacity = { light: 0, heavy: 0, workers: 0 };
	private inFlight = { light: 0, heavy: 0 };
	private listeners = new Set<() => void>();
	private waiters = new Map<string, Waiter>();
	private queues: { light: Queue; heavy: Queue };
	private events: QueueEvents[];
	/** the server's own commands beside BullMQ's: heartbeats, cancellations */
	private redis: Redis;
	private poll?: ReturnType<typeof setInterval>;
	private closed = false;

	constructor(private readonly opts: FleetRunnerOptions) {
		const names = queueNames(opts.version);
		// a server that cannot reach Redis must not queue commands for later: it falls back to in-process at once
		const connection = { ...opts.connection, enableOfflineQueue: false };
		this.queues = {
			light: new Queue(names.light, { connection }),
			heavy: new Queue(names.heavy, { connection })
		};
		this.redis = new Redis({ ...connection, maxRetriesPerRequest: 1 });
		this.redis.on('error', () => {});
		this.events = [names.light, names.heavy].map((n) => new QueueEvents(n, { connection: opts.connection }));
		for (const q of Object.values(this.queues)) q.on('error', () => {}); // reported through `state`
		for (const ev of this.events) {
			ev.on('error', () => {});
			ev.on('progress', ({ jobId, data }) => {
				const p = data as { done?: number; total?: number };
				if (typeof p?.done === 'number' && typeof p.total === 'number') this.waiters.get(jobId)?.onProgress?.(p.done, p.total);
			});
			ev.on('active', ({ jobId }) => this.armTimer(jobId));
			ev.on('completed', ({ jobId, returnvalue }) => {
				const text = typeof returnvalue === 'string' ? returnvalue : String(returnvalue);
				let answer: FleetAnswer;
				try {
					answer = decode<FleetAnswer>(text);
				} catch {
					return this.settle(jobId, (w) => ({
						answer: failure(w.input, 'evaluation failed: a worker answered garbage', 'internal'),
						runMs: 0
					}));
				}
				this.settle(jobId, () => answer);
			});
			ev.on('failed', ({ jobId, failedReason }) =>
				this.settle(jobId, (w) => ({
					answer: /stalled/i.test(failedReason)
						? failure(
								w.input,
								'evaluation stopped: the workers running it stopped twice',
								'limit',
								'a worker died or was restarted while evaluating this line; try again'
							)
						: failure(w.input, `evaluation failed on a worker: ${failedReason}`, 'internal'),
					runMs: 0
				}))
			);
		}
	}

	/** Connects and keeps `state` and `capacity` current. */
	async start(): Promise<void> {
		const check = () => void this.check();
		this.poll = setInterval(check, this.opts.pollMs ?? 1000);
		this.poll.unref();
		await this.check();
	}

	private async check(): Promise<void> {
		if (this.closed) return;
		let next: FleetState;
		const was = this.state;
		try {
			const client = this.redis;
			const found: WorkerInfo[] = [];
			let cursor = '0';
			do {
				const [c, names] = await withTimeout(client.scan(cursor, 'MATCH', keys.workers(this.opts.version), 'COUNT', 200), 2000);
				cursor = c;
				const values = names.length ? await withTimeout(client.mget(...names), 2000) : [];
				for (const v of values) if (v) found.push(JSON.parse(v) as WorkerInfo);
			} while (cursor !== '0');
			await Promise.all(this.events.map((e) => withTimeout(e.waitUntilReady(), 2000)));
			this.capacity = {
				workers: found.length,
				light: found.length,
				heavy: found.reduce((n, w) => n + Math.max(1, w.processes - 1), 0)
			};
			next = found.length ? 'fleet' : 'no-workers';
		} catch {
			this.capacity = { light: 0, heavy: 0, workers: 0 };
			next = 'unreachable';
		}
		this.state = next;
		if (next !== 'fleet' && this.waiters.size) {
			// nobody will answer these: say so now (the next try runs in-process) rather than at a timeout
			const why = next === 'unreachable' ? 'the evaluation fleet is unreachable' : 'the evaluation fleet has no worker running';
			for (const id of [...this.waiters.keys()])
				this.settle(id, (w) => ({ answer: failure(w.input, `evaluation not finished: ${why}; try again`, 'busy'), runMs: 0 }));
		}
		if (next === 'fleet' || was !== next) this.notify();
	}

	onIdle(cb: () => void): void {
		this.listeners.add(cb);
	}

	private notify() {
		for (const cb of this.listeners) cb();
	}

	take(heavy: boolean): Slot | undefined {
		if (this.state !== 'fleet') return undefined;
		if (heavy ? this.inFlight.heavy >= this.capacity.heavy : this.inFlight.light >= this.capacity.light) return undefined;
		// the fair queue treats a slot as opaque: it only hands it back to run()
		return { fleet: true, heavy } satisfies FleetSlot as unknown as Slot;
	}

	async run(slot: Slot, job: PoolJob): Promise<PoolAnswer> {
		const { heavy } = slot as unknown as FleetSlot;
		const kind = heavy ? 'heavy' : 'light';
		this.inFlight[kind]++;
		try {
			const payload = {
				input: job.input,
				ctx: job.ctx,
				datasets: job.datasets,
				otherDatasets: job.otherDatasets,
				texts: job.datasets.length && job.loadDatasets ? job.loadDatasets(job.datasets.map((d) => d.id)) : [],
				budgetMs: job.budgetMs
			};
			// two chunks per heavy process the fleet has: enough to even out, few enough that a cheap sweep stays cheap
			const target = Math.min(this.opts.chunks, 2 * this.capacity.heavy);
			const chunks = heavy ? splitSweep(job.input, target) : undefined;
			if (!chunks) return await this.one(payload, heavy, 1, job);
			return await this.split(payload, chunks, job);
		} finally {
			this.inFlight[kind]--;
			this.notify();
		}
	}

	/** All chunks at once; progress summed over them; the first failure cancels the rest. */
	private async split(payload: FleetPayload, chunks: { input: string; points: number }[], job: PoolJob): Promise<PoolAnswer> {
		const t0 = performance.now();
		const total = chunks.reduce((n, c) => n + c.points, 0);
		const done = chunks.map(() => 0);
		const stop = new AbortController();
		const onAbort = () => stop.abort();
		job.signal?.addEventListener('abort', onAbort, { once: true });
		try {
			const answers = await Promise.all(
				chunks.map(async (c, k) => {
					const a = await this.one({ ...payload, input: c.input }, true, 1 + k, {
						signal: stop.signal,
						onProgress: (p) => {
							done[k] = Math.min(p.done, c.points);
							job.onProgress?.({ done: done.reduce((x, y) => x + y, 0), total });
						}
					});
					if (!a.answer.ok) stop.abort(); // the line fails: the other chunks' work is wasted
					return a;
				})
			);
			if (job.signal?.aborted) return { answer: failure(job.input, 'evaluation cancelled', 'limit'), runMs: performance.now() - t0 };
			const failed = answers.find(
				(a) => !a.answer.ok && !/^evaluation cancelled/.test((a.answer as { error: { message: string } }).error.message)
			);
			if (failed && failed.answer.ok === false && failed.answer.error.code !== 'language') {
				return {
					answer: { ...failed.answer, error: { ...failed.answer.error, start: 0, end: job.input.length } },
					runMs: performance.now() - t0
				};
			}
			const merged = failed ? undefined : mergeChunks(answers.map((a) => (a.answer.ok ? a.answer.outcome : undefined!)));
			if (merged) return { answer: { ok: true, outcome: merged }, runMs: performance.now() - t0 };
			// a language error's span points into a chunk, or the chunks disagree beyond their rows: the line whole
			const whole = await this.one(payload, true, 1, job);
			return { ...whole, runMs: performance.now() - t0 };
		} finally {
			job.signal?.removeEventListener('abort', onAbort);
		}
	}

	/** One job on the fleet, answered when a worker finishes it, it fails, or it is cancelled. */
	private one(payload: FleetPayload, heavy: boolean, priority: number, job: Pick<PoolJob, 'signal' | 'onProgress'>): Promise<PoolAnswer> {
		return new Promise((done) => {
			if (job.signal?.aborted) return done({ answer: failure(payload.input, 'evaluation cancelled', 'limit'), runMs: 0 });
			const jobId = randomUUID();
			const onAbort = () => {
				void this.cancel(jobId, heavy);
				this.settle(jobId, (w) => ({ answer: failure(w.input, 'evaluation cancelled', 'limit'), runMs: 0 }));
			};
			this.waiters.set(jobId, {
				input: payload.input,
				budgetMs: payload.budgetMs,
				onProgress: job.onProgress ? (d, t) => job.onProgress!({ done: d, total: t }) : undefined,
				done: (a) => {
					job.signal?.removeEventListener('abort', onAbort);
					done(a);
				}
			});
			job.signal?.addEventListener('abort', onAbort, { once: true });
			const data: FleetJobData = { version: this.opts.version, payload: encode(payload) };
			this.queues[heavy ? 'heavy' : 'light']
				.add('eval', data, { jobId, ...(heavy ? { priority } : {}), removeOnComplete: true, removeOnFail: true })
				.catch((e: Error) =>
					this.settle(jobId, (w) => ({
						answer: failure(w.input, `evaluation not started: the fleet refused it (${e.message})`, 'busy'),
						runMs: 0
					}))
				);
		});
	}

	/** A job is running: it may not outlive its budget by more than a start grace and one retry's lock. */
	private armTimer(jobId: string) {
		const w = this.waiters.get(jobId);
		if (!w) return;
		clearTimeout(w.timer);
		w.timer = setTimeout(
			() =>
				this.settle(jobId, (x) => ({
					answer: failure(x.input, 'evaluation stopped: the worker running it stopped answering', 'limit', 'try again'),
					runMs: 0
				})),
			w.budgetMs + ACTIVE_GRACE_MS + 2 * this.opts.lockMs
		);
		w.timer.unref?.();
	}

	private settle(jobId: string, answer: (w: Waiter) => PoolAnswer) {
		const w = this.waiters.get(jobId);
		if (!w) return;
		this.waiters.delete(jobId);
		clearTimeout(w.timer);
		w.done(answer(w));
	}

	/** Tells every worker (the one running it kills its process), marks it for one not yet started, and drops it if waiting. */
	private async cancel(jobId: string, heavy: boolean) {
		try {
			const client = this.redis;
			await client.set(keys.cancelled(jobId), '1', 'PX', 10 * 60_000);
			await client.publish(keys.cancelChannel, jobId);
			await this.queues[heavy ? 'heavy' : 'light'].remove(jobId);
		} catch {
			/* Redis is gone: the job dies with it, and the line has its answer already */
		}
	}

	/**
	 * At shutdown: BullMQ's close (a bare disconnect leaves the event readers retrying on a timer, which kept a
	 * server told to stop alive), bounded in time (a graceful close would otherwise wait for a Redis that may be
	 * gone), then the connections dropped.
	 */
	async close(): Promise<void> {
		this.closed = true;
		clearInterval(this.poll);
		const all = [...Object.values(this.queues), ...this.events];
		await withTimeout(Promise.allSettled(all.map((q) => q.close())), 2000).catch(() => {});
		this.redis.disconnect();
		await Promise.allSettled(all.map((q) => q.disconnect()));
	}
}

function withTimeout<T>(p: Promise<T>, ms: number): Promise<T> {
	return new Promise((resolve, reject) => {
		const t = setTimeout(() => reject(new Error('timed out')), ms);
		p.then(
			(v) => (clearTimeout(t), resolve(v)),
			(e) => (clearTimeout(t), reject(e))
		);
	});
}
