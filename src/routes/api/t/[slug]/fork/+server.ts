import { api, ok } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { forkSnapshot } from '$lib/server/transcripts';
import { openShare } from '$lib/server/snapshots';

/**
 * POST: members and admins copy the snapshot into a new pad of their own; readers get 403. The datasets its
 * steps compare against come along (copied, kept when the forker has one of that name, or skipped at quota).
 */
export const POST = api((event) => {
	const user = requireWriter(event);
	const pad = forkSnapshot(openShare(event.params.slug!), user);
	return ok({ pad: { id: pad.id, title: pad.title }, datasets: pad.datasets }, { status: 201 });
});
