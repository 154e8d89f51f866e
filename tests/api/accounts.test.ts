// The account attacks of the accounts/production issue, each tried against the real server and shown to fail:
// reading secrets from the outbox, tokens from failed sends, invitations bound to an address, revoked
// invitations, keys and sessions that outlive a password, raw session ids in the database, and sign-up
// outside the admin's policy. Rate limits with their own server are in accounts-limits.test.ts.
import { createHash } from 'node:crypto';
import { appendFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, freshMember, mailedToken, signUpConfirmed } from '../helpers/client';
import { expectFailure, freshWithRole, signInPatiently } from '../helpers/roles';
import { emailOf, sql, waitForMail } from './support/pads';

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex');
const PASSWORD = 'correct horse battery';

let admin: Client;

beforeAll(async () => {
	admin = await signInPatiently('curator@sable.test');
});

/** Makes the fake SMTP server refuse (after recording) every later message to this address. */
function makeUndeliverable(email: string) {
	appendFileSync(join(inject('mailDir'), 'undeliverable.txt'), `${email}\n`);
}

async function outboxRow(to: string, kind: string, status: string) {
	const deadline = Date.now() + 15_000;
	for (;;) {
		const r = await admin.get('/api/admin/outbox');
		const row = r.body.messages.find(
			(m: { to: string; kind: string; status: string }) => m.to === to && m.kind === kind && m.status === status
		);
		if (row) return row;
		if (Date.now() > deadline) throw new Error(`no ${status} ${kind} message to ${to} in the outbox`);
		await new Promise((ok) => setTimeout(ok, 150));
	}
}

describe('secrets stay secret', () => {
	it('an admin who asks a reset for a member finds no link or token in the outbox, API or page', async () => {
		const member = await freshMember('victim');
		const email = await emailOf(member);
		expect((await admin.post('/api/auth/reset', { email })).status).toBe(200);
		const token = await mailedToken(email, 'reset');
		const row = await outboxRow(email, 'reset', 'sent');
		expect(row).toMatchObject({ subject: 'Set a new Bulkpad password' });
		expect(row.text).toContain('[link withheld');
		const api = JSON.stringify((await admin.get('/api/admin/outbox')).body);
		expect(api).not.toContain(token);
		expect(api).not.toContain(`/reset/${token.slice(0, 12)}`);
		const page = await admin.get('/admin/outbox');
		expect(page.status).toBe(200);
		expect(page.body).not.toContain(token);
		// nor in the database: the outbox row and the token table hold no clear token
		expect(sql<{ text: string }>('SELECT text FROM outbox WHERE "to" = ?', email).some((r) => r.text.includes(token))).toBe(false);
		expect(sql('SELECT * FROM password_resets WHERE token_hash = ?', sha256(token))).toHaveLength(1);
	});

	it('a reset token from a failed send opens nothing', async () => {
		const member = await freshMember('bounce');
		const email = await emailOf(member);
		makeUndeliverable(email);
		expect((await new Client().post('/api/auth/reset', { email })).status).toBe(200);
		const token = await mailedToken(email, 'reset');
		const row = await outboxRow(email, 'reset', 'failed');
		expect(row.error).toMatch(/mailbox unavailable/);
		expect((await new Client().get(`/reset/${token}`)).body).not.toContain('name="password"');
		expectFailure(await new Client().post('/api/auth/reset/confirm', { token, password: 'taken over now' }), 400);
		expect((await member.get('/api/auth/me')).status).toBe(200);
	});

	it('an invitation from a failed send cannot be accepted, and the owner sees why', async () => {
		const owner = await freshMember('bounce-owner');
		const pad = (await owner.post('/api/pads', { title: 'never delivered' })).body.pad.id;
		const to = `bounced-${Date.now()}@tests.test`;
		makeUndeliverable(to);
		const r = await owner.post(`/api/pads/${pad}/invite`, { email: to });
		expect(r.body.mail.status).toBe('failed');
		const token = await mailedToken(to, 'invite');
		const someone = await freshMember('bounce-catcher');
		expectFailure(await someone.post('/api/invitations/accept', { token }), 404);
		expectFailure(await someone.get(`/api/pads/${pad}`), 404);
		const list = (await owner.get(`/api/pads/${pad}/invitations`)).body.invitations;
		expect(list).toMatchObject([{ email: to, state: 'pending', mail: 'failed' }]);
	});

	it('the sessions table holds only hashes of the cookies', async () => {
		const c = await freshMember('cookie-digest');
		const token = c.cookie.slice('auth_session='.length);
		expect(token.length).toBeGreaterThan(20);
		expect(sql('SELECT * FROM sessions WHERE id = ?', token)).toHaveLength(0);
		const rows = sql<{ id: string; user_agent: string | null }>('SELECT * FROM sessions WHERE id = ?', sha256(token));
		expect(rows).toHaveLength(1);
		// no row anywhere in the table carries a cookie value: every id is a sha-256 in hex
		const all = sql<{ id: string }>('SELECT id FROM sessions');
		expect(all.length).toBeGreaterThan(0);
		for (const r of all) expect(r.id).toMatch(/^[0-9a-f]{64}$/);
		// the hash itself is no cookie
		const forged = new Client();
		forged.cookie = `auth_session=${sha256(token)}`;
		expectFailure(await forged.get('/api/auth/me'), 401);
	});
});

