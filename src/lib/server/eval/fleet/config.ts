/**
 * What the server and the fleet's workers agree on: the Redis address, the queue names, the code version and
 * the timings of BullMQ's locks. Read once from the environment (listed in DEVELOPERS.md).
 */
import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import type { RedisOptions } from 'ioredis';

function intFrom(name: string, fallback: number): number {
	const raw = process.env[name];
	const n = raw === undefined ? NaN : Number(raw);
	return Number.isFinite(n) && n > 0 ? n : fallback;
}

export const fleetSettings = {
	/** `redis://host:port[/db]`: fleet mode on; unset: everything in-process, as before */
	url: process.env.BULKPAD_QUEUE ?? '',
	/** most chunks a split sweep is cut into (fewer with a small fleet: two per heavy process) */
	chunks: intFrom('BULKPAD_FLEET_CHUNKS', 16),
	/**
	 * How long a worker's lock on a job lasts without renewal: a worker that dies mid-job is noticed after about
	 * this long (plus the stalled check's interval), and its job is then retried once on another worker.
	 */
	lockMs: intFrom('BULKPAD_FLEET_LOCK_MS', 10_000)
};

/** Connection options (ioredis's, which BullMQ takes too) from a `redis://` address. */
export function connectionFrom(url: string): RedisOptions {
	const u = new URL(url);
	if (u.protocol !== 'redis:') throw new Error(`BULKPAD_QUEUE must be redis://host:port, not ${u.protocol}`);
	const db = u.pathname.length > 1 ? Number(u.pathname.slice(1)) : 0;
	return {
		host: u.hostname || '127.0.0.1',
		port: Number(u.port || 6379),
		db: Number.isInteger(db) ? db : 0,
		...(u.password ? { password: decodeURIComponent(u.password) } : {}),
		...(u.username ? { username: decodeURIComponent(u.username) } : {}),
		// BullMQ's workers block on Redis; it asks for this so a blocked call is never retried half-way
		maxRetriesPerRequest: null
	};
}

/**
 * The code version: the first 16 hex digits of the sha-256 of the evaluation bundle (dist/eval-worker.mjs),
 * which is everything a result depends on (language, engine, mathjs, nerdamer). The server and each worker
 * hash their own copy; jobs go on queues named by it, carry it, and a worker refuses one of another version.
 */
export function codeVersion(bundle: string): string {
	return createHash('sha256').update(readFileSync(bundle)).digest('hex').slice(0, 16);
}

/** Light lines and heavy work (sweep chunks, balls, metric bulks, macros, compare) go on separate queues. */
export function queueNames(version: string) {
	return { light: `bulkpad-${version}-light`, heavy: `bulkpad-${version}-heavy` };
}

/** Redis keys beside BullMQ's: live workers, cancelled jobs, and the channel cancellations go out on. */
export const keys = {
	worker: (version: string, id: string) => `bulkpad:worker:${version}:${id}`,
	workers: (version: string) => `bulkpad:worker:${version}:*`,
	cancelled: (jobId: string) => `bulkpad:cancelled:${jobId}`,
	cancelChannel: 'bulkpad:cancel'
};

/** How often a worker says it is alive, and how long that lasts. */
export const HEARTBEAT_MS = 2_000;
export const HEARTBEAT_TTL_MS = 7_000;

/** What a worker says about itself in its heartbeat. */
export interface WorkerInfo {
	id: string;
	host: string;
	pid: number;
	/** evaluation processes: one takes light lines, the others (at lower CPU priority) heavy work */
	processes: number;
}
