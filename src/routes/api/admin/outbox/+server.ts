import { api, ok } from '$lib/server/http';
import { requireRole } from '$lib/server/auth/guards';
import { listOutbox } from '$lib/server/mail/send';

/** GET: the latest 200 messages Bulkpad sent or tried to send (admin). */
export const GET = api((event) => {
	requireRole(event, 'admin');
	return ok({ messages: listOutbox() });
});
