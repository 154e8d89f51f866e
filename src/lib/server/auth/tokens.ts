import { createHash, randomBytes } from 'node:crypto';

/** A fresh secret for a link or a cookie: 32 random bytes, URL-safe. */
export function newToken(): string {
	return randomBytes(32).toString('base64url');
}

/** What the database keeps of a token: its sha-256, so a copy of the database opens nothing. */
export function hashToken(token: string): string {
	return createHash('sha256').update(token).digest('hex');
}
