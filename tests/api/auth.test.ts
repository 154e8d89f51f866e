import { describe, expect, it } from 'vitest';
import { Client, DEMO_PASSWORD, mailedToken, signUpConfirmed, signedIn } from '../helpers/client';
import { expectFailure } from '../helpers/roles';

describe('health', () => {
	it('answers ok after a real query against the seeded database', async () => {
		const r = await new Client().get('/api/health');
		expect(r.status).toBe(200);
		expect(r.body).toMatchObject({ ok: true, db: 'ok' });
		// anyone may ask, so it says nothing about the accounts (it used to count them); `queue` says where lines are
		// evaluated (in-process here: no BULKPAD_QUEUE; tests/api/fleet.test.ts has the fleet's answers)
		expect(Object.keys(r.body).sort()).toEqual(['db', 'ok', 'queue']);
		expect(r.body.queue).toBe('in-process');
	});
});

describe('sign-in', () => {
	it('signs the demo member in with a session cookie and reports who they are', async () => {
		const c = await signedIn('ines@sable.test', undefined, true);
		expect(c.cookie).toMatch(/^auth_session=/);
		const me = await c.get('/api/auth/me');
		expect(me.status).toBe(200);
		expect(me.body.user).toMatchObject({ email: 'ines@sable.test', role: 'member' });
		expect(me.body.via).toBe('session');
	});

	it('sets an HttpOnly, SameSite=Lax session cookie', async () => {
		const c = new Client();
		const r = await c.post('/api/auth/signin', { email: 'tomas@sable.test', password: DEMO_PASSWORD });
		const cookie = r.headers.getSetCookie().find((s) => s.startsWith('auth_session='))!;
		expect(cookie).toMatch(/HttpOnly/i);
		expect(cookie).toMatch(/SameSite=Lax/i);
	});

	it('answers the same generic 401 for an unknown e-mail and a wrong password', async () => {
		const a = await new Client().post('/api/auth/signin', { email: 'nobody@sable.test', password: 'whatever-it-is' });
		const b = await new Client().post('/api/auth/signin', { email: 'curator@sable.test', password: 'not-the-password' });
		expect(a.status).toBe(401);
		expect(b.status).toBe(401);
		expect(a.body.error.message).toBe(b.body.error.message);
		expect(a.body.ok).toBe(false);
	});

	it('slows wrong passwords on one account with 429 and Retry-After, and the right password still gets in', async () => {
		// the test server allows 30 wrong passwords per account and client per minute (BULKPAD_SIGNIN_PER_MINUTE);
		// only failures count, so the owner's right password is never refused for someone's wrong tries
		const email = `target-${Date.now()}@tests.test`;
		await signUpConfirmed(email, 'the right one!', 'Target');
		const statuses: number[] = [];
		for (let i = 0; i < 10; i++) statuses.push((await new Client().post('/api/auth/signin', { email, password: `guess-${i}` })).status);
		expect(statuses.every((s) => s === 401)).toBe(true);
		expect((await new Client().post('/api/auth/signin', { email, password: 'the right one!' })).status).toBe(200);
		for (let i = 10; i < 30; i++) expect((await new Client().post('/api/auth/signin', { email, password: `guess-${i}` })).status).toBe(401);
		const blocked = await new Client().post('/api/auth/signin', { email, password: `guess-30` });
		expect(blocked.status).toBe(429);
		expect(blocked.body.error.message).toMatch(/try again in \d+ s/);
		expect(Number(blocked.headers.get('retry-after'))).toBeGreaterThan(0);
	});

	it('rejects a malformed body with 400 and the zod issues', async () => {
		const r = await new Client().post('/api/auth/signin', { email: 'not-an-email' });
		expect(r.status).toBe(400);
		expect(r.body.ok).toBe(false);
		expect(Array.isArray(r.body.error.issues)).toBe(true);
	});

	it('signs up a member who confirms the address by mail before signing in, refuses a twin account, and signs out', async () => {
		const c = new Client();
		const email = `new-${Date.now()}@tests.test`;
		const r = await c.post('/api/auth/signup', { email, password: 'long enough pw', name: 'New Theorist' });
		expect(r.status).toBe(201);
		expect(r.body.user).toMatchObject({ email, role: 'member' });
		expect(r.body.confirmation).toEqual({ to: email, status: 'sent' });
		// no session before the address is confirmed, and sign-in says why
		expect(c.cookie).toBe('');
		expect((await c.get('/api/auth/me')).status).toBe(401);
		const early = await new Client().post('/api/auth/signin', { email, password: 'long enough pw' });
		expect(early.status).toBe(403);
		expect(early.body.error.message).toContain(`Confirm your address: we sent a link to ${email}`);
		const again = await new Client().post('/api/auth/signup', { email, password: 'long enough pw', name: 'Twin' });
		expect(again.status).toBe(409);

		const token = await mailedToken(email, 'confirm');
		expectFailure(await new Client().post('/api/auth/confirm', { token: token + 'x' }), 400);
		expect((await new Client().post('/api/auth/confirm', { token })).body).toMatchObject({ ok: true, email, padId: null });
		expectFailure(await new Client().post('/api/auth/confirm', { token }), 400);
		expect((await c.post('/api/auth/signin', { email, password: 'long enough pw' })).status).toBe(200);
		expect((await c.get('/api/auth/me')).body.user.email).toBe(email);
		expect((await c.post('/api/auth/signout')).status).toBe(200);
		expect((await c.get('/api/auth/me')).status).toBe(401);
	});

	it('mails a new confirmation link on request, answering the same for any address', async () => {
		const email = `resend-${Date.now()}@tests.test`;
		await new Client().post('/api/auth/signup', { email, password: 'long enough pw', name: 'Slow Reader' });
		const first = await mailedToken(email, 'confirm');
		expect((await new Client().post('/api/auth/confirm/resend', { email })).body).toEqual({ ok: true });
		expect((await new Client().post('/api/auth/confirm/resend', { email: `ghost-${Date.now()}@tests.test` })).body).toEqual({ ok: true });
		let second = first;
		for (let i = 0; i < 150 && second === first; i++) {
			await new Promise((r) => setTimeout(r, 100));
			second = await mailedToken(email, 'confirm');
		}
		expect(second).not.toBe(first);
		expect((await new Client().post('/api/auth/confirm', { token: second })).status).toBe(200);
		expect((await new Client().post('/api/auth/signin', { email, password: 'long enough pw' })).status).toBe(200);
	});

	it('stores an argon2id hash, never the password', async () => {
		const { default: Database } = await import('better-sqlite3');
		const { inject } = await import('vitest');
		const db = new Database(inject('dbFile'), { readonly: true });
		const row = db.prepare('select password_hash from users where email = ?').get('ines@sable.test') as { password_hash: string };
		db.close();
		expect(row.password_hash.startsWith('$argon2id$')).toBe(true);
		expect(row.password_hash).not.toContain(DEMO_PASSWORD);
	});
});
