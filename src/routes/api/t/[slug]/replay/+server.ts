import { api, ok } from '$lib/server/http';
import { findSharedPad } from '$lib/server/transcripts';
import { padSteps } from '$lib/server/pads';
import { replayAnswer, takeReplay } from '$lib/server/replay';

/**
 * POST: re-evaluates every step now and marks drift; nothing is stored. Public, so it is limited per client
 * address before anything else runs (guessing slugs costs the same budget as replaying).
 */
export const POST = api(async (event) => {
	takeReplay(event.getClientAddress());
	const pad = findSharedPad(event.params.slug!);
	return ok(await replayAnswer(pad, padSteps(pad.id)));
});
