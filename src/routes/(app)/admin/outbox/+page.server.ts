import { error, redirect } from '@sveltejs/kit';
import type { PageServerLoad } from './$types';
import { listOutbox } from '$lib/server/mail/send';

export const load: PageServerLoad = ({ locals }) => {
	if (!locals.user) redirect(303, '/signin?next=/admin/outbox');
	if (locals.user.role !== 'admin') error(403, 'The outbox is for admins.');
	return { messages: listOutbox() };
};
