import { api, failure, ok, readBody } from '$lib/server/http';
import { confirmPasswordReset } from '$lib/server/password-reset';
import { resetConfirmSchema } from '$lib/server/api-schemas';

/** POST {token, password}: sets the password and ends every session of the account; the token is spent. */
export const POST = api(async (event) => {
	const { token, password } = await readBody(event, resetConfirmSchema);
	if (!(await confirmPasswordReset(token, password))) failure(400, 'This reset link is invalid, used or expired; ask for a new one.');
	return ok({});
});
