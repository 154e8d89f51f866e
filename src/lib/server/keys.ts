/**
 * Personal API keys for scripts. The key itself is shown once, at creation; afterwards only its label and
 * prefix, so a leaked listing never leaks a key. A key acts as its user with that user's current role.
 */
import { and, desc, eq } from 'drizzle-orm';
import { z } from 'zod';
import { getDb, schema } from './db';
import type { AppUser } from './auth/guards';
import { createApiKey } from './auth/apikey';
import { failure } from './http';

export const KEYS_PER_USER = 20;

export const createKeySchema = z.object({
	label: z.string().trim().min(1, 'Give the key a label, e.g. "sweep script".').max(60, 'A label has at most 60 characters.')
});

export function listKeys(user: AppUser) {
	return getDb()
		.select({
			id: schema.apiKeys.id,
			label: schema.apiKeys.label,
			prefix: schema.apiKeys.prefix,
			createdAt: schema.apiKeys.createdAt,
			lastUsedAt: schema.apiKeys.lastUsedAt
		})
		.from(schema.apiKeys)
		.where(eq(schema.apiKeys.userId, user.id))
		.orderBy(desc(schema.apiKeys.createdAt))
		.all();
}

export function makeKey(user: AppUser, label: string) {
	const held = getDb().select({ id: schema.apiKeys.id }).from(schema.apiKeys).where(eq(schema.apiKeys.userId, user.id)).all().length;
	if (held >= KEYS_PER_USER) failure(409, `You hold ${held} keys; revoke one you no longer use first.`);
	const made = createApiKey(user.id, label);
	return { ...made, label };
}

/** Deleting the row is the revocation: the hash is gone, so the key matches nobody from the next request on. */
export function revokeKey(user: AppUser, id: string): void {
	const gone = getDb()
		.delete(schema.apiKeys)
		.where(and(eq(schema.apiKeys.id, id), eq(schema.apiKeys.userId, user.id)))
		.run();
	if (gone.changes === 0) failure(404, 'No such key.');
}
