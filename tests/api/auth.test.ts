import { describe, expect, it } from 'vitest';
import { Client, DEMO_PASSWORD, signedIn } from '../helpers/client';

describe('health', () => {
	it('answers ok after a real query against the seeded database', async () => {
		const r = await new Client().get('/api/health');
		expect(r.status).toBe(200);
		expect(r.body).toMatchObject({ ok: true, db: 'ok' });
		expect(r.body.users).toBeGreaterThanOrEqual(4); // the four demo accounts
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

	it('rate-limits repeated attempts on one account with 429, even with the right password', async () => {
		// the test server allows 30 attempts per e-mail per minute (BULKPAD_SIGNIN_PER_MINUTE)
		const email = `target-${Date.now()}@tests.test`;
		await new Client().post('/api/auth/signup', { email, password: 'the right one!', name: 'Target' });
		const statuses: number[] = [];
		for (let i = 0; i < 30; i++) {
			const r = await new Client().post('/api/auth/signin', { email, password: `guess-${i}` });
			statuses.push(r.status);
		}
		expect(statuses.every((s) => s === 401)).toBe(true);
		const blocked = await new Client().post('/api/auth/signin', { email, password: 'the right one!' });
		expect(blocked.status).toBe(429);
		expect(blocked.body.error.message).toMatch(/try again in \d+ s/);
	});

	it('rejects a malformed body with 400 and the zod issues', async () => {
		const r = await new Client().post('/api/auth/signin', { email: 'not-an-email' });
		expect(r.status).toBe(400);
		expect(r.body.ok).toBe(false);
		expect(Array.isArray(r.body.error.issues)).toBe(true);
	});

	it('signs up a member, refuses a second account with the same e-mail, and signs out', async () => {
		const c = new Client();
		const email = `new-${Date.now()}@tests.test`;
		const r = await c.post('/api/auth/signup', { email, password: 'long enough pw', name: 'New Theorist' });
		expect(r.status).toBe(201);
		expect(r.body.user).toMatchObject({ email, role: 'member' });
		const again = await new Client().post('/api/auth/signup', { email, password: 'long enough pw', name: 'Twin' });
		expect(again.status).toBe(409);
		expect((await c.post('/api/auth/signout')).status).toBe(200);
		expect((await c.get('/api/auth/me')).status).toBe(401);
	});

	it('signs up someone invited to a pad as a reader (an admin promotes them)', async () => {
		const { freshMember } = await import('../helpers/client');
		const owner = await freshMember('inviter');
		const pad = (await owner.post('/api/pads', { title: 'for the referee' })).body.pad.id;
		const email = `referee-${Date.now()}@tests.test`;
		expect((await owner.post(`/api/pads/${pad}/invite`, { email })).status).toBe(200);
		const c = new Client();
		const r = await c.post('/api/auth/signup', { email, password: 'long enough pw', name: 'Referee' });
		expect(r.status).toBe(201);
		expect(r.body.user.role).toBe('reader');
		expect((await c.get(`/api/pads/${pad}`)).status).toBe(200);
		expect((await c.post('/api/eval', { input: 'zstar l=0.2' })).status).toBe(403);
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
