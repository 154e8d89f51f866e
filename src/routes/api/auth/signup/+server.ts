import { api, ok, readBody } from '$lib/server/http';
import { createUser, signUpSchema, startSession } from '$lib/server/auth/accounts';

export const POST = api(async (event) => {
	const input = await readBody(event, signUpSchema);
	const user = await createUser(input);
	await startSession(event.cookies, user.id);
	return ok({ user }, { status: 201 });
});
