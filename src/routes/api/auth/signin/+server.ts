import { api, ok, readBody } from '$lib/server/http';
import { checkCredentials, signInSchema, startSession } from '$lib/server/auth/accounts';

export const POST = api(async (event) => {
	const input = await readBody(event, signInSchema);
	const user = await checkCredentials(input, event.getClientAddress());
	await startSession(event.cookies, user.id);
	return ok({ user });
});
