import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { createPad, listPads } from '$lib/server/pads';

/** `/` is the member's latest pad (a fresh one on the first visit); readers land on what is shared with them. */
export const load: PageServerLoad = ({ locals }) => {
	const user = locals.user;
	if (!user) redirect(303, '/signin');
	if (user.role === 'reader') redirect(303, '/shared');
	const latest = listPads(user.id)[0] ?? createPad(user.id, 'First pad');
	redirect(303, `/pads/${latest.id}`);
};
