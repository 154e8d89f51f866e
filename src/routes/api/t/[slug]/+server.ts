import { api, ok } from '$lib/server/http';
import { snapshotTranscript } from '$lib/server/transcripts';
import { openShare } from '$lib/server/snapshots';

/** GET: the public transcript (the pad frozen when the link was made) — no account needed; revoked, expired and unknown links are 404. */
export const GET = api((event) => ok(snapshotTranscript(openShare(event.params.slug!))));
