import { eq } from 'drizzle-orm';
import { randomBytes } from 'node:crypto';
import { z } from 'zod';
import { getDb, schema } from '../db';
import type { Role } from '../db/schema';
import { ApiFailure, failure } from '../http';
import { signInFailures } from './limits';
import { burnPasswordTime, hashPassword, verifyPassword } from './password';
import { endEverySessionAndKey } from './sessions';

export { startSession, endSession } from './sessions';

export const emailSchema = z.string().trim().toLowerCase().email('Enter a valid e-mail address.').max(200);
export const passwordSchema = z.string().min(8, 'Use at least 8 characters.').max(200);
export const signUpSchema = z.object({
	email: emailSchema,
	password: passwordSchema,
	name: z.string().trim().min(1, 'Enter your name.').max(100),
	/** the token of an invitation link, when the account is made through one */
	invite: z.string().min(10).max(200).optional()
});
export const signInSchema = z.object({ email: emailSchema, password: z.string().min(1).max(200) });
export const changePasswordSchema = z.object({ current: z.string().min(1).max(200), password: passwordSchema });

export function newId(): string {
	return randomBytes(10).toString('hex');
}

/**
 * Makes an account. Self-service accounts start unconfirmed (`confirmed` false) and cannot sign in until the
 * mailed link is followed; the demo seed and the first-admin setup make confirmed ones.
 */
export async function createUser(
	input: { email: string; password: string; name: string },
	role: Role = 'member',
	options: { confirmed?: boolean } = {}
) {
	const db = getDb();
	const taken = db.select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, input.email)).get();
	if (taken) throw new ApiFailure(409, 'An account with this e-mail exists already; sign in instead.');
	const user = {
		id: newId(),
		email: input.email,
		name: input.name,
		role,
		passwordHash: await hashPassword(input.password),
		emailConfirmedAt: options.confirmed ? new Date() : null
	};
	db.insert(schema.users).values(user).run();
	return { id: user.id, email: user.email, name: user.name, role };
}

/**
 * Checks e-mail and password. Only wrong passwords count, per account and client address (another client's
 * wrong tries never lock the owner out) and per client address across accounts (one password tried on many
 * accounts). The message is the same for an unknown e-mail and a wrong password; an unconfirmed account with
 * the right password is told where its link went.
 */
export async function checkCredentials(input: z.infer<typeof signInSchema>, clientAddress: string) {
	const accountKey = `${input.email}\n${clientAddress}`;
	for (const [counter, key] of [
		[signInFailures.address, clientAddress],
		[signInFailures.account, accountKey]
	] as const) {
		if (counter.blocked(key)) {
			const retryAfter = counter.retryAfterSeconds(key);
			throw new ApiFailure(429, `Too many wrong passwords; try again in ${retryAfter} s.`, { retryAfter });
		}
	}
	const user = getDb().select().from(schema.users).where(eq(schema.users.email, input.email)).get();
	const right = user ? await verifyPassword(user.passwordHash, input.password) : (await burnPasswordTime(input.password), false);
	if (!user || !right) {
		signInFailures.address.fail(clientAddress);
		signInFailures.account.fail(accountKey);
		throw new ApiFailure(401, 'Wrong e-mail or password.');
	}
	if (!user.emailConfirmedAt) {
		failure(403, `Confirm your address: we sent a link to ${user.email}. No message? Ask for a new link from the sign-in page.`, {
			unconfirmed: true
		});
	}
	return { id: user.id, email: user.email, name: user.name, role: user.role };
}

/** Sets a new password; every session and every key of the account ends (they were opened with the old one). */
export async function setPassword(userId: string, password: string) {
	getDb()
		.update(schema.users)
		.set({ passwordHash: await hashPassword(password) })
		.where(eq(schema.users.id, userId))
		.run();
	endEverySessionAndKey(userId);
}

/** A signed-in user's own change: the current password first, so a borrowed session cannot take the account. */
export async function changePassword(userId: string, input: z.infer<typeof changePasswordSchema>) {
	const user = getDb().select().from(schema.users).where(eq(schema.users.id, userId)).get();
	if (!user || !(await verifyPassword(user.passwordHash, input.current))) failure(403, 'The current password is not right.');
	if (input.current === input.password) failure(400, 'Choose a password different from the current one.');
	await setPassword(userId, input.password);
}
