import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { acceptInvitation, describeInvitation } from '$lib/server/invites';
import { ApiFailure } from '$lib/server/http';

/** The invitation link: shows the pad and who invited; accepting needs a signed-in, confirmed account. */
export const load: PageServerLoad = ({ params, locals }) => {
	const invitation = describeInvitation(params.token);
	return {
		invitation: invitation && { title: invitation.title, inviter: invitation.inviter, email: invitation.email },
		user: locals.user && { name: locals.user.name, email: locals.user.email },
		token: params.token
	};
};

export const actions: Actions = {
	default: async ({ params, locals }) => {
		if (!locals.user) redirect(303, `/signin?next=${encodeURIComponent(`/invite/${params.token}`)}`);
		let padId: string;
		try {
			padId = acceptInvitation(locals.user, params.token);
		} catch (e) {
			if (e instanceof ApiFailure) return fail(e.status, { message: e.message });
			throw e;
		}
		redirect(303, `/shared/${padId}`);
	}
};
