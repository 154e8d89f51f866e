import { z } from 'zod';
import { api, ok, readBody } from '$lib/server/http';
import { emailSchema } from '$lib/server/auth/accounts';
import { resendConfirmation } from '$lib/server/auth/signup';

/** POST {email}: a new confirmation link for an unconfirmed account; the same {ok} for any address. */
export const POST = api(async (event) => {
	const { email } = await readBody(event, z.object({ email: emailSchema }));
	resendConfirmation(email, event.getClientAddress());
	return ok({});
});