describe('invitations bind to the token, not to the address', () => {
	it('the invited address without the token gets nothing', async () => {
		const owner = await freshMember('binder');
		const pad = (await owner.post('/api/pads', { title: 'bound to the link' })).body.pad.id;
		const to = `invited-${Date.now()}@tests.test`;
		expect((await owner.post(`/api/pads/${pad}/invite`, { email: to })).status).toBe(200);
		// someone who controls the sign-up form but not the mailbox's link: an account with that address, no token
		const squatter = await signUpConfirmed(to, PASSWORD, 'Squatter');
		expectFailure(await squatter.get(`/api/pads/${pad}`), 404);
		expect((await squatter.get('/shared')).body).not.toContain('bound to the link');
		expectFailure(await squatter.post('/api/invitations/accept', { token: 'x'.repeat(43) }), 404);
		expect(sql('SELECT * FROM pad_access WHERE pad_id = ?', pad)).toHaveLength(0);
		// the holder of the link, signed in with any confirmed account, is who gets the pad
		const token = await mailedToken(to, 'invite');
		const holder = await freshMember('link-holder');
		expect((await holder.post('/api/invitations/accept', { token })).status).toBe(200);
		expect((await holder.get(`/api/pads/${pad}`)).status).toBe(200);
		expectFailure(await squatter.get(`/api/pads/${pad}`), 404);
		const [row] = (await owner.get(`/api/pads/${pad}/invitations`)).body.invitations;
		expect(row).toMatchObject({ state: 'accepted', email: to, acceptedBy: { email: await emailOf(holder) } });
	});

	it('a revoked invitation cannot be accepted; revoking an accepted one takes the access away', async () => {
		const owner = await freshMember('revoker');
		const pad = (await owner.post('/api/pads', { title: 'changed my mind' })).body.pad.id;
		const reader = await freshMember('revoked-reader');
		const to = await emailOf(reader);

		await owner.post(`/api/pads/${pad}/invite`, { email: to });
		const first = await mailedToken(to, 'invite');
		const [pending] = (await owner.get(`/api/pads/${pad}/invitations`)).body.invitations;
		expect((await owner.del(`/api/pads/${pad}/invitations/${pending.id}`)).status).toBe(200);
		expectFailure(await reader.post('/api/invitations/accept', { token: first }), 404);
		expect((await reader.get(`/invite/${first}`)).body).toContain('invalid, used, revoked or expired');
		expectFailure(await reader.get(`/api/pads/${pad}`), 404);

		await owner.post(`/api/pads/${pad}/invite`, { email: to });
		let second = first;
		for (let i = 0; i < 150 && second === first; i++) {
			second = await mailedToken(to, 'invite');
			if (second === first) await new Promise((ok) => setTimeout(ok, 100));
		}
		expect((await reader.post('/api/invitations/accept', { token: second })).status).toBe(200);
		expect((await reader.get(`/api/pads/${pad}`)).status).toBe(200);
		// single use: the same link does nothing a second time
		expectFailure(await (await freshMember('second-user')).post('/api/invitations/accept', { token: second }), 404);

		const list = (await owner.get(`/api/pads/${pad}/invitations`)).body.invitations as { id: string; state: string }[];
		expect(list.map((i) => i.state)).toEqual(['accepted', 'revoked']);
		expect((await owner.del(`/api/pads/${pad}/invitations/${list[0].id}`)).status).toBe(200);
		expectFailure(await reader.get(`/api/pads/${pad}`), 404);
		expect((await reader.get('/shared')).body).not.toContain('changed my mind');
	});

	it('only the owner lists and revokes a pad’s invitations', async () => {
		const owner = await freshMember('list-owner');
		const pad = (await owner.post('/api/pads', { title: 'mine to manage' })).body.pad.id;
		await owner.post(`/api/pads/${pad}/invite`, { email: `someone-${Date.now()}@tests.test` });
		const [inv] = (await owner.get(`/api/pads/${pad}/invitations`)).body.invitations;
		const other = await freshMember('list-other');
		expectFailure(await other.get(`/api/pads/${pad}/invitations`), 404);
		expectFailure(await other.del(`/api/pads/${pad}/invitations/${inv.id}`), 404);
		expectFailure(await new Client().get(`/api/pads/${pad}/invitations`), 401);
		expectFailure(await owner.del(`/api/pads/${pad}/invitations/no-such-id`), 404);
		expect((await owner.get(`/api/pads/${pad}/invitations`)).body.invitations[0].state).toBe('pending');
		// the sharing panel lists it for the owner
		expect((await owner.get(`/shared/${pad}`)).body).toContain('pending since');
	});
});

