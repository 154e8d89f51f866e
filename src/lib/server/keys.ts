/**
 * Personal API keys for scripts. The key itself is shown once, at creation; afterwards only its label and
 * prefix, so a leaked listing never leaks a key. A key acts as its user with that user's current role.
 */
import { and, desc, eq } from 'drizzle-orm';
import { z } from 'zod';
import { getDb, schema } from './db';
import type { AppUser } from './auth/guards';
import { DEFAULT_KEY_PER_MINUTE, MAX_KEY_PER_MINUTE, createApiKey } from './auth/apikey';
import { failure } from './http';

export const KEYS_PER_USER = 20;

export const createKeySchema = z.object({
	label: z
		.string()
		.trim()
		.min(1, 'Give the key a label, e.g. "sweep script".')
		.max(60, 'A label has at most 60 characters.')
		.meta({ examples: ['sweep script'] }),
	perMinute: z
		.number()
		.int('A per-minute limit is a whole number.')
		.min(1, 'A key may make at least 1 request a minute.')
		.max(MAX_KEY_PER_MINUTE, `A key may make at most ${MAX_KEY_PER_MINUTE} requests a minute.`)
		.optional()
		.describe(`requests a minute this key may make (default ${DEFAULT_KEY_PER_MINUTE})`),
	expiresAt: z
		.union([z.iso.date(), z.iso.datetime({ offset: true })], { error: 'expiresAt is a date (YYYY-MM-DD) or an ISO date-time.' })
		.optional()
		.describe('when the key stops working: a date (the key works through that day, UTC) or an ISO date-time')
});

/** A bare date keeps the key working through that whole day (UTC); a date-time is taken as it is. */
export function expiryOf(raw: string | undefined, now = Date.now()): Date | null {
	if (raw === undefined) return null;
	const at = /^\d{4}-\d{2}-\d{2}$/.test(raw) ? new Date(`${raw}T00:00:00Z`).getTime() + 86_400_000 : new Date(raw).getTime();
	if (!(at > now)) failure(400, 'The expiry must be in the future.');
	return new Date(at);
}

export function listKeys(user: AppUser) {
	return getDb()
		.select({
			id: schema.apiKeys.id,
			label: schema.apiKeys.label,
			prefix: schema.apiKeys.prefix,
			createdAt: schema.apiKeys.createdAt,
			lastUsedAt: schema.apiKeys.lastUsedAt,
			perMinute: schema.apiKeys.perMinute,
			expiresAt: schema.apiKeys.expiresAt
		})
		.from(schema.apiKeys)
		.where(eq(schema.apiKeys.userId, user.id))
		.orderBy(desc(schema.apiKeys.createdAt))
		.all();
}

export function makeKey(user: AppUser, label: string, limits: { perMinute?: number; expiresAt?: string } = {}) {
	const expiresAt = expiryOf(limits.expiresAt);
	const held = getDb().select({ id: schema.apiKeys.id }).from(schema.apiKeys).where(eq(schema.apiKeys.userId, user.id)).all().length;
	if (held >= KEYS_PER_USER) failure(409, `You hold ${held} keys; revoke one you no longer use first.`);
	const perMinute = limits.perMinute ?? DEFAULT_KEY_PER_MINUTE;
	const made = createApiKey(user.id, label, { perMinute, expiresAt });
	return { ...made, label, perMinute, expiresAt };
}

/** Deleting the row is the revocation: the hash is gone, so the key matches nobody from the next request on. */
export function revokeKey(user: AppUser, id: string): void {
	const gone = getDb()
		.delete(schema.apiKeys)
		.where(and(eq(schema.apiKeys.id, id), eq(schema.apiKeys.userId, user.id)))
		.run();
	if (gone.changes === 0) failure(404, 'No such key.');
}
