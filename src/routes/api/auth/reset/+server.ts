import { api, ok, readBody } from '$lib/server/http';
import { requestPasswordReset } from '$lib/server/password-reset';
import { emailBodySchema } from '$lib/server/api-schemas';

/** POST {email}: always {ok} whether or not the account exists; the link goes out only when it does. */
export const POST = api(async (event) => {
	const { email } = await readBody(event, emailBodySchema);
	requestPasswordReset(email, event.getClientAddress());
	return ok({});
});
