import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { listMacros } from '$lib/server/macros';

/** The library as this user may see it; the same visibility rule as GET /api/macros. */
export const load: PageServerLoad = ({ locals }) => {
	const user = locals.user;
	if (!user) redirect(303, '/signin?next=/library');
	return { macros: listMacros(user), role: user.role };
};
