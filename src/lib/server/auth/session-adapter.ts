/**
 * Lucia's drizzle adapter with the per-request lookup as one prepared statement.
 *
 * Why our own override: the stock `getSessionAndUser` runs two queries (the session, then its user through a
 * join), and drizzle builds and SQLite compiles both again on every request — with the session check on every
 * API call, that was the largest single cost of a light line (about a sixth of the server's time under load,
 * bench/RESULTS.md "api"). Here the join is prepared once and read synchronously; only the user columns lucia's
 * `getUserAttributes` reads are selected, so the password hash never leaves the database on a request. Every
 * other method (create, extend, delete) is the stock one. Nothing is cached: a revoked session or a changed role
 * takes effect on the next request, as before.
 */
import { DrizzleSQLiteAdapter } from '@lucia-auth/adapter-drizzle';
import type { DatabaseSession, DatabaseUser } from 'lucia';
import { eq, sql } from 'drizzle-orm';
import type { Db } from '../db';
import { schema } from '../db';

function prepareLookup(db: Db) {
	const { sessions, users } = schema;
	return db
		.select({
			id: sessions.id,
			userId: sessions.userId,
			expiresAt: sessions.expiresAt,
			createdAt: sessions.createdAt,
			lastSeenAt: sessions.lastSeenAt,
			userAgent: sessions.userAgent,
			email: users.email,
			name: users.name,
			role: users.role
		})
		.from(sessions)
		.innerJoin(users, eq(sessions.userId, users.id))
		.where(eq(sessions.id, sql.placeholder('id')))
		.prepare();
}

export class PreparedSessionAdapter extends DrizzleSQLiteAdapter {
	private readonly lookup: ReturnType<typeof prepareLookup>;

	constructor(db: Db) {
		super(db, schema.sessions, schema.users);
		this.lookup = prepareLookup(db);
	}

	override async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
		const row = this.lookup.get({ id: sessionId });
		if (!row) return [null, null];
		const session: DatabaseSession = {
			id: row.id,
			userId: row.userId,
			expiresAt: new Date(row.expiresAt * 1000),
			attributes: { createdAt: row.createdAt, lastSeenAt: row.lastSeenAt, userAgent: row.userAgent }
		};
		const user: DatabaseUser = { id: row.userId, attributes: { email: row.email, name: row.name, role: row.role } };
		return [session, user];
	}
}
