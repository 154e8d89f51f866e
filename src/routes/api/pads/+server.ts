import { api, ok, readBody } from '$lib/server/http';
import { requireUser, requireWriter } from '$lib/server/auth/guards';
import { createPad, listPads } from '$lib/server/pads';
import { padView } from '$lib/server/pad-view';
import { padCreateSchema } from '$lib/server/api-schemas';

/** GET /api/pads: the caller's own pads, newest first (pads shared with them are at /shared). */
export const GET = api((event) => {
	const user = requireUser(event);
	return ok({ pads: listPads(user.id) });
});

/** POST /api/pads {title?}: a fresh pad in the default bulk. An empty body is fine. */
export const POST = api(async (event) => {
	const user = requireWriter(event);
	const { title } = event.request.headers.get('content-length') === '0' ? {} : await readBody(event, padCreateSchema);
	const pad = createPad(user.id, title ?? 'Untitled pad');
	return ok({ pad: padView(pad, user.name) }, { status: 201 });
});
