import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { confirmAddress, isConfirmationLive } from '$lib/server/auth/signup';

// Opening the link only shows a button: mail scanners that fetch links must not confirm anything.
export const load: PageServerLoad = ({ params }) => ({ live: isConfirmationLive(params.token) });

export const actions: Actions = {
	default: async ({ params }) => {
		const done = confirmAddress(params.token);
		if (!done) return fail(400, { message: 'This link is invalid, used or expired; sign in to ask for a new one.' });
		redirect(303, `/signin?confirmed=1${done.padId ? `&next=${encodeURIComponent(`/shared/${done.padId}`)}` : ''}`);
	}
};
