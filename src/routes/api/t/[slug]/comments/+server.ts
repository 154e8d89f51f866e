import { api, ok, readBody } from '$lib/server/http';
import { requireUser } from '$lib/server/auth/guards';
import { openShare } from '$lib/server/snapshots';
import { addComment, commentSchema, listComments } from '$lib/server/comments';

/** GET: the snapshot's comments, for anyone signed in who holds the live link (readers of the snapshot). */
export const GET = api((event) => {
	const user = requireUser(event);
	const { share } = openShare(event.params.slug!);
	return ok({ comments: listComments(share.slug, user) });
});

/** POST {step, body}: a comment on one step of the snapshot (any signed-in role, readers too); rate-limited. */
export const POST = api(async (event) => {
	const user = requireUser(event);
	const opened = openShare(event.params.slug!);
	const input = await readBody(event, commentSchema);
	return ok({ comment: addComment(opened, user, input) }, { status: 201 });
});
