import { error, type RequestEvent } from '@sveltejs/kit';
import type { Role } from '../db/schema';

export type AppUser = NonNullable<App.Locals['user']>;

/** The signed-in user, or a 401 (API) — pages redirect themselves before calling this. */
export function requireUser(event: Pick<RequestEvent, 'locals'>): AppUser {
	const user = event.locals.user;
	if (!user) error(401, 'Sign in first.');
	return user;
}

/** The signed-in user if their role is one of `roles`, else 403. */
export function requireRole(event: Pick<RequestEvent, 'locals'>, ...roles: Role[]): AppUser {
	const user = requireUser(event);
	if (!roles.includes(user.role)) error(403, `This needs the role ${roles.join(' or ')}.`);
	return user;
}

/** Members and admins may create and change things; readers only read. */
export function requireWriter(event: Pick<RequestEvent, 'locals'>): AppUser {
	return requireRole(event, 'member', 'admin');
}
