import { api, ok } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { findOwnPad } from '$lib/server/pads';
import { listInvitations } from '$lib/server/invites';

/** GET: every invitation of the owner's pad (pending, accepted, revoked), with who accepted it. */
export const GET = api((event) => {
	const pad = findOwnPad(requireWriter(event), event.params.id!);
	return ok({ invitations: listInvitations(pad) });
});
