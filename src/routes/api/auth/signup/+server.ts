import { api, ok, readBody } from '$lib/server/http';
import { signUpSchema } from '$lib/server/auth/accounts';
import { signUp } from '$lib/server/auth/signup';

/**
 * POST {email, password, name, invite?} → 201 {user, confirmation: {to, status}}. No session: the account signs
 * in once its address is confirmed through the mailed link. 403 when the sign-up policy does not admit the
 * address (an invitation token always does), 409 for a taken address, 429 with Retry-After when limited.
 */
export const POST = api(async (event) => {
	const input = await readBody(event, signUpSchema);
	const { user, confirmation } = await signUp(input, event.getClientAddress());
	return ok({ user, confirmation }, { status: 201 });
});
