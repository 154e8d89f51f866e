import { api, ok } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { findSharedPad, forkPad } from '$lib/server/transcripts';

/** POST: members and admins copy the transcript into a new pad of their own; readers get 403. */
export const POST = api((event) => {
	const user = requireWriter(event);
	const pad = forkPad(findSharedPad(event.params.slug!), user);
	return ok({ pad: { id: pad.id, title: pad.title } }, { status: 201 });
});