describe('a new password ends what the old one opened', () => {
	it('a reset ends every session and revokes every key', async () => {
		const email = `reset-all-${Date.now()}@tests.test`;
		const browser = await signUpConfirmed(email, PASSWORD, 'Reset All');
		const laptop = new Client();
		expect((await laptop.post('/api/auth/signin', { email, password: PASSWORD })).status).toBe(200);
		const key = (await browser.post('/api/keys', { label: 'cluster' })).body.key as string;
		const script = new Client(undefined, key);
		expect((await script.get('/api/auth/me')).body.via).toBe('key');

		await new Client().post('/api/auth/reset', { email });
		const token = await mailedToken(email, 'reset');
		expect((await new Client().post('/api/auth/reset/confirm', { token, password: 'a fresh secret' })).status).toBe(200);
		for (const c of [browser, laptop, script]) expectFailure(await c.get('/api/auth/me'), 401);
		expect(sql('SELECT * FROM api_keys WHERE hash = ?', sha256(key))).toHaveLength(0);
	});

	it('a change needs the current password, then ends the other sessions and every key; this browser stays in', async () => {
		const email = `change-${Date.now()}@tests.test`;
		const browser = await signUpConfirmed(email, PASSWORD, 'Changer');
		const other = new Client();
		await other.post('/api/auth/signin', { email, password: PASSWORD });
		const key = (await browser.post('/api/keys', { label: 'old' })).body.key as string;

		expectFailure(await browser.post('/api/auth/password', { current: 'not it at all', password: 'brand new secret' }), 403);
		expectFailure(await new Client(undefined, key).post('/api/auth/password', { current: PASSWORD, password: 'brand new secret' }), 403);
		expectFailure(await browser.post('/api/auth/password', { current: PASSWORD, password: 'short' }), 400);
		expect((await other.get('/api/auth/me')).status).toBe(200);

		expect((await browser.post('/api/auth/password', { current: PASSWORD, password: 'brand new secret' })).status).toBe(200);
		expect((await browser.get('/api/auth/me')).body.user.email).toBe(email);
		expectFailure(await other.get('/api/auth/me'), 401);
		expectFailure(await new Client(undefined, key).get('/api/auth/me'), 401);
		expectFailure(await new Client().post('/api/auth/signin', { email, password: PASSWORD }), 401);
		expect((await new Client().post('/api/auth/signin', { email, password: 'brand new secret' })).status).toBe(200);
		// the page says so next to the button
		expect((await browser.get('/keys')).body).toContain('revokes all your keys');
	});
});

