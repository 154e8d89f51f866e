/**
 * Fleet mode's switch: with BULKPAD_QUEUE=redis://host:port, lines go to the evaluation fleet (runner.ts) while
 * it is reachable and has a worker of this code version, and to the in-process pool otherwise — each line
 * decides when it is queued, so a fleet that goes away costs at most the lines it had in hand (answered 503,
 * "try again"), and the next ones run here. Without the variable nothing of this loads (bullmq included).
 */
import { WORKER_FILE } from '../pool';
import { createEvalQueue, type EvalQueue } from '../queue';
import { evalSettings } from '../settings';
import { codeVersion, connectionFrom, fleetSettings } from './config';
import type { FleetRunner } from './runner';

let runner: FleetRunner | undefined;
let starting: Promise<void> | undefined;
let startError: string | undefined;

export const fleetConfigured = () => fleetSettings.url !== '';

// the Redis connections would keep a server told to stop alive: close them with the evaluation pool
process.once('sveltekit:shutdown' as never, () => void runner?.close());

/** Connects to the fleet once (no-op without BULKPAD_QUEUE); never throws: a failure is reported by queueMode(). */
export function connectFleet(): void {
	if (!fleetConfigured() || starting) return;
	starting = (async () => {
		const { FleetRunner } = await import('./runner');
		const r = new FleetRunner({
			connection: connectionFrom(fleetSettings.url),
			version: codeVersion(WORKER_FILE),
			chunks: fleetSettings.chunks,
			lockMs: fleetSettings.lockMs
		});
		runner = r;
		await r.start();
	})().catch((e: Error) => {
		startError = e.message;
		console.error(`evaluation fleet: ${e.message}; evaluating in-process`);
	});
}

/**
 * How lines are evaluated now, for /api/health: 'in-process' (no fleet configured), 'fleet', or 'fallback: …'
 * with the reason (the server then evaluates in-process). No counts: anyone may ask.
 */
export function queueMode(): string {
	if (!fleetConfigured()) return 'in-process';
	connectFleet();
	if (startError) return 'fallback: fleet misconfigured';
	switch (runner?.state ?? 'connecting') {
		case 'fleet':
			return 'fleet';
		case 'unreachable':
			return 'fallback: redis unreachable';
		case 'no-workers':
			return 'fallback: no worker of this code version';
		default:
			return 'fallback: connecting';
	}
}

/** The queue dispatch.ts uses: `local()` alone without a fleet; with one, the fleet while it answers. */
export function queueWithFleet(local: () => EvalQueue): EvalQueue {
	if (!fleetConfigured()) return local();
	connectFleet();
	let here: EvalQueue | undefined;
	let there: EvalQueue | undefined;
	return {
		enqueue(job, owner, priority, opts) {
			if (runner?.state === 'fleet') {
				// the same fair queue, in front of the fleet instead of this machine's processes
				there ??= createEvalQueue(runner, evalSettings);
				return there.enqueue(job, owner, priority, opts);
			}
			here ??= local();
			return here.enqueue(job, owner, priority, opts);
		},
		stats() {
			const a = here?.stats() ?? { waiting: 0, running: 0 };
			const b = there?.stats() ?? { waiting: 0, running: 0 };
			return { waiting: a.waiting + b.waiting, running: a.running + b.running };
		}
	};
}
