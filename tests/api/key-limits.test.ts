// Per-key limits: a key's own requests-a-minute budget (429 with Retry-After past it) and an optional expiry
// (401 that says the key expired). Both are set when the key is made and listed with it.
import { beforeAll, describe, expect, it } from 'vitest';
import { Client, freshMember } from '../helpers/client';
import { expectFailure } from '../helpers/roles';

let member: Client;

beforeAll(async () => {
	member = await freshMember('keylimits');
});

async function makeKey(body: Record<string, unknown>) {
	const r = await member.post('/api/keys', { label: 'limited script', ...body });
	expect(r.status, JSON.stringify(r.body)).toBe(201);
	return r.body as { key: string; id: string; perMinute: number; expiresAt: string | null };
}

const listed = async (id: string) => (await member.get('/api/keys')).body.keys.find((k: { id: string }) => k.id === id);

describe('making a key with limits', () => {
	it('gives a key the default budget and no expiry when none is asked', async () => {
		const made = await makeKey({});
		expect(made.perMinute).toBe(120);
		expect(made.expiresAt).toBeNull();
		expect(await listed(made.id)).toMatchObject({ perMinute: 120, expiresAt: null });
	});

	it('keeps a chosen budget and a date expiry (the key works through that day, UTC)', async () => {
		const day = new Date(Date.now() + 10 * 86_400_000).toISOString().slice(0, 10);
		const made = await makeKey({ perMinute: 30, expiresAt: day });
		expect(made.perMinute).toBe(30);
		expect(made.expiresAt).toBe(new Date(Date.parse(`${day}T00:00:00Z`) + 86_400_000).toISOString());
		expect(await listed(made.id)).toMatchObject({ perMinute: 30, expiresAt: made.expiresAt });
	});

	it('refuses a budget out of range, a malformed expiry and one in the past', async () => {
		expectFailure(await member.post('/api/keys', { label: 'x', perMinute: 0 }), 400);
		expectFailure(await member.post('/api/keys', { label: 'x', perMinute: 1.5 }), 400);
		expectFailure(await member.post('/api/keys', { label: 'x', perMinute: 100_000 }), 400);
		expectFailure(await member.post('/api/keys', { label: 'x', expiresAt: 'next tuesday' }), 400);
		const past = expectFailure(await member.post('/api/keys', { label: 'x', expiresAt: '2020-01-01' }), 400);
		expect(past).toMatch(/future/);
	});
});

describe('enforcing them', () => {
	it('answers 429 with Retry-After once a key is over its budget, and counts each key apart', async () => {
		const tight = await makeKey({ perMinute: 3 });
		const other = await makeKey({ perMinute: 3 });
		const script = new Client(undefined, tight.key);
		for (let i = 0; i < 3; i++) expect((await script.get('/api/auth/me')).status).toBe(200);
		const over = await script.get('/api/auth/me');
		expect(over.status).toBe(429);
		expect(over.body.ok).toBe(false);
		expect(over.body.error.message).toMatch(/3 requests a minute/);
		const wait = Number(over.headers.get('retry-after'));
		expect(wait).toBeGreaterThanOrEqual(1);
		expect(wait).toBeLessThanOrEqual(60);
		// the evaluation route is refused the same way, before it runs anything
		expect((await script.post('/api/eval', { input: 'darea l=0.3 o=2' })).status).toBe(429);
		// another key of the same user has its own budget, and the session is not limited by the key's
		expect((await new Client(undefined, other.key).get('/api/auth/me')).status).toBe(200);
		expect((await member.get('/api/auth/me')).status).toBe(200);
	});

	it('answers 401 saying the key expired, once its time has passed', async () => {
		const soon = new Date(Date.now() + 3000).toISOString();
		const made = await makeKey({ expiresAt: soon });
		const script = new Client(undefined, made.key);
		// the key may still be good now or already past its three seconds on a busy machine; it must end up refused
		await expect
			.poll(
				async () => {
					const r = await script.get('/api/auth/me');
					return r.status === 401 ? r.body.error.message : r.status;
				},
				{ interval: 500 }
			)
			.toMatch(/expired/);
		expect((await script.post('/api/eval', { input: 'darea l=0.3 o=2' })).status).toBe(401);
		// still listed, so its owner sees why the script stopped
		expect(await listed(made.id)).toMatchObject({ expiresAt: new Date(Date.parse(soon)).toISOString() });
	});

	it('tells an unknown key apart from an expired one (unknown stays the plain 401)', async () => {
		const r = await new Client(undefined, 'bpk_not-a-real-key-at-all-000000').get('/api/auth/me');
		expect(r.status).toBe(401);
		expect(r.body.error.message).not.toMatch(/expired/);
	});
});
