import { api, ok, readBody } from '$lib/server/http';
import { requireRole } from '$lib/server/auth/guards';
import { getSignupPolicy, setSignupPolicy } from '$lib/server/auth/policy';
import { signupSettingsSchema } from '$lib/server/api-schemas';

/** GET /api/admin/settings — the sign-up policy {mode: invite|domains|open, domains} (admin). */
export const GET = api((event) => {
	requireRole(event, 'admin');
	return ok({ signup: getSignupPolicy() });
});

/** PATCH /api/admin/settings {signup: {mode, domains}} — takes effect on the next sign-up. */
export const PATCH = api(async (event) => {
	requireRole(event, 'admin');
	const { signup } = await readBody(event, signupSettingsSchema);
	return ok({ signup: setSignupPolicy(signup) });
});
