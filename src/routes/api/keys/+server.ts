import { api, failure, ok, readBody } from '$lib/server/http';
import { requireUser, requireWriter } from '$lib/server/auth/guards';
import { createKeySchema, listKeys, makeKey } from '$lib/server/keys';

/** GET /api/keys — the caller's keys: label and prefix, never the key. */
export const GET = api((event) => ok({ keys: listKeys(requireUser(event)) }));

/** POST /api/keys {label, perMinute?, expiresAt?} — the key is in this answer and nowhere else, ever. */
export const POST = api(async (event) => {
	const user = requireWriter(event);
	// a key that could mint keys would outlive its own revocation
	if (event.locals.via === 'key') failure(403, 'Make keys from a signed-in session, not with another key.');
	const { label, perMinute, expiresAt } = await readBody(event, createKeySchema);
	const made = makeKey(user, label, { perMinute, expiresAt });
	return ok(
		{ key: made.key, id: made.id, prefix: made.prefix, label: made.label, perMinute: made.perMinute, expiresAt: made.expiresAt },
		{ status: 201 }
	);
});
