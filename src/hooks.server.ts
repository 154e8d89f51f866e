import type { Handle, HandleServerError, ServerInit } from '@sveltejs/kit';
import { json, text } from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { building } from '$app/environment';
import { warmPool } from '$lib/server/eval/pool';
import { connectFleet } from '$lib/server/eval/fleet';
import { randomUUID } from 'node:crypto';
import { authenticateSession } from '$lib/server/auth/sessions';
import { judgeApiKey } from '$lib/server/auth/apikey';
import { applySecurityHeaders } from '$lib/server/security/headers';
import { judgeWrite } from '$lib/server/security/writes';

export const init: ServerInit = () => {
	// start the evaluation processes in the background; requests do not wait for them
	if (!building) warmPool().catch((e) => console.error('could not warm the evaluation pool', e));
	// fleet mode (BULKPAD_QUEUE): connect at start, so /api/health says where lines go from the first request
	if (!building) connectFleet();
};

/** Outermost, so every answer gets the headers: pages, JSON, downloads, redirects and the refusals below. */
const secureHeaders: Handle = async ({ event, resolve }) => {
	const response = await resolve(event);
	applySecurityHeaders(response.headers, event.url);
	return response;
};

/** Before anyone is signed in: a cross-site write is refused whatever cookie or key it carries. */
const refuseCrossSiteWrites: Handle = async ({ event, resolve }) => {
	const verdict = judgeWrite(event.request, event.url);
	if (verdict.ok) return resolve(event);
	if (event.url.pathname.startsWith('/api/')) return json({ ok: false, error: { message: verdict.message } }, { status: verdict.status });
	return text(verdict.message, { status: verdict.status });
};

/** Bearer keys for scripts; the session cookie for browsers. Roles are checked in each route. */
const authenticate: Handle = async ({ event, resolve }) => {
	event.locals.user = null;
	event.locals.session = null;
	event.locals.via = null;

	const bearer = event.request.headers.get('authorization');
	if (bearer?.startsWith('Bearer ')) {
		const verdict = judgeApiKey(bearer.slice(7).trim());
		// an expired key or one over its per-minute budget is refused here, with its reason, before any route runs
		if (verdict && !verdict.ok) {
			const headers = verdict.retryAfter ? { 'retry-after': String(verdict.retryAfter) } : undefined;
			if (event.url.pathname.startsWith('/api/'))
				return json({ ok: false, error: { message: verdict.message } }, { status: verdict.status, headers });
			return text(verdict.message, { status: verdict.status, headers });
		}
		const user = verdict?.user;
		if (user) {
			event.locals.user = { id: user.id, email: user.email, name: user.name, role: user.role };
			event.locals.via = 'key';
		}
		return resolve(event);
	}

	await authenticateSession(event);
	return resolve(event);
};

export const handle: Handle = sequence(secureHeaders, refuseCrossSiteWrites, authenticate);

export const handleError: HandleServerError = ({ error, event, status }) => {
	const id = randomUUID().slice(0, 8);
	if (status !== 404) console.error(`[${id}] ${event.request.method} ${event.url.pathname}`, error);
	return { message: status === 404 ? 'Not found.' : 'Something went wrong on the server.', id };
};
