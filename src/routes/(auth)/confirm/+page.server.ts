import { fail } from '@sveltejs/kit';
import type { Actions } from './$types';
import { emailSchema } from '$lib/server/auth/accounts';
import { resendConfirmation } from '$lib/server/auth/signup';
import { ApiFailure } from '$lib/server/http';

export const actions: Actions = {
	/** A new confirmation link; the same answer for any address. */
	default: async (event) => {
		const form = await event.request.formData();
		const email = String(form.get('email') ?? '');
		const parsed = emailSchema.safeParse(email);
		if (!parsed.success) return fail(400, { email, message: 'Enter a valid e-mail address.' });
		try {
			resendConfirmation(parsed.data, event.getClientAddress());
		} catch (e) {
			if (e instanceof ApiFailure) return fail(e.status, { email, message: e.message });
			throw e;
		}
		return { sent: true, email: parsed.data };
	}
};
