import { api, ok, readBody } from '$lib/server/http';
import { resendConfirmation } from '$lib/server/auth/signup';
import { emailBodySchema } from '$lib/server/api-schemas';

/** POST {email}: a new confirmation link for an unconfirmed account; the same {ok} for any address. */
export const POST = api(async (event) => {
	const { email } = await readBody(event, emailBodySchema);
	resendConfirmation(email, event.getClientAddress());
	return ok({});
});
