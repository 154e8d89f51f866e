import { z } from 'zod';
import { api, failure, ok, readBody } from '$lib/server/http';
import { passwordSchema } from '$lib/server/auth/accounts';
import { confirmPasswordReset } from '$lib/server/password-reset';

const confirmSchema = z.object({ token: z.string().min(10).max(200), password: passwordSchema });

/** POST {token, password}: sets the password and ends every session of the account; the token is spent. */
export const POST = api(async (event) => {
	const { token, password } = await readBody(event, confirmSchema);
	if (!(await confirmPasswordReset(token, password))) failure(400, 'This reset link is invalid, used or expired; ask for a new one.');
	return ok({});
});
