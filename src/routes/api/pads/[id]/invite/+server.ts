import { z } from 'zod';
import { api, ok, readBody } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { emailSchema } from '$lib/server/auth/accounts';
import { findOwnPad } from '$lib/server/pads';
import { invitePerson } from '$lib/server/invites';

/**
 * POST {email}: gives that address read access and mails the invitation. The answer says whether the mail
 * went out; the access is granted either way (the admin outbox shows a failed send).
 */
export const POST = api(async (event) => {
	const user = requireWriter(event);
	const pad = findOwnPad(user, event.params.id!);
	const { email } = await readBody(event, z.object({ email: emailSchema }));
	const mail = await invitePerson(pad, user, email);
	return ok({ mail: { status: mail.status } });
});
