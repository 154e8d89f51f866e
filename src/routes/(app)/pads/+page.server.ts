import { redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { requireWriter } from '$lib/server/auth/guards';
import { createPad, homePath } from '$lib/server/pads';

/** `/pads` is the latest pad, like `/`. */
export const load: PageServerLoad = ({ locals }) => {
	if (!locals.user) redirect(303, '/signin?next=/pads');
	redirect(303, homePath(locals.user));
};

export const actions: Actions = {
	/** POST /pads: a new pad, opened at once. */
	default: async (event) => {
		const user = requireWriter(event);
		const form = await event.request.formData();
		const title =
			String(form.get('title') ?? '')
				.trim()
				.slice(0, 120) || `Pad of ${new Date().toISOString().slice(0, 10)}`;
		const pad = createPad(user.id, title);
		redirect(303, `/pads/${pad.id}`);
	}
};
