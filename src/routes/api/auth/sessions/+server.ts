import { api, failure, ok } from '$lib/server/http';
import { requireUser } from '$lib/server/auth/guards';
import { listSessions, revokeOtherSessions } from '$lib/server/auth/sessions';

/** GET: the caller's live sessions (created, last seen, expiry, browser); `current` marks this one. */
export const GET = api((event) => ok({ sessions: listSessions(requireUser(event).id, event.locals.session?.id) }));

/** DELETE: ends every session of the caller except the one making the request. */
export const DELETE = api((event) => {
	const user = requireUser(event);
	if (event.locals.via !== 'session') failure(403, 'Sign out other sessions from a signed-in browser, not with a key.');
	return ok({ ended: revokeOtherSessions(user.id, event.locals.session?.id) });
});
