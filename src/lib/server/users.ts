/**
 * Admin user management: who is in the group and with which role. The group always keeps one admin, or
 * nobody could curate the library or undo a mistaken demotion.
 */
import { asc, count, eq } from 'drizzle-orm';
import { z } from 'zod';
import { getDb, schema } from './db';
import { ROLES } from './db/schema';
import { failure } from './http';

export const setRoleSchema = z.object({ id: z.string().min(1).max(64), role: z.enum(ROLES) });

const columns = {
	id: schema.users.id,
	email: schema.users.email,
	name: schema.users.name,
	role: schema.users.role,
	/** null while the person has not followed the confirmation link (they cannot sign in yet) */
	confirmedAt: schema.users.emailConfirmedAt,
	createdAt: schema.users.createdAt
};

export function listUsers() {
	return getDb().select(columns).from(schema.users).orderBy(asc(schema.users.email)).all();
}

export function setRole(input: z.infer<typeof setRoleSchema>) {
	return getDb().transaction((tx) => {
		const user = tx.select(columns).from(schema.users).where(eq(schema.users.id, input.id)).get();
		if (!user) failure(404, 'No such user.');
		if (user.role === 'admin' && input.role !== 'admin') {
			const admins = tx.select({ n: count() }).from(schema.users).where(eq(schema.users.role, 'admin')).get()?.n ?? 0;
			if (admins <= 1) failure(409, `${user.name} is the last admin; make someone else admin first.`);
		}
		if (user.role !== input.role) tx.update(schema.users).set({ role: input.role }).where(eq(schema.users.id, user.id)).run();
		return { ...user, role: input.role };
	});
}
