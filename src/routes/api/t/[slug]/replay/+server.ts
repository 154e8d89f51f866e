import { api, ok } from '$lib/server/http';
import { openShare, snapshotStepRows } from '$lib/server/snapshots';
import { replayAnswer, takeReplay } from '$lib/server/replay';
import { clientGone } from '$lib/server/eval/disconnect';

/**
 * POST: re-evaluates every step of the snapshot now and marks drift; nothing is stored. Public, so it is limited per client
 * address before anything else runs (guessing slugs costs the same budget as replaying), then per transcript;
 * an unchanged transcript is answered from its last replay, and the run stops when its clients hang up.
 */
export const POST = api(async (event) => {
	const address = event.getClientAddress();
	takeReplay(address);
	const { pad, snapshot } = openShare(event.params.slug!);
	const gone = clientGone(event);
	try {
		const owner = event.locals.user ? event.locals.user.id : `replay:${address}`;
		// the snapshot's validity tolerance, not the live pad's: the link replays the pad as it was shared
		const frozen = { ...pad, validityTol: snapshot.validityTol ?? null };
		return ok(await replayAnswer(frozen, snapshotStepRows(snapshot), { owner, signal: gone.signal, limitTranscript: !event.locals.user }));
	} finally {
		gone.done();
	}
});
