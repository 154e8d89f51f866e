import { api, ok } from '$lib/server/http';
import { findSharedPad, transcriptOf } from '$lib/server/transcripts';

/** GET: the public transcript — no account needed; revoked, expired and unknown links are 404. */
export const GET = api((event) => ok(transcriptOf(findSharedPad(event.params.slug!))));
