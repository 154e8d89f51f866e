import { api, ok, readBody } from '$lib/server/http';
import { requireRole } from '$lib/server/auth/guards';
import { listUsers, setRole, setRoleSchema } from '$lib/server/users';

/** GET /api/admin/users — everyone in the group with their role (admin). */
export const GET = api((event) => {
	requireRole(event, 'admin');
	return ok({ users: listUsers() });
});

/** PATCH /api/admin/users {id, role} — change a role; the last admin cannot be demoted. */
export const PATCH = api(async (event) => {
	requireRole(event, 'admin');
	const input = await readBody(event, setRoleSchema);
	return ok({ user: setRole(input) });
});
