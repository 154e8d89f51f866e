import { api, ok } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { findOwnPad } from '$lib/server/pads';
import { revokeShare } from '$lib/server/transcripts';

/** DELETE: revokes the link; its transcript answers 404 from now on. */
export const DELETE = api((event) => {
	const user = requireWriter(event);
	revokeShare(findOwnPad(user, event.params.id!), event.params.slug!);
	return ok({});
});
