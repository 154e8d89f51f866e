import { error, redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { ApiFailure } from '$lib/server/http';
import { findReadablePad, padSteps } from '$lib/server/pads';
import { transcriptOf } from '$lib/server/transcripts';

/** The read-only view of a pad for the people invited to it (and its owner); anyone else gets 404. */
export const load: PageServerLoad = ({ params, locals }) => {
	if (!locals.user) redirect(303, `/signin?next=/shared/${encodeURIComponent(params.id)}`);
	try {
		const pad = findReadablePad(locals.user, params.id);
		return { id: pad.id, transcript: transcriptOf(pad, padSteps(pad.id)), isOwner: pad.ownerId === locals.user.id };
	} catch (e) {
		if (e instanceof ApiFailure) error(e.status, e.message);
		throw e;
	}
};
