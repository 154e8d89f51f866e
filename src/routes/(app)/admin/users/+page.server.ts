import { error, redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { listUsers } from '$lib/server/users';
import { getSignupPolicy } from '$lib/server/auth/policy';

export const load: PageServerLoad = ({ locals }) => {
	const user = locals.user;
	if (!user) redirect(303, '/signin?next=/admin/users');
	if (user.role !== 'admin') error(403, 'Managing users is for admins.');
	return { users: listUsers(), me: user.id, policy: getSignupPolicy() };
};
