import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { listKeys } from '$lib/server/keys';

export const load: PageServerLoad = ({ locals, url }) => {
	const user = locals.user;
	if (!user) redirect(303, '/signin?next=/keys');
	return { keys: listKeys(user), canCreate: user.role !== 'reader', origin: url.origin };
};
