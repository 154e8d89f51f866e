// E-mail through real SMTP (the fake server writes each message into inject('mailDir')): invitations,
// password reset end to end, and the admin outbox.
import { createHash } from 'node:crypto';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, freshMember } from '../helpers/client';
import { expectFailure, freshWithRole, signInPatiently } from '../helpers/roles';
import { emailOf, receivedMail, sql, waitForMail } from './support/pads';

let admin: Client;
let owner: Client;
let reader: Client;
let padId: string;

beforeAll(async () => {
	admin = await signInPatiently('curator@sable.test');
	owner = await freshMember('mail-owner');
	reader = await freshWithRole(admin, 'mail-reader', 'reader');
	// mail needs no evaluation: an empty pad is enough
	padId = (await owner.post('/api/pads', { title: 'Mutual information at small gap' })).body.pad.id;
});

describe('invitations', () => {
	it('records access, sends a real message and lists it in the outbox', async () => {
		const to = await emailOf(reader);
		const r = await owner.post(`/api/pads/${padId}/invite`, { email: to.toUpperCase() });
		expect(r.status, JSON.stringify(r.body)).toBe(200);
		expect(r.body).toEqual({ ok: true, mail: { status: 'sent' } });

		const mail = await waitForMail(to);
		expect(mail.subject).toBe('mail-owner shared a Bulkpad pad with you: Mutual information at small gap');
		expect(mail.from).toContain('Bulkpad');
		expect(mail.text).toContain(`${inject('baseUrl')}/shared/${padId}`);
		expect(mail.text).not.toContain('/signup');

		// the address now reads the pad, sees it on /shared, and the admin outbox shows the message as sent
		expect((await reader.get(`/api/pads/${padId}`)).status).toBe(200);
		const shared = await reader.get('/shared');
		expect(shared.status).toBe(200);
		expect(shared.body).toContain('Mutual information at small gap');
		const outbox = await admin.get('/api/admin/outbox');
		expect(outbox.status).toBe(200);
		const row = outbox.body.messages.find((m: { to: string; subject: string }) => m.to === to && m.subject === mail.subject);
		expect(row).toMatchObject({ status: 'sent', error: null, text: mail.text.trimEnd() });
	});

	it('links a transcript when the pad has a live link, and sign-up when the address has no account', async () => {
		const { slug } = (await owner.post(`/api/pads/${padId}/share`, {})).body;
		const stranger = `nobody-${Date.now()}@tests.test`;
		expect((await owner.post(`/api/pads/${padId}/invite`, { email: stranger })).status).toBe(200);
		const mail = await waitForMail(stranger);
		expect(mail.text).toContain(`${inject('baseUrl')}/t/${slug}`);
		expect(mail.text).toContain(`${inject('baseUrl')}/signup`);
		// signing up with the invited address gives access at once
		const joined = new Client();
		expect((await joined.post('/api/auth/signup', { email: stranger, password: 'correct horse battery', name: 'Newcomer' })).status).toBe(201);
		expect((await joined.get(`/api/pads/${padId}`)).status).toBe(200);
	});

	it('inviting twice keeps one access row and sends a second message', async () => {
		const to = `twice-${Date.now()}@tests.test`;
		await owner.post(`/api/pads/${padId}/invite`, { email: to });
		await owner.post(`/api/pads/${padId}/invite`, { email: to });
		expect(sql('SELECT * FROM pad_access WHERE pad_id = ? AND email = ?', padId, to)).toHaveLength(1);
		await waitForMail(to, () => receivedMail().filter((m) => m.to.includes(to)).length === 2);
	});

	it('is for the owner, with a valid address that is not their own', async () => {
		expectFailure(await reader.post(`/api/pads/${padId}/invite`, { email: 'x@tests.test' }), 403);
		expectFailure(await (await freshMember('mail-other')).post(`/api/pads/${padId}/invite`, { email: 'x@tests.test' }), 404);
		expectFailure(await new Client().post(`/api/pads/${padId}/invite`, { email: 'x@tests.test' }), 401);
		expectFailure(await owner.post(`/api/pads/${padId}/invite`, { email: 'not an address' }), 400);
		expect(expectFailure(await owner.post(`/api/pads/${padId}/invite`, { email: await emailOf(owner) }), 400)).toMatch(/your own address/);
	});
});

