// E-mail through real SMTP (the fake server writes each message into inject('mailDir')): invitations,
// password reset end to end, and the admin outbox.
import { createHash } from 'node:crypto';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, freshMember, mailedToken, signUpConfirmed } from '../helpers/client';
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
	it('mails a single-use link, grants nothing until it is accepted, and the outbox keeps the message without the link', async () => {
		const to = await emailOf(reader);
		const r = await owner.post(`/api/pads/${padId}/invite`, { email: to.toUpperCase() });
		expect(r.status, JSON.stringify(r.body)).toBe(200);
		expect(r.body).toMatchObject({ ok: true, mail: { status: 'sent' }, invitation: { email: to, state: 'pending' } });

		const mail = await waitForMail(to, (m) => m.subject.includes('shared a Bulkpad pad'));
		expect(mail.subject).toBe('mail-owner shared a Bulkpad pad with you: Mutual information at small gap');
		expect(mail.from).toContain('Bulkpad');
		const token = await mailedToken(to, 'invite');
		expect(mail.text).toContain(`${inject('baseUrl')}/invite/${token}`);
		// only a hash of the token is stored
		expect(sql('SELECT * FROM invitations WHERE token_hash = ?', token)).toHaveLength(0);
		expect(sql('SELECT * FROM invitations WHERE token_hash = ?', createHash('sha256').update(token).digest('hex'))).toHaveLength(1);

		// the address alone opens nothing
		expectFailure(await reader.get(`/api/pads/${padId}`), 404);
		const outbox = await admin.get('/api/admin/outbox');
		expect(outbox.status).toBe(200);
		const row = outbox.body.messages.find((m: { to: string; subject: string }) => m.to === to && m.subject === mail.subject);
		expect(row).toMatchObject({ status: 'sent', error: null, kind: 'invite' });
		expect(row.text).toContain('[link withheld');
		expect(JSON.stringify(outbox.body)).not.toContain(token);

		// the invitation page shows the pad; accepting gives read access and spends the link
		const page = await reader.get(`/invite/${token}`);
		expect(page.status).toBe(200);
		expect(page.body).toContain('Mutual information at small gap');
		const accepted = await reader.post('/api/invitations/accept', { token });
		expect(accepted.status, JSON.stringify(accepted.body)).toBe(200);
		expect(accepted.body.pad.id).toBe(padId);
		expect((await reader.get(`/api/pads/${padId}`)).status).toBe(200);
		const shared = await reader.get('/shared');
		expect(shared.status).toBe(200);
		expect(shared.body).toContain('Mutual information at small gap');
		expectFailure(await (await freshMember('late-comer')).post('/api/invitations/accept', { token }), 404);
	});

	it('links a transcript when the pad has a live link; a newcomer makes an account through the link and reads the pad once confirmed', async () => {
		const { slug } = (await owner.post(`/api/pads/${padId}/share`, {})).body;
		const stranger = `nobody-${Date.now()}@tests.test`;
		expect((await owner.post(`/api/pads/${padId}/invite`, { email: stranger })).status).toBe(200);
		const mail = await waitForMail(stranger);
		expect(mail.text).toContain(`${inject('baseUrl')}/t/${slug}`);
		const token = await mailedToken(stranger, 'invite');
		expect((await new Client().get(`/signup?invite=${token}`)).body).toContain('Mutual information at small gap');
		const joined = await signUpConfirmed(stranger, 'correct horse battery', 'Newcomer', token);
		expect((await joined.get('/api/auth/me')).body.user.role).toBe('reader');
		expect((await joined.get(`/api/pads/${padId}`)).status).toBe(200);
	});

	it('inviting twice makes two invitations with their own links and grants nothing yet', async () => {
		const to = `twice-${Date.now()}@tests.test`;
		await owner.post(`/api/pads/${padId}/invite`, { email: to });
		await owner.post(`/api/pads/${padId}/invite`, { email: to });
		expect(sql('SELECT * FROM invitations WHERE pad_id = ? AND email = ?', padId, to)).toHaveLength(2);
		expect(sql('SELECT * FROM pad_access WHERE pad_id = ? AND email = ?', padId, to)).toHaveLength(0);
		await waitForMail(to, () => receivedMail().filter((m) => m.to.includes(to)).length === 2);
		const links = receivedMail()
			.filter((m) => m.to.includes(to))
			.map((m) => /\/invite\/([A-Za-z0-9_-]+)/.exec(m.text)?.[1]);
		expect(new Set(links).size).toBe(2);
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

		// the admin outbox says a reset link went out, to whom and when, but not the link
		const outbox = (await admin.get('/api/admin/outbox')).body.messages.find(
			(m: { to: string; kind: string }) => m.to === email && m.kind === 'reset'
		);
		expect(outbox).toMatchObject({ status: 'sent', subject: 'Set a new Bulkpad password' });
		expect(outbox.text).not.toContain(token);

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

		expect(expectFailure(await new Client().post('/api/auth/reset/confirm', { token, password: 'yet another secret' }), 400)).toMatch(
			/invalid, used or expired/
		);
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
		await waitForMail(knownEmail, (m) => m.subject === 'Set a new Bulkpad password');
		expect(receivedMail().some((m) => m.to.includes(unknown))).toBe(false);
		expectFailure(await new Client().post('/api/auth/reset', { email: 'nope' }), 400);
	});

	it('refuses an expired token and the older link once a newer one is used', async () => {
		const user = await freshMember('reset-expiry');
		const email = await emailOf(user);
		await new Client().post('/api/auth/reset', { email });
		const isReset = (m: { subject: string }) => m.subject === 'Set a new Bulkpad password';
		const first = tokenOf((await waitForMail(email, isReset)).text);
		await new Client().post('/api/auth/reset', { email });
		const second = tokenOf((await waitForMail(email, (m) => isReset(m) && !m.text.includes(first))).text);
		expect(second).not.toBe(first);

		sql(
			'UPDATE password_resets SET expires_at = ? WHERE token_hash = ?',
			Date.now() - 1000,
			createHash('sha256').update(second).digest('hex')
		);
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
		const limited = await new Client().post('/api/auth/reset', { email });
		expect(Number(limited.headers.get('retry-after'))).toBeGreaterThan(0);
	});
});
