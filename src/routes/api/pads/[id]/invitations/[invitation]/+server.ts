import { api, ok } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { findOwnPad } from '$lib/server/pads';
import { revokeInvitation } from '$lib/server/invites';

/** DELETE: revokes the invitation; an accepted one also takes the reader's access to the pad away. */
export const DELETE = api((event) => {
	const pad = findOwnPad(requireWriter(event), event.params.id!);
	revokeInvitation(pad, event.params.invitation!);
	return ok({});
});
