import { createHash, randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { getDb, schema } from '../db';

const PREFIX = 'bpk_';

export function hashKey(key: string): string {
	return createHash('sha256').update(key).digest('hex');
}

/** Makes a new key; only its hash is stored, the key itself is returned once. */
export function createApiKey(userId: string, label: string): { id: string; key: string; prefix: string } {
	const key = PREFIX + randomBytes(24).toString('base64url');
	const id = randomBytes(10).toString('hex');
	const prefix = key.slice(0, 10);
	getDb()
		.insert(schema.apiKeys)
		.values({ id, userId, label, hash: hashKey(key), prefix })
		.run();
	return { id, key, prefix };
}

/** The user a bearer key belongs to, or null. */
export function findUserByApiKey(key: string) {
	if (!key.startsWith(PREFIX)) return null;
	const db = getDb();
	const row = db
		.select({ user: schema.users, keyId: schema.apiKeys.id, lastUsedAt: schema.apiKeys.lastUsedAt })
		.from(schema.apiKeys)
		.innerJoin(schema.users, eq(schema.users.id, schema.apiKeys.userId))
		.where(eq(schema.apiKeys.hash, hashKey(key)))
		.get();
	if (!row) return null;
	// "last used" to the minute is what the Keys page shows; a write on every scripted request is not needed
	const now = new Date();
	if (!row.lastUsedAt || now.getTime() - row.lastUsedAt.getTime() > 60_000) {
		db.update(schema.apiKeys).set({ lastUsedAt: now }).where(eq(schema.apiKeys.id, row.keyId)).run();
	}
	return row.user;
}
