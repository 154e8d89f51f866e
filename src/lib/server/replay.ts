/**
 * Replays for anyone with a transcript link, and for members. A replay re-runs every step, so it is the most
 * expensive thing an anonymous client can ask for. Four guards, cheapest first:
 * - per client address, env.replayPerMinute (before anything else runs);
 * - an unchanged transcript reuses the fresh answers of its last complete replay (the engine in this process
 *   produced them, so a new run could only give the same numbers); drift is still marked against the
 *   recorded results as they are now;
 * - clients replaying the same transcript at once share one run, which is cancelled when the last of them
 *   hangs up;
 * - a fresh run of one transcript at most BULKPAD_REPLAY_PER_TRANSCRIPT_PER_MINUTE times a minute, however
 *   many addresses ask; each run has one budget as a whole (BULKPAD_REPLAY_BUDGET_MS) and queues behind
 *   everyone's own lines.
 */
import { env } from './env';
import { failure } from './http';
import { createRateLimiter } from './rate-limit';
import { markDrift, replaySteps, type FreshStep, type ReplayedStep, type ReplayStep } from './eval/service';
import { evalSettings } from './eval/settings';
import type { PadRow } from './pads';

/** Replays run the whole engine for anyone with a link, so each client address gets env.replayPerMinute. */
export const replayLimiter = createRateLimiter(env.replayPerMinute, 60_000);
export const transcriptReplayLimiter = createRateLimiter(evalSettings.replayPerTranscriptPerMinute, 60_000);

export function takeReplay(clientAddress: string) {
	if (!replayLimiter.take(clientAddress)) {
		const wait = replayLimiter.retryAfterSeconds(clientAddress);
		failure(429, `Too many replays from this address; try again in ${wait} s.`, { retryAfter: wait });
	}
}

type ReplayAnswer = { steps: Omit<ReplayedStep, 'input' | 'recordedError'>[]; drifted: number; failed: number; skipped: number };

const CACHE_MAX = 200;
const lastRun = new Map<string, { key: string; fresh: FreshStep[] }>();
const flights = new Map<string, { promise: Promise<FreshStep[]>; controller: AbortController; waiters: number }>();

/**
 * What a fresh run depends on: the first step's bulk and every input, in order. Steps that reach the library
 * (macros, datasets) can give other answers for the same text, so those transcripts are never reused.
 */
function fingerprint(pad: PadRow, steps: ReplayStep[]): { key: string; reusable: boolean } {
	const key = JSON.stringify([pad.id, pad.validityTol ?? null, steps[0]?.bulkBefore ?? null, steps.map((s) => [s.n, s.input])]);
	return { key, reusable: !steps.some((s) => s.input.includes('@') || s.input.includes('compare')) };
}

export interface ReplayRequest {
	/** whose replay this is for the queue: a user id, or `replay:<address>` for anonymous clients */
	owner: string;
	/** the client hanging up */
	signal: AbortSignal;
	/** anonymous replays also count against the transcript's own limit */
	limitTranscript: boolean;
}

function answerOf(steps: ReplayStep[], fresh: FreshStep[], reused: boolean): ReplayAnswer & { reused?: true } {
	const replayed = markDrift(steps, fresh);
	return {
		steps: replayed.map(({ n, drift, failed, delta, results, error, skipped }) => ({
			n,
			drift,
			failed,
			delta,
			results,
			error,
			...(skipped ? { skipped } : {})
		})),
		drifted: replayed.filter((s) => s.drift).length,
		failed: replayed.filter((s) => s.failed).length,
		skipped: replayed.filter((s) => s.skipped).length,
		...(reused ? { reused: true as const } : {})
	};
}

/**
 * The replay answer of API.md: per step {n, drift, failed, delta, results?, error?}, how many drifted, failed
 * and were skipped. A step that fails now is `failed` whether or not it failed the same way when recorded.
 */
export async function replayAnswer(pad: PadRow, steps: ReplayStep[], req: ReplayRequest): Promise<ReplayAnswer & { reused?: true }> {
	const { key, reusable } = fingerprint(pad, steps);
	const last = lastRun.get(pad.id);
	if (reusable && last?.key === key) return answerOf(steps, last.fresh, true);

	let flight = flights.get(key);
	if (!flight) {
		if (req.limitTranscript && !transcriptReplayLimiter.take(pad.id)) {
			const wait = transcriptReplayLimiter.retryAfterSeconds(pad.id);
			failure(429, `This transcript is being replayed too often; try again in ${wait} s.`, { retryAfter: wait });
		}
		const controller = new AbortController();
		const promise = replaySteps(pad, steps, { owner: req.owner, signal: controller.signal }).then((fresh) => {
			if (reusable && fresh.every((f) => f.skipped === undefined)) {
				lastRun.delete(pad.id);
				lastRun.set(pad.id, { key, fresh });
				if (lastRun.size > CACHE_MAX) lastRun.delete(lastRun.keys().next().value!);
			}
			return fresh;
		});
		flight = { promise, controller, waiters: 0 };
		const mine = flight;
		flights.set(key, mine);
		promise.finally(() => flights.get(key) === mine && flights.delete(key)).catch(() => undefined);
	}
	const f = flight;
	f.waiters++;
	// the run is shared: it stops only when the last client waiting for it has hung up
	const leave = () => {
		if (--f.waiters === 0) f.controller.abort();
	};
	if (req.signal.aborted) leave();
	else req.signal.addEventListener('abort', leave, { once: true });
	try {
		return answerOf(steps, await f.promise, false);
	} finally {
		if (!req.signal.aborted) {
			req.signal.removeEventListener('abort', leave);
			f.waiters--;
		}
	}
}
