import { z } from 'zod';
import { api, ok, readBody } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { findOwnPad } from '$lib/server/pads';
import { createShare, listShares, shareUrl } from '$lib/server/transcripts';

const shareSchema = z.object({ expiresInDays: z.number().int().min(1).max(365).optional() });

/** POST {expiresInDays?}: a new read-only link (owner only) → 201 {slug, url, expiresAt}. */
export const POST = api(async (event) => {
	const user = requireWriter(event);
	const pad = findOwnPad(user, event.params.id!);
	const { expiresInDays } = event.request.headers.get('content-length') === '0' ? {} : await readBody(event, shareSchema);
	const share = createShare(pad, user, expiresInDays);
	return ok({ slug: share.slug, url: shareUrl(share.slug, event.url.origin), expiresAt: share.expiresAt }, { status: 201 });
});

/** GET: every link of the pad, live or not, newest first. */
export const GET = api((event) => {
	const user = requireWriter(event);
	return ok({ shares: listShares(findOwnPad(user, event.params.id!), event.url.origin) });
});
