import type { Handle, HandleServerError, ServerInit } from '@sveltejs/kit';
import { building } from '$app/environment';
import { warmPool } from '$lib/server/eval/pool';
import { randomUUID } from 'node:crypto';
import { getLucia } from '$lib/server/auth/lucia';
import { findUserByApiKey } from '$lib/server/auth/apikey';

export const init: ServerInit = () => {
	// start the evaluation processes in the background; requests do not wait for them
	if (!building) warmPool().catch((e) => console.error('could not warm the evaluation pool', e));
};

/** Bearer keys for scripts; the session cookie for browsers. Roles are checked in each route. */
export const handle: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.session = null;
	event.locals.via = null;

	const bearer = event.request.headers.get('authorization');
	if (bearer?.startsWith('Bearer ')) {
		const user = findUserByApiKey(bearer.slice(7).trim());
		if (user) {
			event.locals.user = { id: user.id, email: user.email, name: user.name, role: user.role };
			event.locals.via = 'key';
		}
		return resolve(event);
	}

	const lucia = getLucia();
	const sessionId = event.cookies.get(lucia.sessionCookieName);
	if (sessionId) {
		const { session, user } = await lucia.validateSession(sessionId);
		if (session?.fresh) {
			const c = lucia.createSessionCookie(session.id);
			event.cookies.set(c.name, c.value, { path: '.', ...c.attributes });
		}
		if (!session) {
			const c = lucia.createBlankSessionCookie();
			event.cookies.set(c.name, c.value, { path: '.', ...c.attributes });
		}
		event.locals.session = session;
		event.locals.user = user ? { id: user.id, email: user.email, name: user.name, role: user.role } : null;
		if (user) event.locals.via = 'session';
	}
	const response = await resolve(event);
	response.headers.set('x-content-type-options', 'nosniff');
	response.headers.set('referrer-policy', 'same-origin');
	return response;
};

export const handleError: HandleServerError = ({ error, event, status }) => {
	const id = randomUUID().slice(0, 8);
	if (status !== 404) console.error(`[${id}] ${event.request.method} ${event.url.pathname}`, error);
	return { message: status === 404 ? 'Not found.' : 'Something went wrong on the server.', id };
};
