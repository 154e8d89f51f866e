/**
 * A small pool of evaluation processes (child.ts, bundled to dist/eval-worker.mjs), each forked with its own
 * heap limit. Processes, not worker threads: worker threads' resourceLimits did not contain a line that
 * allocated without bound (the whole server died), whereas a child process that hits --max-old-space-size
 * aborts alone. A process that dies, is killed for its time budget, or is killed to cancel its line, is
 * replaced at once; the line it was running answers 422 and nobody else notices.
 *
 * The pool only runs a job on a slot; which job runs next is the queue's business (queue.ts).
 */
import { fork, type ChildProcess } from 'node:child_process';
import { existsSync } from 'node:fs';
import { setPriority } from 'node:os';
import { resolve } from 'node:path';
import type { PadContext } from '../../lang/result';
import type { DatasetText, FromChild, ToChild } from './protocol';
import type { EvalAnswer } from './worker';
import { evalSettings } from './settings';

/** The bundle built by scripts/build-worker.mjs (esbuild), beside the server build. */
export const WORKER_FILE = resolve(process.env.BULKPAD_WORKER ?? 'dist/eval-worker.mjs');

/** How long a forked process may take to send 'started' for a line it was given before it counts as stuck. */
const START_GRACE_MS = 30_000;

export interface DatasetRef {
	id: string;
	name: string;
	bytes: number;
}

export interface PoolJob {
	input: string;
	/** without datasets: those go by reference and are sent once per process */
	ctx: PadContext;
	datasets: DatasetRef[];
	otherDatasets: string[];
	/** reads rows by id; called only for the datasets the chosen process does not hold yet */
	loadDatasets?: (ids: string[]) => DatasetText[];
	budgetMs: number;
	onProgress?: (p: { done: number; total: number }) => void;
	signal?: AbortSignal;
	/**
	 * Whether aborting the signal kills the process running the line. Light lines finish in milliseconds, so
	 * killing and re-forking a process for one (seconds on a busy machine) would cost everyone more than
	 * letting it end; the queue sets this for heavy lines and replays only.
	 */
	killOnCancel?: boolean;
}

export interface PoolAnswer {
	answer: EvalAnswer;
	/** running time only, from the process's 'started' to its answer (or its death) */
	runMs: number;
}

type KillReason = 'budget' | 'cancelled' | 'stuck';

interface Running {
	id: number;
	job: PoolJob;
	done: (a: PoolAnswer) => void;
	startedAt?: number;
	timer?: ReturnType<typeof setTimeout>;
	onAbort: () => void;
}

export interface Slot {
	index: number;
	child: ChildProcess;
	ready: boolean;
	running?: Running;
	killed?: KillReason;
	/** runs at a lower CPU priority (nice 10): the processes heavy lines may use */
	lowPriority: boolean;
	/** dataset id → bytes, oldest first: what this process holds */
	held: Map<string, number>;
}

function failure(input: string, message: string, hint?: string): EvalAnswer {
	return { ok: false, error: { message, hint, start: 0, end: input.length, code: 'limit' } };
}

export class ProcessPool {
	private slots: Slot[] = [];
	private listeners = new Set<() => void>();
	private seq = 0;
	private closed = false;

	constructor(
		readonly size: number,
		private readonly opts: { file: string; memoryMb: number; datasetCacheBytes: number }
	) {
		if (!existsSync(opts.file)) {
			throw new Error(`The evaluation worker ${opts.file} is missing: run "node scripts/build-worker.mjs".`);
		}
		for (let i = 0; i < size; i++) this.spawn(i, 0);
	}

	/** Calls `cb` whenever a process becomes free (a line finished, or a fresh process is ready). */
	onIdle(cb: () => void): void {
		this.listeners.add(cb);
	}

	/**
	 * A ready process with nothing to do, if any. Heavy lines get only the low-priority processes (all but the
	 * first, when there are two or more), so a process is always left for light lines and a heavy line's CPU
	 * yields to theirs; light lines take the first process first.
	 */
	take(heavy = false): Slot | undefined {
		const free = this.slots.filter((s) => s.ready && !s.running && !s.killed);
		if (heavy) return this.size === 1 ? free[0] : free.find((s) => s.lowPriority);
		return free.find((s) => !s.lowPriority) ?? free[0];
	}

	/** Processes alive and ready (for health reporting and tests). */
	readyCount(): number {
		return this.slots.filter((s) => s.ready && !s.killed).length;
	}

	run(slot: Slot, job: PoolJob): Promise<PoolAnswer> {
		return new Promise((done) => {
			if (job.signal?.aborted) return done({ answer: failure(job.input, 'evaluation cancelled'), runMs: 0 });
			const id = ++this.seq;
			const running: Running = { id, job, done, onAbort: () => this.kill(slot, 'cancelled') };
			slot.running = running;
			if (job.killOnCancel !== false) job.signal?.addEventListener('abort', running.onAbort, { once: true });
			running.timer = setTimeout(() => this.kill(slot, 'stuck'), job.budgetMs + START_GRACE_MS);
			let message: ToChild;
			try {
				message = { type: 'run', id, input: job.input, ctx: job.ctx, ...this.datasetsFor(slot, job) };
			} catch (e) {
				this.finish(slot, {
					ok: false,
					error: { message: `internal error: ${(e as Error).message}`, start: 0, end: job.input.length, code: 'internal' }
				});
				return;
			}
			slot.child.send(message, (err) => {
				if (err && slot.running?.id === id) this.kill(slot, 'stuck');
			});
		});
	}

