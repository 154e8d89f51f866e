import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { passwordSchema } from '$lib/server/auth/accounts';
import { confirmPasswordReset, isResetTokenLive } from '$lib/server/password-reset';

export const load: PageServerLoad = ({ params }) => ({ live: isResetTokenLive(params.token) });

export const actions: Actions = {
	default: async ({ request, params }) => {
		const form = await request.formData();
		const password = String(form.get('password') ?? '');
		if (password !== String(form.get('again') ?? '')) return fail(400, { message: 'The two passwords differ.' });
		const parsed = passwordSchema.safeParse(password);
		if (!parsed.success) return fail(400, { message: parsed.error.issues[0]?.message ?? 'Choose another password.' });
		if (!(await confirmPasswordReset(params.token, parsed.data))) {
			return fail(400, { message: 'This link is invalid, used or expired; ask for a new one.' });
		}
		redirect(303, '/signin?reset=1');
	}
};
