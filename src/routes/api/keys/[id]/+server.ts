import { api, ok } from '$lib/server/http';
import { requireUser } from '$lib/server/auth/guards';
import { revokeKey } from '$lib/server/keys';

/** DELETE /api/keys/[id] — revoke one of the caller's keys; any role may revoke its own. */
export const DELETE = api((event) => {
	revokeKey(requireUser(event), event.params.id!);
	return ok({});
});
