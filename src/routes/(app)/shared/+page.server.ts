import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { listSharedWith } from '$lib/server/invites';

export const load: PageServerLoad = ({ locals }) => {
	if (!locals.user) redirect(303, '/signin?next=/shared');
	return { pads: listSharedWith(locals.user) };
};
