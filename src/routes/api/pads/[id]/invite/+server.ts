import { api, ok, readBody } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { findOwnPad } from '$lib/server/pads';
import { invitePerson } from '$lib/server/invites';
import { emailBodySchema } from '$lib/server/api-schemas';

/**
 * POST {email}: mails a single-use invitation link to that address; nothing is granted until someone accepts
 * with the link. The answer says whether the mail went out (a link from a failed send never works).
 */
export const POST = api(async (event) => {
	const user = requireWriter(event);
	const pad = findOwnPad(user, event.params.id!);
	const { email } = await readBody(event, emailBodySchema);
	const { invitation, mail } = await invitePerson(pad, user, email, event.getClientAddress());
	return ok({ mail: { status: mail.status }, invitation });
});
