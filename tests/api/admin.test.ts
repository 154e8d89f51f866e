// Admin user management: roles, who may change them, and the last admin who may never be demoted.
import { beforeAll, describe, expect, it } from 'vitest';
import { Client, freshMember } from '../helpers/client';
import { expectFailure, freshWithRole, idOf, signInPatiently } from '../helpers/roles';

let admin: Client;
let member: Client;
let reader: Client;

beforeAll(async () => {
	admin = await signInPatiently('curator@sable.test');
	member = await freshMember('plain');
	reader = await freshWithRole(admin, 'reader-admin', 'reader');
});

describe('who may do what', () => {
	it('answers 401 without an account and 403 to members and readers', async () => {
		const id = await idOf(member);
		expectFailure(await new Client().get('/api/admin/users'), 401);
		expectFailure(await new Client().patch('/api/admin/users', { id, role: 'admin' }), 401);
		for (const c of [member, reader]) {
			expectFailure(await c.get('/api/admin/users'), 403);
			expectFailure(await c.patch('/api/admin/users', { id, role: 'admin' }), 403);
		}
		// a member cannot promote themselves either
		expect((await admin.get('/api/admin/users')).body.users.find((u: { id: string }) => u.id === id).role).toBe('member');
	});

	it('lists the group with roles and nothing secret', async () => {
		const r = await admin.get('/api/admin/users');
		expect(r.status).toBe(200);
		const byEmail = Object.fromEntries(r.body.users.map((u: { email: string; role: string }) => [u.email, u.role]));
		expect(byEmail).toMatchObject({ 'curator@sable.test': 'admin', 'tomas@sable.test': 'member', 'referee@sable.test': 'reader' });
		expect(JSON.stringify(r.body)).not.toMatch(/password|hash|argon/i);
	});

	it('validates the body and the id', async () => {
		const id = await idOf(member);
		expectFailure(await admin.patch('/api/admin/users', { id, role: 'owner' }), 400);
		expectFailure(await admin.patch('/api/admin/users', { role: 'member' }), 400);
		expectFailure(await admin.patch('/api/admin/users', { id: 'no-such-user', role: 'member' }), 404);
	});
});

describe('changing roles', () => {
	it('takes effect on the next request', async () => {
		const c = await freshMember('promoted');
		const id = await idOf(c);
		expect((await c.post('/api/keys', { label: 'before' })).status).toBe(201);

		const down = await admin.patch('/api/admin/users', { id, role: 'reader' });
		expect(down.status).toBe(200);
		expect(down.body.user).toMatchObject({ id, role: 'reader' });
		expectFailure(await c.post('/api/keys', { label: 'as reader' }), 403);

		expect((await admin.patch('/api/admin/users', { id, role: 'admin' })).body.user.role).toBe('admin');
		expect((await c.get('/api/admin/users')).status).toBe(200);
		// with two admins, one may step down
		const stepDown = await c.patch('/api/admin/users', { id, role: 'member' });
		expect(stepDown.status, JSON.stringify(stepDown.body)).toBe(200);
		expectFailure(await c.get('/api/admin/users'), 403);
	});

	it('never demotes the last admin', async () => {
		// other test files may have left admins behind; only the curator is meant to remain
		const before = (await admin.get('/api/admin/users')).body.users as { id: string; email: string; role: string }[];
		for (const u of before.filter((u) => u.role === 'admin' && u.email.endsWith('@tests.test'))) {
			expect((await admin.patch('/api/admin/users', { id: u.id, role: 'member' })).status).toBe(200);
		}
		const admins = ((await admin.get('/api/admin/users')).body.users as typeof before).filter((u) => u.role === 'admin');
		expect(admins.map((u) => u.email)).toEqual(['curator@sable.test']);
		const self = admins[0]!.id;
		for (const role of ['member', 'reader']) {
			expect(expectFailure(await admin.patch('/api/admin/users', { id: self, role }), 409)).toMatch(/last admin/);
		}
		// keeping the role is not a demotion
		expect((await admin.patch('/api/admin/users', { id: self, role: 'admin' })).status).toBe(200);
		expect((await admin.get('/api/admin/users')).status).toBe(200);
	});
});

describe('the users page', () => {
	it('renders the group for an admin and refuses everyone else', async () => {
		const r = await admin.get('/admin/users');
		expect(r.status).toBe(200);
		expect(r.body).toContain('referee@sable.test');
		expect(r.body).toContain('at least one admin');
		expect((await member.get('/admin/users')).status).toBe(403);
		expect((await reader.get('/admin/users')).status).toBe(403);
		const anon = await new Client().get('/admin/users');
		expect(anon.status).toBe(303);
		expect(anon.headers.get('location')).toMatch(/^\/signin/);
	});
});
