import { fail } from '@sveltejs/kit';
import type { Actions } from './$types';
import { emailSchema } from '$lib/server/auth/accounts';
import { requestPasswordReset } from '$lib/server/password-reset';
import { ApiFailure } from '$lib/server/http';

export const actions: Actions = {
	/** The same answer whether or not the account exists. */
	default: async ({ request, getClientAddress }) => {
		const form = await request.formData();
		const email = String(form.get('email') ?? '');
		const parsed = emailSchema.safeParse(email);
		if (!parsed.success) return fail(400, { email, message: 'Enter a valid e-mail address.' });
		try {
			requestPasswordReset(parsed.data, getClientAddress());
		} catch (e) {
			if (e instanceof ApiFailure) return fail(e.status, { email, message: e.message });
			throw e;
		}
		return { sent: true, email: parsed.data };
	}
};
