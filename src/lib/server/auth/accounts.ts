import type { Cookies } from '@sveltejs/kit';
import { eq } from 'drizzle-orm';
import { randomBytes } from 'node:crypto';
import { z } from 'zod';
import { getDb, schema } from '../db';
import type { Role } from '../db/schema';
import { env } from '../env';
import { createRateLimiter } from '../rate-limit';
import { ApiFailure } from '../http';
import { getLucia } from './lucia';
import { burnPasswordTime, hashPassword, verifyPassword } from './password';

export const emailSchema = z.string().trim().toLowerCase().email('Enter a valid e-mail address.').max(200);
export const passwordSchema = z.string().min(8, 'Use at least 8 characters.').max(200);
export const signUpSchema = z.object({
	email: emailSchema,
	password: passwordSchema,
	name: z.string().trim().min(1, 'Enter your name.').max(100)
});
export const signInSchema = z.object({ email: emailSchema, password: z.string().min(1).max(200) });

/** Per e-mail (guessing one account's password) and per client address (one password on many accounts). */
export const signInLimiters = {
	email: createRateLimiter(env.signinPerMinute, 60_000),
	ip: createRateLimiter(env.signinPerMinutePerAddress, 60_000)
};

export function newId(): string {
	return randomBytes(10).toString('hex');
}

/**
 * The role a self-service sign-up gets: someone who was invited to a pad before having an account is a
 * collaborator or referee, so a reader (an admin promotes them to member); anyone else is a member.
 */
export function signUpRole(email: string): Role {
	const invited = getDb().select({ padId: schema.padAccess.padId }).from(schema.padAccess).where(eq(schema.padAccess.email, email)).get();
	return invited ? 'reader' : 'member';
}

export async function createUser(input: z.infer<typeof signUpSchema>, role: Role = signUpRole(input.email)) {
	const db = getDb();
	const taken = db.select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, input.email)).get();
	if (taken) throw new ApiFailure(409, 'An account with this e-mail exists already; sign in instead.');
	const user = { id: newId(), email: input.email, name: input.name, role, passwordHash: await hashPassword(input.password) };
	db.insert(schema.users).values(user).run();
	return { id: user.id, email: user.email, name: user.name, role };
}

/**
 * Checks e-mail and password. Limited per client address and per e-mail, so neither guessing many
 * passwords for one account nor trying one password on many accounts is cheap. The message is the same
 * for an unknown e-mail and a wrong password.
 */
export async function checkCredentials(input: z.infer<typeof signInSchema>, clientAddress: string) {
	for (const [limiter, key] of [
		[signInLimiters.ip, clientAddress],
		[signInLimiters.email, input.email]
	] as const) {
		if (!limiter.take(key)) {
			throw new ApiFailure(429, `Too many sign-in attempts; try again in ${limiter.retryAfterSeconds(key)} s.`);
		}
	}
	const user = getDb().select().from(schema.users).where(eq(schema.users.email, input.email)).get();
	if (!user) {
		await burnPasswordTime(input.password);
		throw new ApiFailure(401, 'Wrong e-mail or password.');
	}
	if (!(await verifyPassword(user.passwordHash, input.password))) throw new ApiFailure(401, 'Wrong e-mail or password.');
	return { id: user.id, email: user.email, name: user.name, role: user.role };
}

export async function startSession(cookies: Cookies, userId: string) {
	const lucia = getLucia();
	const session = await lucia.createSession(userId, {});
	const c = lucia.createSessionCookie(session.id);
	cookies.set(c.name, c.value, { path: '.', ...c.attributes });
}

export async function endSession(cookies: Cookies, sessionId: string | undefined) {
	const lucia = getLucia();
	if (sessionId) await lucia.invalidateSession(sessionId);
	const c = lucia.createBlankSessionCookie();
	cookies.set(c.name, c.value, { path: '.', ...c.attributes });
}

export async function setPassword(userId: string, password: string) {
	getDb().update(schema.users).set({ passwordHash: await hashPassword(password) }).where(eq(schema.users.id, userId)).run();
	await getLucia().invalidateUserSessions(userId);
}