describe('outbox', () => {
	it('is for admins only, as API and page', async () => {
		expectFailure(await owner.get('/api/admin/outbox'), 403);
		expectFailure(await reader.get('/api/admin/outbox'), 403);
		expectFailure(await new Client().get('/api/admin/outbox'), 401);
		expect((await owner.get('/admin/outbox')).status).toBe(403);
		const page = await admin.get('/admin/outbox');
		expect(page.status).toBe(200);
		expect(page.body).toContain('shared a Bulkpad pad with you');
	});
});

function tokenOf(text: string): string {
	const m = new RegExp(`${inject('baseUrl').replace(/[.]/g, '\\.')}/reset/([A-Za-z0-9_-]+)`).exec(text);
	if (!m) throw new Error(`no reset link in:\n${text}`);
	return m[1];
}

describe('password reset', () => {
	it('works end to end: mail → token → new password; old sessions end, the token is spent', async () => {
		const user = await freshMember('resetter');
		const email = await emailOf(user);
		const r = await new Client().post('/api/auth/reset', { email });
		expect(r.status).toBe(200);
		expect(r.body).toEqual({ ok: true });
		const mail = await waitForMail(email, (m) => m.subject === 'Set a new Bulkpad password');
		const token = tokenOf(mail.text);
		// only a hash of the token is stored
		expect(sql('SELECT * FROM password_resets WHERE token_hash = ?', token)).toHaveLength(0);
		expect(sql('SELECT * FROM password_resets WHERE token_hash = ?', createHash('sha256').update(token).digest('hex'))).toHaveLength(1);

		// the page for the link shows the form
		expect((await new Client().get(`/reset/${token}`)).body).toContain('name="password"');

		expectFailure(await new Client().post('/api/auth/reset/confirm', { token: token + 'x', password: 'a brand new secret' }), 400);
		expectFailure(await new Client().post('/api/auth/reset/confirm', { token, password: 'short' }), 400);
		expect((await new Client().post('/api/auth/reset/confirm', { token, password: 'a brand new secret' })).status).toBe(200);

		expectFailure(await user.get('/api/auth/me'), 401);
		expectFailure(await new Client().post('/api/auth/signin', { email, password: 'correct horse battery' }), 401);
		const again = new Client();
		expect((await again.post('/api/auth/signin', { email, password: 'a brand new secret' })).status).toBe(200);
		expect((await again.get('/api/auth/me')).body.user.email).toBe(email);

		expect(expectFailure(await new Client().post('/api/auth/reset/confirm', { token, password: 'yet another secret' }), 400)).toMatch(/invalid, used or expired/);
		expect((await new Client().get(`/reset/${token}`)).body).not.toContain('name="password"');
	});

	it('answers the same for an unknown address and sends nothing', async () => {
		const unknown = `ghost-${Date.now()}@tests.test`;
		const r = await new Client().post('/api/auth/reset', { email: unknown });
		expect(r.status).toBe(200);
		expect(r.body).toEqual({ ok: true });
		// a known address sent after it arrives; by then the unknown one would have too
		const known = await freshMember('reset-known');
		const knownEmail = await emailOf(known);
		await new Client().post('/api/auth/reset', { email: knownEmail });
		await waitForMail(knownEmail);
		expect(receivedMail().some((m) => m.to.includes(unknown))).toBe(false);
		expectFailure(await new Client().post('/api/auth/reset', { email: 'nope' }), 400);
	});

	it('refuses an expired token and the older link once a newer one is used', async () => {
		const user = await freshMember('reset-expiry');
		const email = await emailOf(user);
		await new Client().post('/api/auth/reset', { email });
		const first = tokenOf((await waitForMail(email)).text);
		await new Client().post('/api/auth/reset', { email });
		const second = tokenOf((await waitForMail(email, (m) => !m.text.includes(first))).text);
		expect(second).not.toBe(first);

		sql('UPDATE password_resets SET expires_at = ? WHERE token_hash = ?', Date.now() - 1000, createHash('sha256').update(second).digest('hex'));
		expectFailure(await new Client().post('/api/auth/reset/confirm', { token: second, password: 'never gets set' }), 400);
		// using a token clears every token of the account, so the first link died with the expired one
		expectFailure(await new Client().post('/api/auth/reset/confirm', { token: first, password: 'never gets set' }), 400);
		expect((await user.get('/api/auth/me')).status).toBe(200);
	});

	it('limits requests per address', async () => {
		const email = `flood-${Date.now()}@tests.test`;
		const statuses: number[] = [];
		for (let i = 0; i < 6; i++) statuses.push((await new Client().post('/api/auth/reset', { email })).status);
		expect(statuses).toEqual([200, 200, 200, 200, 200, 429]);
	});
});
