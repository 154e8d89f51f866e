import { redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { listKeys } from '$lib/server/keys';
import { DEFAULT_KEY_PER_MINUTE, MAX_KEY_PER_MINUTE } from '$lib/server/auth/apikey';
import { listSessions } from '$lib/server/auth/sessions';

export const load: PageServerLoad = ({ locals, url }) => {
	const user = locals.user;
	if (!user) redirect(303, '/signin?next=/keys');
	return {
		keys: listKeys(user),
		sessions: listSessions(user.id, locals.session?.id),
		canCreate: user.role !== 'reader',
		defaultPerMinute: DEFAULT_KEY_PER_MINUTE,
		maxPerMinute: MAX_KEY_PER_MINUTE,
		origin: url.origin
	};
};
