import { api, ok, readBody } from '$lib/server/http';
import { requireUser, requireWriter } from '$lib/server/auth/guards';
import { changeMacro, changeSchema, getMacro } from '$lib/server/macros';

/** GET /api/macros/[id] — one macro with every version it has had. */
export const GET = api((event) => {
	const user = requireUser(event);
	return ok({ macro: getMacro(user, event.params.id!) });
});

/** PATCH /api/macros/[id] — {action:'approve'|'retire'} (admin) or {action:'edit', description?, params?, body?}. */
export const PATCH = api(async (event) => {
	const user = requireWriter(event);
	const change = await readBody(event, changeSchema);
	return ok({ macro: changeMacro(user, event.params.id!, change) });
});
