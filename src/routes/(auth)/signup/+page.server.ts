import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { createUser, signUpSchema, startSession } from '$lib/server/auth/accounts';
import { ApiFailure } from '$lib/server/http';

export const load: PageServerLoad = ({ locals }) => {
	if (locals.user) redirect(303, '/');
};

export const actions: Actions = {
	default: async (event) => {
		const form = await event.request.formData();
		const fields = { email: String(form.get('email') ?? ''), name: String(form.get('name') ?? '') };
		const parsed = signUpSchema.safeParse({ ...fields, password: String(form.get('password') ?? '') });
		if (!parsed.success) return fail(400, { ...fields, message: parsed.error.issues.map((i) => i.message).join(' ') });
		try {
			const user = await createUser(parsed.data);
			await startSession(event.cookies, user.id);
		} catch (e) {
			if (e instanceof ApiFailure) return fail(e.status, { ...fields, message: e.message });
			throw e;
		}
		redirect(303, '/');
	}
};
