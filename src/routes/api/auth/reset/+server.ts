import { z } from 'zod';
import { api, ok, readBody } from '$lib/server/http';
import { emailSchema } from '$lib/server/auth/accounts';
import { requestPasswordReset } from '$lib/server/password-reset';

/** POST {email}: always {ok} whether or not the account exists; the link goes out only when it does. */
export const POST = api(async (event) => {
	const { email } = await readBody(event, z.object({ email: emailSchema }));
	requestPasswordReset(email, event.getClientAddress());
	return ok({});
});
