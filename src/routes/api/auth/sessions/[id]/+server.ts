import { api, ok } from '$lib/server/http';
import { requireUser } from '$lib/server/auth/guards';
import { revokeSession } from '$lib/server/auth/sessions';

/** DELETE /api/auth/sessions/[id]: ends one of the caller's sessions (ending this one signs it out). */
export const DELETE = api((event) => {
	revokeSession(requireUser(event).id, event.params.id!);
	return ok({});
});
