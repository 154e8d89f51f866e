import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { checkCredentials, signInSchema, startSession } from '$lib/server/auth/accounts';
import { ApiFailure } from '$lib/server/http';

export const load: PageServerLoad = ({ locals, url }) => {
	if (locals.user) redirect(303, safeNext(url.searchParams.get('next')));
	return { next: url.searchParams.get('next') ?? '', confirmed: url.searchParams.has('confirmed'), reset: url.searchParams.has('reset') };
};

/** Only same-site paths, so a crafted link cannot send a fresh session elsewhere. */
function safeNext(next: string | null): string {
	return next && next.startsWith('/') && !next.startsWith('//') ? next : '/';
}

export const actions: Actions = {
	default: async (event) => {
		const form = await event.request.formData();
		const email = String(form.get('email') ?? '');
		const parsed = signInSchema.safeParse({ email, password: String(form.get('password') ?? '') });
		if (!parsed.success) return fail(400, { email, message: 'Enter your e-mail and password.' });
		try {
			const user = await checkCredentials(parsed.data, event.getClientAddress());
			await startSession(event.cookies, user.id, event.request.headers.get('user-agent') ?? '');
		} catch (e) {
			if (e instanceof ApiFailure) return fail(e.status, { email, message: e.message, unconfirmed: e.extra.unconfirmed === true });
			throw e;
		}
		redirect(303, safeNext(String(form.get('next') ?? '')));
	}
};