describe('sessions', () => {
	it('lists the user’s sessions, marks this one, and ends any of them', async () => {
		const email = `sessions-${Date.now()}@tests.test`;
		const a = await signUpConfirmed(email, PASSWORD, 'Two Browsers');
		const b = new Client();
		await b.request('POST', '/api/auth/signin', { email, password: PASSWORD }, { 'user-agent': 'SecondBrowser/1.0' });
		const list = (await a.get('/api/auth/sessions')).body.sessions as {
			id: string;
			current: boolean;
			userAgent: string;
			createdAt: string;
			expiresAt: string;
		}[];
		expect(list).toHaveLength(2);
		expect(list.filter((s) => s.current)).toHaveLength(1);
		const theirs = list.find((s) => !s.current)!;
		expect(theirs.userAgent).toBe('SecondBrowser/1.0');
		expect(new Date(theirs.expiresAt).getTime()).toBeGreaterThan(Date.now());

		// nobody else can end it
		expectFailure(await (await freshMember('session-thief')).del(`/api/auth/sessions/${theirs.id}`), 404);
		expect((await b.get('/api/auth/me')).status).toBe(200);
		expect((await a.del(`/api/auth/sessions/${theirs.id}`)).status).toBe(200);
		expectFailure(await b.get('/api/auth/me'), 401);
		expect((await a.get('/api/auth/sessions')).body.sessions).toHaveLength(1);

		const c = new Client();
		await c.post('/api/auth/signin', { email, password: PASSWORD });
		expect((await a.del('/api/auth/sessions')).body).toEqual({ ok: true, ended: 1 });
		expectFailure(await c.get('/api/auth/me'), 401);
		expect((await a.get('/api/auth/me')).status).toBe(200);
		const page = await a.get('/keys');
		expect(page.body).toContain('Keys &amp; sessions');
		expect(page.body).toContain('this one');
	});
});

