/**
 * Self-service accounts: the sign-up policy and rate limits decide who may start one, and every new account
 * confirms its address through a mailed single-use link before it can sign in. An account made through an
 * invitation link is a reader (an admin promotes them) and gets the pad once its address is confirmed.
 */
import { and, eq, lt } from 'drizzle-orm';
import type { z } from 'zod';
import { getDb, schema } from '../db';
import { env } from '../env';
import { failure } from '../http';
import { sendMail, wasSent } from '../mail/send';
import { confirmMessage } from '../mail/templates';
import { acceptInvitationById, findLiveInvitation } from '../invites';
import { createUser, newId, type signUpSchema } from './accounts';
import { mailLimits, takeOrThrow } from './limits';
import { checkSignupAllowed } from './policy';
import { hashToken, newToken } from './tokens';

const VALID_HOURS = 48;

/** Makes the (unconfirmed) account and mails the confirmation link; no session is started. */
export async function signUp(input: z.infer<typeof signUpSchema>, clientAddress: string) {
	takeOrThrow('Too many sign-ups.', [mailLimits.signupPerAddress, clientAddress], [mailLimits.signupPerEmail, input.email]);
	const invitation = input.invite ? findLiveInvitation(input.invite) : null;
	if (input.invite && !invitation) failure(404, 'This invitation is invalid, used, revoked or expired; ask the pad owner for a new one.');
	checkSignupAllowed(input.email, !!invitation);
	const user = await createUser(input, invitation ? 'reader' : 'member');
	const mail = await mailConfirmation(user, invitation?.id ?? null);
	return { user, confirmation: { to: user.email, status: mail.status } };
}

async function mailConfirmation(user: { id: string; email: string; name: string }, inviteId: string | null) {
	const db = getDb();
	db.delete(schema.emailConfirmations).where(lt(schema.emailConfirmations.expiresAt, new Date())).run();
	const token = newToken();
	const outboxId = newId();
	db.insert(schema.emailConfirmations)
		.values({ tokenHash: hashToken(token), userId: user.id, inviteId, expiresAt: new Date(Date.now() + VALID_HOURS * 3_600_000), outboxId })
		.run();
	return sendMail(
		confirmMessage({ to: user.email, name: user.name, link: `${env.origin}/confirm/${token}`, validHours: VALID_HOURS }),
		outboxId
	);
}

function liveConfirmation(token: string) {
	const row = getDb()
		.select()
		.from(schema.emailConfirmations)
		.where(eq(schema.emailConfirmations.tokenHash, hashToken(token)))
		.get();
	return row && row.expiresAt.getTime() > Date.now() && wasSent(row.outboxId) ? row : null;
}

/** Whether a confirmation link is live (for the page, before the button is pressed). */
export function isConfirmationLive(token: string): boolean {
	return !!liveConfirmation(token);
}

/**
 * Confirms the address a link was mailed to: the account may sign in from now on, every confirmation link of
 * it dies, and the invitation it was made through (if still pending) is accepted. Null for a dead link.
 */
export function confirmAddress(token: string): { email: string; padId: string | null } | null {
	const row = liveConfirmation(token);
	if (!row) return null;
	const db = getDb();
	const user = db.select().from(schema.users).where(eq(schema.users.id, row.userId)).get();
	if (!user) return null;
	db.delete(schema.emailConfirmations).where(eq(schema.emailConfirmations.userId, user.id)).run();
	if (!user.emailConfirmedAt) db.update(schema.users).set({ emailConfirmedAt: new Date() }).where(eq(schema.users.id, user.id)).run();
	const padId = row.inviteId ? acceptInvitationById(user, row.inviteId) : null;
	return { email: user.email, padId };
}

/**
 * Mails a fresh link to an unconfirmed account (the previous invitation, if any, is carried over). The
 * answer is the same whether or not such an account exists; limited like sign-up.
 */
export function resendConfirmation(email: string, clientAddress: string): void {
	takeOrThrow('Too many requests.', [mailLimits.signupPerAddress, clientAddress], [mailLimits.signupPerEmail, email]);
	const db = getDb();
	const user = db.select().from(schema.users).where(eq(schema.users.email, email)).get();
	if (!user || user.emailConfirmedAt) return;
	const previous = db
		.select({ inviteId: schema.emailConfirmations.inviteId })
		.from(schema.emailConfirmations)
		.where(and(eq(schema.emailConfirmations.userId, user.id)))
		.all()
		.find((r) => r.inviteId)?.inviteId;
	// in the background, so the answer's timing does not tell whether the account exists
	mailConfirmation(user, previous ?? null).catch((e) => console.error('confirmation mail could not be recorded', e));
}
