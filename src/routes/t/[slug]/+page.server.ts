import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { orPageError } from '$lib/server/http';
import { forkSnapshot, snapshotTranscript } from '$lib/server/transcripts';
import { openShare } from '$lib/server/snapshots';
import { listComments } from '$lib/server/comments';
import katex from 'katex';
import { useKatex } from '$lib/client/tex';

// typeset formulas in the first paint, as the console does (its layout registers KaTeX for the (app) pages)
useKatex(katex);

export const load: PageServerLoad = ({ params, locals }) => {
	const opened = orPageError(() => openShare(params.slug));
	const transcript = snapshotTranscript(opened);
	const role = locals.user?.role;
	// comments carry their authors' names: only signed-in readers of the snapshot see them
	const comments = locals.user ? listComments(opened.share.slug, locals.user) : [];
	return { slug: params.slug, transcript, comments, canFork: role === 'member' || role === 'admin', signedIn: !!locals.user };
};

export const actions: Actions = {
	/** Re-checks the role itself: the hidden button is no guard. */
	fork: async ({ params, locals }) => {
		const user = locals.user;
		if (!user) redirect(303, `/signin?next=/t/${encodeURIComponent(params.slug)}`);
		if (user.role !== 'member' && user.role !== 'admin')
			return fail(403, { message: 'Readers cannot fork; ask an admin to make you a member.' });
		const pad = forkSnapshot(
			orPageError(() => openShare(params.slug)),
			user
		);
		redirect(303, `/pads/${pad.id}`);
	}
};
