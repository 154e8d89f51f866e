// API keys: made once and never shown again, act as their user with that user's role, revocable.
import { beforeAll, describe, expect, it } from 'vitest';
import { Client, freshMember } from '../helpers/client';
import { expectFailure, freshWithRole, idOf, signInPatiently } from '../helpers/roles';

let admin: Client;
let member: Client;
let reader: Client;

beforeAll(async () => {
	admin = await signInPatiently('curator@sable.test');
	member = await freshMember('keyholder');
	reader = await freshWithRole(admin, 'reader-keys', 'reader');
});

async function makeKey(c: Client, label = 'sweep script') {
	const r = await c.post('/api/keys', { label });
	expect(r.status, JSON.stringify(r.body)).toBe(201);
	return r.body as { key: string; id: string; prefix: string };
}

describe('who may do what', () => {
	it('answers 401 without an account', async () => {
		expectFailure(await new Client().get('/api/keys'), 401);
		expectFailure(await new Client().post('/api/keys', { label: 'x' }), 401);
		expectFailure(await new Client().del('/api/keys/anything'), 401);
	});

	it('lets a reader list keys but not make one', async () => {
		const r = await reader.get('/api/keys');
		expect(r.status).toBe(200);
		expect(r.body.keys).toEqual([]);
		expectFailure(await reader.post('/api/keys', { label: 'x' }), 403);
	});

	it('wants a label', async () => {
		expectFailure(await member.post('/api/keys', { label: '   ' }), 400);
		expectFailure(await member.post('/api/keys', {}), 400);
		expectFailure(await member.post('/api/keys', { label: 'x'.repeat(61) }), 400);
	});
});

describe('a key', () => {
	it('is shown once and never again', async () => {
		const made = await makeKey(member, 'pad export script');
		expect(made.key.startsWith(made.prefix)).toBe(true);
		expect(made.key.length).toBeGreaterThan(made.prefix.length + 16);
		const r = await member.get('/api/keys');
		const listed = r.body.keys.find((k: { id: string }) => k.id === made.id);
		expect(listed).toMatchObject({ id: made.id, label: 'pad export script', prefix: made.prefix, lastUsedAt: null });
		expect(Object.keys(listed).sort()).toEqual(['createdAt', 'expiresAt', 'id', 'label', 'lastUsedAt', 'perMinute', 'prefix']);
		expect(JSON.stringify(r.body)).not.toContain(made.key);
	});

	it('authenticates as its user, records its use, and carries the user’s role', async () => {
		const who = await freshMember('scripted');
		const made = await makeKey(who);
		const script = new Client(undefined, made.key);
		const me = await script.get('/api/auth/me');
		expect(me.status).toBe(200);
		expect(me.body.user.id).toBe(await idOf(who));
		expect(me.body.via).toBe('key');
		const used = (await who.get('/api/keys')).body.keys.find((k: { id: string }) => k.id === made.id);
		expect(typeof used.lastUsedAt).toBe('string');

		// a member's key may propose; demoted to reader, the same key may not
		const name = `key-made-${Math.random().toString(36).slice(2, 7)}`;
		const body = { name, description: 'from a script', params: {}, body: ['thermo'] };
		expect((await script.post('/api/macros', body)).status).toBe(201);
		await admin.patch('/api/admin/users', { id: await idOf(who), role: 'reader' });
		expectFailure(await script.post('/api/macros', { ...body, name: name + 'x' }), 403);
		expect((await script.get('/api/macros')).status).toBe(200);
	});

	it('cannot make more keys', async () => {
		const script = new Client(undefined, (await makeKey(member)).key);
		expectFailure(await script.post('/api/keys', { label: 'offspring' }), 403);
	});

	it('stops working once revoked, and only its owner can revoke it', async () => {
		const made = await makeKey(member);
		const script = new Client(undefined, made.key);
		expect((await script.get('/api/auth/me')).status).toBe(200);

		const stranger = await freshMember('stranger');
		expectFailure(await stranger.del(`/api/keys/${made.id}`), 404);
		expect((await script.get('/api/auth/me')).status).toBe(200);

		expect((await member.del(`/api/keys/${made.id}`)).status).toBe(200);
		expectFailure(await script.get('/api/auth/me'), 401);
		expectFailure(await script.get('/api/macros'), 401);
		expectFailure(await member.del(`/api/keys/${made.id}`), 404);
		expect((await member.get('/api/keys')).body.keys.map((k: { id: string }) => k.id)).not.toContain(made.id);
	});

	it('is refused when made up', async () => {
		expectFailure(await new Client(undefined, 'bpk_' + 'A'.repeat(32)).get('/api/auth/me'), 401);
		expectFailure(await new Client(undefined, 'not-a-key').get('/api/keys'), 401);
	});
});

describe('the keys page', () => {
	it('lists labels and prefixes, never a key, and offers making one only to writers', async () => {
		const made = await makeKey(member, 'page check');
		const page = await member.get('/keys');
		expect(page.status).toBe(200);
		expect(page.body).toContain('page check');
		expect(page.body).toContain(made.prefix);
		expect(page.body).not.toContain(made.key);
		expect(page.body).toContain('Make a key');
		const asReader = await reader.get('/keys');
		expect(asReader.status).toBe(200);
		expect(asReader.body).not.toContain('Make a key');
	});
});