describe('sign-up policy', () => {
	afterAll(async () => {
		// the rest of the suite makes accounts freely, as the demo does
		await admin.patch('/api/admin/settings', { signup: { mode: 'open', domains: [] } });
	});

	it('is the admin’s: members cannot read or set it, and it is validated', async () => {
		const member = await freshMember('policy-member');
		expectFailure(await member.get('/api/admin/settings'), 403);
		expectFailure(await member.patch('/api/admin/settings', { signup: { mode: 'open', domains: [] } }), 403);
		expectFailure(await new Client().get('/api/admin/settings'), 401);
		expect((await admin.get('/api/admin/settings')).body.signup).toEqual({ mode: 'open', domains: [] });
		expectFailure(await admin.patch('/api/admin/settings', { signup: { mode: 'domains', domains: [] } }), 400);
		expectFailure(await admin.patch('/api/admin/settings', { signup: { mode: 'whoever' } }), 400);
		expectFailure(await admin.patch('/api/admin/settings', { signup: { mode: 'domains', domains: ['not a domain'] } }), 400);
	});

	it('invitation only: a sign-up without an invitation link is refused, one with it is let in', async () => {
		expect((await admin.patch('/api/admin/settings', { signup: { mode: 'invite', domains: [] } })).body.signup.mode).toBe('invite');
		const refused = await new Client().post('/api/auth/signup', {
			email: `closed-${Date.now()}@tests.test`,
			password: PASSWORD,
			name: 'Outsider'
		});
		expect(expectFailure(refused, 403)).toMatch(/invitation only/);
		expect((await new Client().get('/signup')).body).toContain('by invitation only');

		const owner = await signInPatiently('tomas@sable.test');
		const pad = (await owner.post('/api/pads', { title: 'closed group pad' })).body.pad.id;
		const to = `closed-invitee-${Date.now()}@tests.test`;
		await owner.post(`/api/pads/${pad}/invite`, { email: to });
		const token = await mailedToken(to, 'invite');
		const joined = await signUpConfirmed(to, PASSWORD, 'Invitee', token);
		expect((await joined.get('/api/auth/me')).body.user.role).toBe('reader');
		expect((await joined.get(`/api/pads/${pad}`)).status).toBe(200);
		// a spent link makes no second account
		expectFailure(
			await new Client().post('/api/auth/signup', {
				email: `again-${Date.now()}@tests.test`,
				password: PASSWORD,
				name: 'Copycat',
				invite: token
			}),
			404
		);
	});

	it('listed domains: an address in them may sign up, any other is refused', async () => {
		const set = await admin.patch('/api/admin/settings', { signup: { mode: 'domains', domains: ['@Physics.Example.edu', 'uni.example'] } });
		expect(set.body.signup).toEqual({ mode: 'domains', domains: ['physics.example.edu', 'uni.example'] });
		const inside = await new Client().post('/api/auth/signup', {
			email: `in-${Date.now()}@physics.example.edu`,
			password: PASSWORD,
			name: 'Insider'
		});
		expect(inside.status, JSON.stringify(inside.body)).toBe(201);
		expect(inside.body.user.role).toBe('member');
		const outside = await new Client().post('/api/auth/signup', {
			email: `out-${Date.now()}@elsewhere.example`,
			password: PASSWORD,
			name: 'Outsider'
		});
		expect(expectFailure(outside, 403)).toMatch(/physics\.example\.edu, uni\.example/);
		// a look-alike domain is not the listed one
		expectFailure(
			await new Client().post('/api/auth/signup', { email: `x-${Date.now()}@evilphysics.example.edu`, password: PASSWORD, name: 'X' }),
			403
		);
	});

	it('the admin page shows the policy controls', async () => {
		const page = await admin.get('/admin/users');
		expect(page.body).toContain('Who may make an account');
		expect((await admin.patch('/api/admin/settings', { signup: { mode: 'open', domains: [] } })).status).toBe(200);
		const reader = await freshWithRole(admin, 'policy-reader', 'reader');
		expect((await reader.get('/admin/users')).status).toBe(403);
		// /admin itself: the admin lands on the user list, a reader is refused, a visitor is sent to sign in
		const home = await admin.get('/admin');
		expect(home.status).toBe(303);
		expect(home.headers.get('location')).toBe('/admin/users');
		expect((await reader.get('/admin')).status).toBe(403);
		const visitor = await new Client().get('/admin');
		expect(visitor.status).toBe(303);
		expect(visitor.headers.get('location')).toContain('/signin');
	});
});

