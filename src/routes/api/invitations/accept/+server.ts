import { api, ok, readBody } from '$lib/server/http';
import { requireUser } from '$lib/server/auth/guards';
import { acceptInvitation } from '$lib/server/invites';
import { tokenBodySchema } from '$lib/server/api-schemas';

/** POST {token}: the signed-in caller (confirmed address) accepts and reads the pad from now on. */
export const POST = api(async (event) => {
	const user = requireUser(event);
	const { token } = await readBody(event, tokenBodySchema);
	return ok({ pad: { id: acceptInvitation(user, token) } });
});
