/**
 * Browser sessions through lucia v3. The cookie carries a random token; lucia only ever sees sha-256 of it as
 * the session id (`createSession(..., { sessionId })`), so the sessions table holds no cookie value and a
 * leaked copy of the database opens no session.
 */
import type { Cookies, RequestEvent } from '@sveltejs/kit';
import { and, desc, eq, gt, ne } from 'drizzle-orm';
import { getDb, schema } from '../db';
import { failure } from '../http';
import { getLucia } from './lucia';
import { hashToken, newToken } from './tokens';

/** Writes of "last seen" are coarse: to the minute is what the sessions list shows. */
const LAST_SEEN_EVERY_MS = 60_000;

function setCookie(cookies: Cookies, c: { name: string; value: string; attributes: object }) {
	cookies.set(c.name, c.value, { path: '.', ...c.attributes });
}

/** Starts a session for the user and sets its cookie (the token); the table gets the token's hash. */
export async function startSession(cookies: Cookies, userId: string, userAgent = ''): Promise<void> {
	const lucia = getLucia();
	const token = newToken();
	const now = new Date();
	await lucia.createSession(
		userId,
		{ createdAt: now, lastSeenAt: now, userAgent: userAgent.slice(0, 200) },
		{ sessionId: hashToken(token) }
	);
	setCookie(cookies, lucia.createSessionCookie(token));
}

/** Ends the request's own session (if any) and clears the cookie. */
export async function endSession(cookies: Cookies, sessionId: string | undefined): Promise<void> {
	const lucia = getLucia();
	if (sessionId) await lucia.invalidateSession(sessionId);
	setCookie(cookies, lucia.createBlankSessionCookie());
}

/**
 * Sets `locals.user` and `locals.session` from the session cookie: the cookie's token is hashed before lucia
 * looks it up. A session near its end is extended with the same token; an unknown one clears the cookie.
 */
export async function authenticateSession(event: Pick<RequestEvent, 'cookies' | 'locals'>): Promise<void> {
	const lucia = getLucia();
	const token = event.cookies.get(lucia.sessionCookieName);
	if (!token) return;
	const { session, user } = await lucia.validateSession(hashToken(token));
	if (session?.fresh) setCookie(event.cookies, lucia.createSessionCookie(token));
	if (!session) setCookie(event.cookies, lucia.createBlankSessionCookie());
	if (session && (!session.lastSeenAt || Date.now() - new Date(session.lastSeenAt).getTime() > LAST_SEEN_EVERY_MS)) {
		getDb().update(schema.sessions).set({ lastSeenAt: new Date() }).where(eq(schema.sessions.id, session.id)).run();
	}
	event.locals.session = session;
	event.locals.user = user ? { id: user.id, email: user.email, name: user.name, role: user.role } : null;
	if (user) event.locals.via = 'session';
}

/** The user's live sessions, newest first; `current` marks the one making the request. */
export function listSessions(userId: string, currentId: string | undefined) {
	return getDb()
		.select({
			id: schema.sessions.id,
			createdAt: schema.sessions.createdAt,
			lastSeenAt: schema.sessions.lastSeenAt,
			expiresAt: schema.sessions.expiresAt,
			userAgent: schema.sessions.userAgent
		})
		.from(schema.sessions)
		.where(and(eq(schema.sessions.userId, userId), gt(schema.sessions.expiresAt, Math.floor(Date.now() / 1000))))
		.orderBy(desc(schema.sessions.createdAt))
		.all()
		.map((s) => ({ ...s, expiresAt: new Date(s.expiresAt * 1000), current: s.id === currentId }));
}

/** Ends one of the user's sessions by its id (the hash; the token is never known here). */
export function revokeSession(userId: string, id: string): void {
	const gone = getDb()
		.delete(schema.sessions)
		.where(and(eq(schema.sessions.id, id), eq(schema.sessions.userId, userId)))
		.run();
	if (gone.changes === 0) failure(404, 'No such session.');
}

/** Ends every session of the user except `keepId` (sign out elsewhere). */
export function revokeOtherSessions(userId: string, keepId: string | undefined): number {
	const where = keepId ? and(eq(schema.sessions.userId, userId), ne(schema.sessions.id, keepId)) : eq(schema.sessions.userId, userId);
	return getDb().delete(schema.sessions).where(where).run().changes;
}

/** After a password change or reset nothing opened with the old password may stay open: sessions and keys. */
export function endEverySessionAndKey(userId: string): void {
	const db = getDb();
	db.delete(schema.sessions).where(eq(schema.sessions.userId, userId)).run();
	db.delete(schema.apiKeys).where(eq(schema.apiKeys.userId, userId)).run();
}
