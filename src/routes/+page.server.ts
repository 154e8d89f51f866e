import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { homePath } from '$lib/server/pads';

/** `/` is the member's latest pad (a fresh one on the first visit); readers land on what is shared with them. */
export const load: PageServerLoad = ({ locals }) => {
	if (!locals.user) redirect(303, '/signin');
	redirect(303, homePath(locals.user));
};
