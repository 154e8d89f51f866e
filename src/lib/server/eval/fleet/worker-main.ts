/**
 * `npm run worker`: one evaluation worker of the fleet (bundled to dist/fleet-worker.mjs by
 * scripts/build-worker.mjs). It needs no database: every job carries its line, its pad context and the rows of
 * the datasets it names. It evaluates in its own evaluation processes — the same pool.ts and child.ts as the
 * server's, with the same heap limit, time budget (the job's), progress and kill-to-cancel — so a fleet answer
 * is the in-process answer.
 *
 * Two BullMQ consumers: the light queue with one job at a time, run in the first process (normal CPU
 * priority), and the heavy queue with one job per remaining process (nice 10), so a light line never waits for
 * a sweep on this machine either. Cancellation comes on a Redis channel (and a key, for a job cancelled before
 * it started); a heartbeat key says the worker is alive and how many processes it has, which is what the
 * server sizes its admission by. Jobs of another code version are refused: the queues are named by version,
 * and the version in each job is checked again here.
 */
import { hostname } from 'node:os';
import { UnrecoverableError, Worker, type Job } from 'bullmq';
import { Redis } from 'ioredis';
import { ProcessPool, WORKER_FILE, type PoolAnswer, type PoolJob, type Slot } from '../pool';
import { evalSettings } from '../settings';
import { decode, encode } from './codec';
import { HEARTBEAT_MS, HEARTBEAT_TTL_MS, codeVersion, connectionFrom, fleetSettings, keys, queueNames, type WorkerInfo } from './config';
import type { FleetAnswer, FleetJobData, FleetPayload } from './jobs';

const url = fleetSettings.url;
if (!url) {
	console.error('BULKPAD_QUEUE is not set: give the Redis address the server uses, e.g. BULKPAD_QUEUE=redis://127.0.0.1:6379');
	process.exit(2);
}
const connection = connectionFrom(url);
/** this worker's own commands beside BullMQ's (heartbeat, cancelled keys) and its subscription to cancellations */
const redis = new Redis(connection);
const subscriber = new Redis(connection);
for (const r of [redis, subscriber]) r.on('error', (e) => console.error(`fleet worker: redis: ${e.message}`));
const version = codeVersion(WORKER_FILE);
const names = queueNames(version);
const processes = Math.max(1, evalSettings.processes);
const id = `${hostname()}:${process.pid}`;
const pool = new ProcessPool(processes, {
	file: WORKER_FILE,
	memoryMb: evalSettings.memoryMb,
	datasetCacheBytes: evalSettings.datasetCacheBytes
});

/**
 * Runs a job on a free process of its kind, or once one is free (only with one process, or while a killed one
 * is replaced). pool.run marks the process busy synchronously, so two waiters never get the same one.
 */
const waitingForSlot: { heavy: boolean; start: (s: Slot) => void }[] = [];
pool.onIdle(() => {
	for (let i = 0; i < waitingForSlot.length;) {
		const slot = pool.take(waitingForSlot[i]!.heavy);
		if (!slot) i++;
		else waitingForSlot.splice(i, 1)[0]!.start(slot);
	}
});
function runOnProcess(heavy: boolean, job: PoolJob): Promise<PoolAnswer> {
	const slot = pool.take(heavy);
	if (slot) return pool.run(slot, job);
	return new Promise((done) => waitingForSlot.push({ heavy, start: (s) => void pool.run(s, job).then(done) }));
}

const running = new Map<string, AbortController>();
const log = (line: string) => console.log(`fleet worker ${id}: ${line}`);

function cancelled(input: string): FleetAnswer {
	return { answer: { ok: false, error: { message: 'evaluation cancelled', start: 0, end: input.length, code: 'limit' } }, runMs: 0 };
}

async function evaluate(job: Job<FleetJobData>, heavy: boolean): Promise<string> {
	if (job.data.version !== version) {
		throw new UnrecoverableError(`refused: this worker runs code version ${version}, the job was made by version ${job.data.version}`);
	}
	const p = decode<FleetPayload>(job.data.payload);
	const jobId = job.id!;
	const ac = new AbortController();
	// registered before the key is read: a cancellation published in between is then caught one way or the other
	running.set(jobId, ac);
	try {
		if (await redis.exists(keys.cancelled(jobId))) return encode(cancelled(p.input));
		if (heavy) log(`job ${jobId} started`);
		const byId = new Map(p.texts.map((t) => [t.id, t]));
		// a job cancelled while it waited for a process answers at once (pool.run checks the signal first)
		const answer = await runOnProcess(heavy, {
			input: p.input,
			ctx: p.ctx,
			datasets: p.datasets,
			otherDatasets: p.otherDatasets,
			loadDatasets: (ids) => ids.flatMap((i) => (byId.has(i) ? [byId.get(i)!] : [])),
			budgetMs: p.budgetMs,
			signal: ac.signal,
			killOnCancel: true,
			onProgress: (pr) => void job.updateProgress(pr).catch(() => {})
		});
		if (heavy) log(`job ${jobId} ${ac.signal.aborted ? 'cancelled' : `done in ${Math.round(answer.runMs)} ms`}`);
		return encode(answer satisfies FleetAnswer);
	} finally {
		running.delete(jobId);
	}
}

const workerOpts = {
	connection,
	lockDuration: fleetSettings.lockMs,
	stalledInterval: Math.max(1000, Math.round(fleetSettings.lockMs / 2)),
	// a job whose worker died goes back to the queue once (evaluation is pure); a second loss fails it
	maxStalledCount: 1
};
const light = new Worker<FleetJobData, string>(names.light, (job) => evaluate(job, false), { ...workerOpts, concurrency: 1 });
const heavyWorker = new Worker<FleetJobData, string>(names.heavy, (job) => evaluate(job, true), {
	...workerOpts,
	concurrency: Math.max(1, processes - 1)
});
for (const w of [light, heavyWorker]) w.on('error', (e) => console.error(`fleet worker ${id}: ${e.message}`));

// cancellations: the server publishes the job id; whichever worker runs it kills its process
await subscriber.subscribe(keys.cancelChannel);
subscriber.on('message', (_channel: string, jobId: string) => {
	const ac = running.get(jobId);
	if (ac && !ac.signal.aborted) {
		log(`job ${jobId} cancelled`);
		ac.abort();
	}
});

const info: WorkerInfo = { id, host: hostname(), pid: process.pid, processes };
async function beat() {
	try {
		await redis.set(keys.worker(version, id), JSON.stringify(info), 'PX', HEARTBEAT_TTL_MS);
	} catch (e) {
		console.error(`fleet worker ${id}: heartbeat failed: ${(e as Error).message}`);
	}
}
// the first beat only once the processes can take work, so the server never counts a worker still starting
while (pool.readyCount() < processes) await new Promise((r) => setTimeout(r, 100));
await beat();
const heartbeat = setInterval(beat, HEARTBEAT_MS);
log(`ready: code version ${version}, ${processes} evaluation processes, queues ${names.light} and ${names.heavy}`);

async function stop(signal: string) {
	log(`${signal}: finishing the jobs in hand, then stopping`);
	clearInterval(heartbeat);
	await redis.del(keys.worker(version, id)).catch(() => 0);
	await Promise.all([light.close(), heavyWorker.close()]);
	await Promise.all([subscriber.quit(), redis.quit()]).catch(() => {});
	pool.killAll();
	process.exit(0);
}
process.once('SIGTERM', () => void stop('SIGTERM'));
process.once('SIGINT', () => void stop('SIGINT'));
