import { api, failure, ok, readBody } from '$lib/server/http';
import { requireUser } from '$lib/server/auth/guards';
import { changePassword, changePasswordSchema, startSession } from '$lib/server/auth/accounts';

/**
 * POST {current, password}: sets a new password. Every session and every key of the account ends; the browser
 * that made the change gets a new session, a key-authenticated call gets none.
 */
export const POST = api(async (event) => {
	const user = requireUser(event);
	if (event.locals.via !== 'session') failure(403, 'Change the password from a signed-in browser, not with a key.');
	const input = await readBody(event, changePasswordSchema);
	await changePassword(user.id, input);
	await startSession(event.cookies, user.id, event.request.headers.get('user-agent') ?? '');
	return ok({});
});
