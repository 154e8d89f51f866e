import { createHash, randomBytes } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import { getDb, schema, type Db } from '../db';

const PREFIX = 'bpk_';

export function hashKey(key: string): string {
	return createHash('sha256').update(key).digest('hex');
}

/** A key's request budget when its maker names none (requests per minute). */
export const DEFAULT_KEY_PER_MINUTE = 120;
export const MAX_KEY_PER_MINUTE = 6000;

/** Makes a new key; only its hash is stored, the key itself is returned once. */
export function createApiKey(
	userId: string,
	label: string,
	limits: { perMinute?: number; expiresAt?: Date | null } = {}
): { id: string; key: string; prefix: string } {
	const key = PREFIX + randomBytes(24).toString('base64url');
	const id = randomBytes(10).toString('hex');
	const prefix = key.slice(0, 10);
	getDb()
		.insert(schema.apiKeys)
		.values({
			id,
			userId,
			label,
			hash: hashKey(key),
			prefix,
			perMinute: limits.perMinute ?? DEFAULT_KEY_PER_MINUTE,
			expiresAt: limits.expiresAt ?? null
		})
		.run();
	return { id, key, prefix };
}

/**
 * Requests per key in the current minute: fixed windows in memory, like the other limits (one process serves
 * Bulkpad). Each key is held to its own budget, read from its row on every request, so a changed budget
 * applies at once. Windows are dropped lazily so the map cannot grow without bound.
 */
const keyWindows = new Map<string, { count: number; resetAt: number }>();

function countKeyRequest(keyId: string, now: number): { count: number; resetAt: number } {
	if (keyWindows.size > 10_000) for (const [k, w] of keyWindows) if (w.resetAt <= now) keyWindows.delete(k);
	const w = keyWindows.get(keyId);
	if (!w || w.resetAt <= now) {
		const fresh = { count: 1, resetAt: now + 60_000 };
		keyWindows.set(keyId, fresh);
		return fresh;
	}
	w.count += 1;
	return w;
}

export type KeyVerdict =
	| { ok: true; user: Pick<typeof schema.users.$inferSelect, 'id' | 'email' | 'name' | 'role'> }
	| { ok: false; status: 401 | 429; message: string; retryAfter?: number };

/**
 * The key's row and its user, as one statement prepared once per database (a bearer key is checked on every
 * scripted request; building and compiling the join each time cost more than the light lines it guards).
 * Only the user columns the request needs are read: never the password hash.
 */
const keyLookups = new WeakMap<Db, ReturnType<typeof prepareKeyLookup>>();

function prepareKeyLookup(db: Db) {
	const { apiKeys, users } = schema;
	return db
		.select({
			user: { id: users.id, email: users.email, name: users.name, role: users.role },
			keyId: apiKeys.id,
			lastUsedAt: apiKeys.lastUsedAt,
			perMinute: apiKeys.perMinute,
			expiresAt: apiKeys.expiresAt
		})
		.from(apiKeys)
		.innerJoin(users, eq(users.id, apiKeys.userId))
		.where(eq(apiKeys.hash, sql.placeholder('hash')))
		.prepare();
}

/**
 * What a bearer key gets: its user, or a refusal that names the reason (an expired key says so, so a script's
 * author knows to make a new one; a key over its budget is told when to come back). Unknown keys are null.
 */
export function judgeApiKey(key: string, now = Date.now()): KeyVerdict | null {
	if (!key.startsWith(PREFIX)) return null;
	const db = getDb();
	let lookup = keyLookups.get(db);
	if (!lookup) keyLookups.set(db, (lookup = prepareKeyLookup(db)));
	const row = lookup.get({ hash: hashKey(key) });
	if (!row) return null;
	if (row.expiresAt && row.expiresAt.getTime() <= now) {
		return { ok: false, status: 401, message: `This key expired on ${row.expiresAt.toISOString()}; make a new one on the Keys page.` };
	}
	const spent = countKeyRequest(row.keyId, now);
	if (spent.count > row.perMinute) {
		const retryAfter = Math.max(1, Math.ceil((spent.resetAt - now) / 1000));
		return {
			ok: false,
			status: 429,
			message: `This key is over its limit of ${row.perMinute} requests a minute. Try again in ${retryAfter} s.`,
			retryAfter
		};
	}
	// "last used" to the minute is what the Keys page shows; a write on every scripted request is not needed
	const at = new Date(now);
	if (!row.lastUsedAt || now - row.lastUsedAt.getTime() > 60_000) {
		db.update(schema.apiKeys).set({ lastUsedAt: at }).where(eq(schema.apiKeys.id, row.keyId)).run();
	}
	return { ok: true, user: row.user };
}
