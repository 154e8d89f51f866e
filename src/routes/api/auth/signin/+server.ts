import { api, ok, readBody } from '$lib/server/http';
import { checkCredentials, signInSchema, startSession } from '$lib/server/auth/accounts';

/** POST {email, password}: 401 wrong, 403 address not confirmed yet, 429 with Retry-After after wrong tries. */
export const POST = api(async (event) => {
	const input = await readBody(event, signInSchema);
	const user = await checkCredentials(input, event.getClientAddress());
	await startSession(event.cookies, user.id, event.request.headers.get('user-agent') ?? '');
	return ok({ user });
});
