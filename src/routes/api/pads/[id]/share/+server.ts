import { api, ok, readBody } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { findOwnPad } from '$lib/server/pads';
import { createShare, listShares, shareUrl } from '$lib/server/transcripts';
import { shareSchema } from '$lib/server/api-schemas';

/** POST {expiresInDays?, note?}: a new snapshot of the pad as it is now, behind a read-only link (owner only) → 201 {slug, url, expiresAt, note}. */
export const POST = api(async (event) => {
	const user = requireWriter(event);
	const pad = findOwnPad(user, event.params.id!);
	const { expiresInDays, note } = event.request.headers.get('content-length') === '0' ? {} : await readBody(event, shareSchema);
	const share = createShare(pad, user, expiresInDays, note);
	return ok(
		{
			slug: share.slug,
			url: shareUrl(share.slug, event.url.origin),
			expiresAt: share.expiresAt,
			note: share.note,
			frozenAt: share.frozenAt
		},
		{ status: 201 }
	);
});

/** GET: every snapshot of the pad, live or not, newest first (note, date, steps, comment count). */
export const GET = api((event) => {
	const user = requireWriter(event);
	return ok({ shares: listShares(findOwnPad(user, event.params.id!), event.url.origin) });
});
