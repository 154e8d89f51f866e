import { createHash, randomBytes } from 'node:crypto';
import { eq, lt } from 'drizzle-orm';
import { getDb, schema } from './db';
import { env } from './env';
import { setPassword } from './auth/accounts';
import { createRateLimiter } from './rate-limit';
import { sendMail } from './mail/send';
import { resetMessage } from './mail/templates';

const VALID_MS = 60 * 60 * 1000;

/**
 * Against mail-bombing: per e-mail asked for (whether or not it has an account, so the limit tells nothing)
 * and per client address (one sender spraying many e-mails).
 */
const perEmail = createRateLimiter(5, 15 * 60_000);
const perClient = createRateLimiter(30, 15 * 60_000);

function hashToken(token: string): string {
	return createHash('sha256').update(token).digest('hex');
}

/**
 * Starts a reset: when the account exists, stores the hash of a fresh single-use token (1 h) and mails the
 * link. The answer never says whether the account exists, and the mail is sent in the background so the
 * response time does not tell either (the outbox records how the send went).
 */
export function requestPasswordReset(email: string, clientAddress: string): { limited: boolean } {
	if (!perClient.take(clientAddress) || !perEmail.take(email)) return { limited: true };
	const db = getDb();
	const user = db.select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, email)).get();
	if (!user) return { limited: false };
	db.delete(schema.passwordResets).where(lt(schema.passwordResets.expiresAt, new Date())).run();
	const token = randomBytes(32).toString('base64url');
	db.insert(schema.passwordResets)
		.values({ tokenHash: hashToken(token), userId: user.id, expiresAt: new Date(Date.now() + VALID_MS) })
		.run();
	const link = `${env.origin}/reset/${token}`;
	sendMail(resetMessage({ to: email, link, validMinutes: VALID_MS / 60_000 })).catch((e) => {
		console.error('password reset mail could not be recorded', e);
	});
	return { limited: false };
}

/** Whether a token is live (for the set-new-password page, before the user types anything). */
export function isResetTokenLive(token: string): boolean {
	const row = getDb().select().from(schema.passwordResets).where(eq(schema.passwordResets.tokenHash, hashToken(token))).get();
	return !!row && row.expiresAt.getTime() > Date.now();
}

/**
 * Consumes a token: every reset token of that user is deleted first (single use, and an older link mailed
 * earlier dies too), then the password is set and every session of the user is ended.
 */
export async function confirmPasswordReset(token: string, password: string): Promise<boolean> {
	const db = getDb();
	const row = db.select().from(schema.passwordResets).where(eq(schema.passwordResets.tokenHash, hashToken(token))).get();
	if (!row) return false;
	db.delete(schema.passwordResets).where(eq(schema.passwordResets.userId, row.userId)).run();
	if (row.expiresAt.getTime() <= Date.now()) return false;
	await setPassword(row.userId, password);
	return true;
}
