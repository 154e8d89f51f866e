import { env } from './env';
import { failure } from './http';
import { createRateLimiter } from './rate-limit';
import { replaySteps } from './eval/service';
import type { PadRow, StepRow } from './pads';

/** Replays run the whole engine for anyone with a link, so each client address gets env.replayPerMinute. */
export const replayLimiter = createRateLimiter(env.replayPerMinute, 60_000);

export function takeReplay(clientAddress: string) {
	if (!replayLimiter.take(clientAddress)) {
		failure(429, `Too many replays from this address; try again in ${replayLimiter.retryAfterSeconds(clientAddress)} s.`);
	}
}

/** The replay answer of API.md: per step {n, drift, delta, results?, error?} and how many drifted. */
export async function replayAnswer(pad: PadRow, steps: StepRow[]) {
	const replayed = await replaySteps(pad, steps);
	return {
		steps: replayed.map(({ n, drift, delta, results, error }) => ({ n, drift, delta, results, error })),
		drifted: replayed.filter((s) => s.drift).length
	};
}
