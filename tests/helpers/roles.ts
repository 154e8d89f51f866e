// Accounts in a given role for the role-rule tests. Sign-in is rate-limited per e-mail (5 a minute in the
// test server), and several test files sign in as the same demo account, so waiting out a 429 here keeps
// the suite's result independent of file order.
import { expect } from 'vitest';
import { Client, DEMO_PASSWORD, freshMember } from './client';

export async function signInPatiently(email: string, password = DEMO_PASSWORD): Promise<Client> {
	const deadline = Date.now() + 130_000;
	for (;;) {
		const c = new Client();
		const r = await c.post('/api/auth/signin', { email, password });
		if (r.status === 200) return c;
		if (r.status !== 429 || Date.now() > deadline) throw new Error(`sign-in as ${email} failed: ${r.status} ${JSON.stringify(r.body)}`);
		const seconds = Number(/(\d+) s/.exec(String(r.body?.error?.message))?.[1] ?? 10);
		await new Promise((ok) => setTimeout(ok, Math.min(seconds, 61) * 1000 + 250));
	}
}

export async function idOf(c: Client): Promise<string> {
	const me = await c.get('/api/auth/me');
	expect(me.status).toBe(200);
	return me.body.user.id as string;
}

/** A fresh account whose role an admin has set through the API. */
export async function freshWithRole(admin: Client, tag: string, role: 'admin' | 'member' | 'reader'): Promise<Client> {
	const c = await freshMember(tag);
	if (role !== 'member') {
		const r = await admin.patch('/api/admin/users', { id: await idOf(c), role });
		expect(r.status, JSON.stringify(r.body)).toBe(200);
	}
	return c;
}

/** The `{ ok:false, error:{ message } }` shape of API.md, with the status expected. */
export function expectFailure(r: { status: number; body: any }, status: number): string {
	expect(r.status, JSON.stringify(r.body)).toBe(status);
	expect(r.body.ok).toBe(false);
	expect(typeof r.body.error?.message).toBe('string');
	return r.body.error.message as string;
}
