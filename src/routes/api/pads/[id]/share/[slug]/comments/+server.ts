import { api, ok } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { findOwnPad } from '$lib/server/pads';
import { findShareOf } from '$lib/server/transcripts';
import { listComments } from '$lib/server/comments';

/** GET: the owner reads the comments on one of their snapshots, revoked or expired ones too; others get 404. */
export const GET = api((event) => {
	const user = requireWriter(event);
	const share = findShareOf(findOwnPad(user, event.params.id!), event.params.slug!);
	return ok({ comments: listComments(share.slug, user) });
});
