import { fail } from '@sveltejs/kit';
import type { Actions } from './$types';
import { emailSchema } from '$lib/server/auth/accounts';
import { requestPasswordReset } from '$lib/server/password-reset';

export const actions: Actions = {
	/** The same answer whether or not the account exists. */
	default: async ({ request, getClientAddress }) => {
		const form = await request.formData();
		const email = String(form.get('email') ?? '');
		const parsed = emailSchema.safeParse(email);
		if (!parsed.success) return fail(400, { email, message: 'Enter a valid e-mail address.' });
		if (requestPasswordReset(parsed.data, getClientAddress()).limited) return fail(429, { email, message: 'Too many requests; try again later.' });
		return { sent: true, email: parsed.data };
	}
};
