import { eq, lt } from 'drizzle-orm';
import { getDb, schema } from './db';
import { env } from './env';
import { newId, setPassword } from './auth/accounts';
import { mailLimits, takeOrThrow } from './auth/limits';
import { hashToken, newToken } from './auth/tokens';
import { sendMail, wasSent } from './mail/send';
import { resetMessage } from './mail/templates';

const VALID_MS = 60 * 60 * 1000;

/**
 * Starts a reset: when the account exists, stores the hash of a fresh single-use token (1 h) and mails the
 * link. The answer never says whether the account exists, and the mail is sent in the background so the
 * response time does not tell either. Limited per e-mail asked for (whether or not it has an account, so the
 * limit tells nothing) and per client address (one sender spraying many e-mails): 429 with Retry-After.
 */
export function requestPasswordReset(email: string, clientAddress: string): void {
	takeOrThrow('Too many reset requests.', [mailLimits.resetPerAddress, clientAddress], [mailLimits.resetPerEmail, email]);
	const db = getDb();
	const user = db.select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, email)).get();
	if (!user) return;
	db.delete(schema.passwordResets).where(lt(schema.passwordResets.expiresAt, new Date())).run();
	const token = newToken();
	const outboxId = newId();
	db.insert(schema.passwordResets)
		.values({ tokenHash: hashToken(token), userId: user.id, expiresAt: new Date(Date.now() + VALID_MS), outboxId })
		.run();
	const link = `${env.origin}/reset/${token}`;
	sendMail(resetMessage({ to: email, link, validMinutes: VALID_MS / 60_000 }), outboxId).catch((e) => {
		console.error('password reset mail could not be recorded', e);
	});
}

/** A token counts only while unexpired and once its mail went out: a link from a failed send opens nothing. */
function liveReset(token: string) {
	const row = getDb()
		.select()
		.from(schema.passwordResets)
		.where(eq(schema.passwordResets.tokenHash, hashToken(token)))
		.get();
	return row && row.expiresAt.getTime() > Date.now() && wasSent(row.outboxId) ? row : null;
}

/** Whether a token is live (for the set-new-password page, before the user types anything). */
export function isResetTokenLive(token: string): boolean {
	return !!liveReset(token);
}

/**
 * Consumes a token: every reset token of that user is deleted first (single use, and an older link mailed
 * earlier dies too), then the password is set and every session and key of the user ends.
 */
export async function confirmPasswordReset(token: string, password: string): Promise<boolean> {
	const db = getDb();
	const row = db
		.select()
		.from(schema.passwordResets)
		.where(eq(schema.passwordResets.tokenHash, hashToken(token)))
		.get();
	if (!row) return false;
	db.delete(schema.passwordResets).where(eq(schema.passwordResets.userId, row.userId)).run();
	if (row.expiresAt.getTime() <= Date.now() || !wasSent(row.outboxId)) return false;
	await setPassword(row.userId, password);
	// the link reached the address, which is what a confirmation proves
	db.update(schema.users).set({ emailConfirmedAt: new Date() }).where(eq(schema.users.id, row.userId)).run();
	return true;
}
