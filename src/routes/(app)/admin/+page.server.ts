import { error, redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';

/** /admin itself: an admin lands on the user list (the first admin page); anyone else gets what the pages say. */
export const load: PageServerLoad = ({ locals }) => {
	const user = locals.user;
	if (!user) redirect(303, '/signin?next=/admin/users');
	if (user.role !== 'admin') error(403, 'The admin pages are for admins.');
	redirect(303, '/admin/users');
};
