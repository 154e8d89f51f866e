import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { signUpSchema } from '$lib/server/auth/accounts';
import { getSignupPolicy } from '$lib/server/auth/policy';
import { signUp } from '$lib/server/auth/signup';
import { describeInvitation } from '$lib/server/invites';
import { ApiFailure } from '$lib/server/http';

export const load: PageServerLoad = ({ locals, url }) => {
	if (locals.user) redirect(303, '/');
	const invite = url.searchParams.get('invite') ?? '';
	const invitation = invite ? describeInvitation(invite) : null;
	const policy = getSignupPolicy();
	return {
		invite: invitation ? invite : '',
		invitation: invitation && { title: invitation.title, inviter: invitation.inviter, email: invitation.email },
		policy
	};
};

export const actions: Actions = {
	default: async (event) => {
		const form = await event.request.formData();
		const fields = { email: String(form.get('email') ?? ''), name: String(form.get('name') ?? '') };
		const invite = String(form.get('invite') ?? '') || undefined;
		const parsed = signUpSchema.safeParse({ ...fields, invite, password: String(form.get('password') ?? '') });
		if (!parsed.success) return fail(400, { ...fields, message: parsed.error.issues.map((i) => i.message).join(' ') });
		try {
			const { confirmation } = await signUp(parsed.data, event.getClientAddress());
			return { ...fields, sent: confirmation.to, mailFailed: confirmation.status !== 'sent' };
		} catch (e) {
			if (e instanceof ApiFailure) return fail(e.status, { ...fields, message: e.message });
			throw e;
		}
	}
};
