import { api, ok } from '$lib/server/http';
import { endSession } from '$lib/server/auth/accounts';

export const POST = api(async (event) => {
	await endSession(event.cookies, event.locals.session?.id);
	return ok({});
});