describe('confirmation before sign-in', () => {
	it('an account made through sign-up cannot sign in or act before confirming, and the confirm page does nothing on GET', async () => {
		const email = `unconfirmed-${Date.now()}@tests.test`;
		const r = await new Client().post('/api/auth/signup', { email, password: PASSWORD, name: 'Waiting' });
		expect(r.status).toBe(201);
		const refused = await new Client().post('/api/auth/signin', { email, password: PASSWORD });
		expect(expectFailure(refused, 403)).toContain(`we sent a link to ${email}`);
		// a wrong password is still the generic 401 (the 403 only answers the right one)
		expectFailure(await new Client().post('/api/auth/signin', { email, password: 'wrong password' }), 401);
		const token = await mailedToken(email, 'confirm');
		const page = await new Client().get(`/confirm/${token}`);
		expect(page.status).toBe(200);
		expect(page.body).toContain('Confirm my address');
		expectFailure(await new Client().post('/api/auth/signin', { email, password: PASSWORD }), 403);
		await waitForMail(email);
		expect(sql('SELECT * FROM email_confirmations WHERE token_hash = ?', token)).toHaveLength(0);
		expect(sql('SELECT * FROM email_confirmations WHERE token_hash = ?', sha256(token))).toHaveLength(1);
		// the admin sees who has not confirmed yet
		const listed = (await admin.get('/api/admin/users')).body.users.find((u: { email: string }) => u.email === email);
		expect(listed.confirmedAt).toBeNull();
		expect((await admin.get('/admin/users')).body).toContain('not confirmed yet');
	});
});

describe('the account pages without JavaScript (form posts)', () => {
	const HTML = { accept: 'text/html' };
	const form = (fields: Record<string, string>) => {
		const f = new FormData();
		for (const [k, v] of Object.entries(fields)) f.set(k, v);
		return f;
	};

	it('sign-up answers “confirm your address”, sign-in refuses until the confirm button is pressed, then lets in', async () => {
		const email = `form-${Date.now()}@tests.test`;
		const made = await new Client().request('POST', '/signup', form({ name: 'Form Filler', email, password: PASSWORD, invite: '' }), HTML);
		expect(made.status).toBe(200);
		expect(made.body).toContain('we sent a link to');
		const c = new Client();
		const early = await c.request('POST', '/signin', form({ email, password: PASSWORD, next: '' }), HTML);
		expect(early.status).toBe(403);
		expect(early.body).toContain('Mail me a new confirmation link');
		const resent = await new Client().request('POST', '/confirm', form({ email }), HTML);
		expect(resent.status).toBe(200);
		expect(resent.body).toContain('a new link is on its way');

		const token = await mailedToken(email, 'confirm');
		const confirmed = await new Client().request('POST', `/confirm/${token}`, form({}), HTML);
		expect(confirmed.status).toBe(303);
		expect(confirmed.headers.get('location')).toBe('/signin?confirmed=1');
		const signedIn = await c.request('POST', '/signin', form({ email, password: PASSWORD, next: '/keys' }), HTML);
		expect(signedIn.status).toBe(303);
		expect(signedIn.headers.get('location')).toBe('/keys');
		expect((await c.get('/api/auth/me')).body.user.email).toBe(email);
	});

	it('an invitation page accepts for the signed-in user and sends them to the pad', async () => {
		const owner = await freshMember('form-owner');
		const pad = (await owner.post('/api/pads', { title: 'accepted by form' })).body.pad.id;
		const guest = await freshMember('form-guest');
		await owner.post(`/api/pads/${pad}/invite`, { email: await emailOf(guest) });
		const token = await mailedToken(await emailOf(guest), 'invite');
		const anon = await new Client().request('POST', `/invite/${token}`, form({}), HTML);
		expect(anon.status).toBe(303);
		expect(anon.headers.get('location')).toBe(`/signin?next=${encodeURIComponent(`/invite/${token}`)}`);
		const accepted = await guest.request('POST', `/invite/${token}`, form({}), HTML);
		expect(accepted.status).toBe(303);
		expect(accepted.headers.get('location')).toBe(`/shared/${pad}`);
		expect((await guest.get(`/shared/${pad}`)).body).toContain('accepted by form');
		// the owner revokes from the sharing panel's form
		const [inv] = (await owner.get(`/api/pads/${pad}/invitations`)).body.invitations;
		expect((await owner.request('POST', `/shared/${pad}?/uninvite`, form({ invitation: inv.id }), HTML)).status).toBe(200);
		expectFailure(await guest.get(`/api/pads/${pad}`), 404);
	});
});
