/**
 * Who may make an account, set by an admin: only people holding an invitation link, people whose address is
 * in one of the listed domains (or holding an invitation), or anyone. Kept in the settings table; a database
 * without the setting is invitation-only, so a fresh production install is closed until an admin opens it.
 */
import { eq } from 'drizzle-orm';
import { z } from 'zod';
import { getDb, schema } from '../db';
import { failure } from '../http';

export const SIGNUP_MODES = ['invite', 'domains', 'open'] as const;

const domainSchema = z
	.string()
	.trim()
	.toLowerCase()
	.transform((d) => d.replace(/^@/, ''))
	.pipe(z.string().regex(/^(?=.{1,200}$)([a-z0-9-]+\.)+[a-z]{2,}$/, 'A domain looks like physics.example.edu.'));

export const signupPolicySchema = z
	.object({ mode: z.enum(SIGNUP_MODES), domains: z.array(domainSchema).max(100).default([]) })
	.refine((p) => p.mode !== 'domains' || p.domains.length > 0, { message: 'List at least one domain.', path: ['domains'] });

export type SignupPolicy = z.infer<typeof signupPolicySchema>;

const KEY = 'signup';
const CLOSED: SignupPolicy = { mode: 'invite', domains: [] };

export function getSignupPolicy(): SignupPolicy {
	const row = getDb().select().from(schema.settings).where(eq(schema.settings.key, KEY)).get();
	const parsed = signupPolicySchema.safeParse(row?.value);
	return parsed.success ? parsed.data : CLOSED;
}

export function setSignupPolicy(policy: SignupPolicy): SignupPolicy {
	const value = { mode: policy.mode, domains: [...new Set(policy.domains)] };
	getDb()
		.insert(schema.settings)
		.values({ key: KEY, value, updatedAt: new Date() })
		.onConflictDoUpdate({ target: schema.settings.key, set: { value, updatedAt: new Date() } })
		.run();
	return value;
}

/** Throws 403 unless the policy lets this address make an account (an invitation link always does). */
export function checkSignupAllowed(email: string, invited: boolean): void {
	if (invited) return;
	const policy = getSignupPolicy();
	if (policy.mode === 'open') return;
	const domain = email.slice(email.lastIndexOf('@') + 1);
	if (policy.mode === 'domains' && policy.domains.includes(domain)) return;
	if (policy.mode === 'domains')
		failure(403, `Accounts are open to addresses at ${policy.domains.join(', ')}; otherwise ask for an invitation.`);
	failure(403, 'Accounts are by invitation only: open the link of an invitation you received.');
}