	/** Which datasets travel with this line: only those the process does not hold; the oldest go past the budget. */
	private datasetsFor(slot: Slot, job: PoolJob): Pick<ToChild, 'datasets' | 'otherDatasets' | 'load' | 'evict'> {
		const missing = job.datasets.filter((d) => !slot.held.has(d.id));
		const load = missing.length && job.loadDatasets ? job.loadDatasets(missing.map((d) => d.id)) : [];
		const loaded = new Set(load.map((l) => l.id));
		for (const d of job.datasets) {
			if (!slot.held.has(d.id) && !loaded.has(d.id)) continue; // vanished since the line was planned
			slot.held.delete(d.id); // re-insert: most recently used last
			slot.held.set(d.id, d.bytes);
		}
		const evict: string[] = [];
		let total = [...slot.held.values()].reduce((a, b) => a + b, 0);
		const inUse = new Set(job.datasets.map((d) => d.id));
		for (const [id, bytes] of slot.held) {
			if (total <= this.opts.datasetCacheBytes) break;
			if (inUse.has(id)) continue;
			slot.held.delete(id);
			evict.push(id);
			total -= bytes;
		}
		return { datasets: Object.fromEntries(job.datasets.map((d) => [d.name, d.id])), otherDatasets: job.otherDatasets, load, evict };
	}

	private spawn(index: number, failures: number) {
		const child = fork(this.opts.file, [], {
			execArgv: [`--max-old-space-size=${this.opts.memoryMb}`],
			// structured clone keeps NaN and ±Infinity in results, as worker threads did
			serialization: 'advanced',
			stdio: ['ignore', 'inherit', 'inherit', 'ipc']
		});
		// the server's open listener keeps it alive, not its evaluators: a server told to stop must be able to
		child.unref();
		(child.channel as { unref?: () => void } | undefined)?.unref?.();
		const lowPriority = this.size > 1 && index > 0;
		if (lowPriority && child.pid) {
			try {
				setPriority(child.pid, 10);
			} catch {
				/* not permitted here: the process then competes at normal priority */
			}
		}
		const slot: Slot = { index, child, ready: false, lowPriority, held: new Map() };
		this.slots[index] = slot;
		child.on('message', (m: FromChild) => this.onMessage(slot, m, index));
		child.on('error', (e) => console.error(`evaluation process ${index}:`, e.message));
		child.on('exit', () => {
			const reason = slot.killed;
			slot.killed = slot.killed ?? 'stuck';
			if (slot.running) {
				const mem = this.opts.memoryMb;
				const input = slot.running.job.input;
				const budget = (slot.running.job.budgetMs / 1000).toFixed(1);
				this.finish(
					slot,
					reason === 'cancelled'
						? failure(input, 'evaluation cancelled')
						: reason === 'budget'
							? failure(input, `evaluation stopped: over the time budget of ${budget} s`, 'use fewer sweep points or a lower order')
							: failure(input, `evaluation stopped: it ran out of memory (${mem} MB) or crashed`, 'use fewer sweep points or a lower order')
				);
			}
			if (this.closed) return;
			// a process that dies before it is ready points at a broken bundle: back off instead of spinning
			const next = slot.ready ? 0 : failures + 1;
			setTimeout(() => !this.closed && this.spawn(index, next), next === 0 ? 0 : Math.min(30_000, 500 * 2 ** next));
		});
	}

	private onMessage(slot: Slot, m: FromChild, index: number) {
		if (m.type === 'ready') {
			if (this.slots[index] !== slot) return;
			slot.ready = true;
			this.notify();
			return;
		}
		const r = slot.running;
		if (!r || r.id !== m.id) return;
		if (m.type === 'started') {
			r.startedAt = performance.now();
			clearTimeout(r.timer);
			r.timer = setTimeout(() => this.kill(slot, 'budget'), r.job.budgetMs);
		} else if (m.type === 'progress') r.job.onProgress?.({ done: m.done, total: m.total });
		else if (m.type === 'answer') this.finish(slot, m.answer);
	}

	private finish(slot: Slot, answer: EvalAnswer) {
		const r = slot.running;
		if (!r) return;
		clearTimeout(r.timer);
		r.job.signal?.removeEventListener('abort', r.onAbort);
		slot.running = undefined;
		r.done({ answer, runMs: r.startedAt === undefined ? 0 : performance.now() - r.startedAt });
		if (!slot.killed) this.notify();
	}

	private kill(slot: Slot, reason: KillReason) {
		if (slot.killed) return;
		slot.killed = reason;
		slot.child.kill('SIGKILL');
	}

	private notify() {
		for (const cb of this.listeners) cb();
	}

	/** Synchronous, for process 'exit' handlers. */
	killAll(): void {
		this.closed = true;
		for (const s of this.slots) s.child.kill('SIGKILL');
	}

	async close(): Promise<void> {
		this.killAll();
	}
}

let shared: ProcessPool | undefined;

// the evaluators go with the server, however it stops (a busy evaluator would not notice its channel closing)
process.once('exit', () => shared?.killAll());
process.once('sveltekit:shutdown' as never, () => void closePool());

/** The server's pool: BULKPAD_EVAL_THREADS processes (the name predates processes; the meaning is the same). */
export function getPool(): ProcessPool {
	shared ??= new ProcessPool(evalSettings.processes, {
		file: WORKER_FILE,
		memoryMb: evalSettings.memoryMb,
		datasetCacheBytes: evalSettings.datasetCacheBytes
	});
	return shared;
}

/** Starts the processes at server start, so the first user does not wait for the engine to load. */
export async function warmPool(): Promise<void> {
	const pool = getPool();
	const deadline = Date.now() + 60_000;
	while (pool.readyCount() < pool.size && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
}

export async function closePool(): Promise<void> {
	await shared?.close();
	shared = undefined;
}
