import { api, failure, ok, readBody } from '$lib/server/http';
import { confirmAddress } from '$lib/server/auth/signup';
import { tokenBodySchema } from '$lib/server/api-schemas';

/** POST {token}: confirms the address the link went to; {email, padId} (the pad of an invitation it accepted). */
export const POST = api(async (event) => {
	const { token } = await readBody(event, tokenBodySchema);
	const done = confirmAddress(token);
	if (!done) failure(400, 'This confirmation link is invalid, used or expired; sign in to ask for a new one.');
	return ok(done);
});
