// Rate limits with the defaults a real deployment gets (the shared test server relaxes them), behind a trusted
// proxy: ADDRESS_HEADER=x-forwarded-for and XFF_DEPTH=1 tell adapter-node which header carries the client's
// address, so each client has its own bucket. Limited requests answer 429 with Retry-After.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Client, DEMO_PASSWORD } from '../helpers/client';
import { startPrivateServer, type PrivateServer } from './support/server';

let server: PrivateServer;

beforeAll(async () => {
	server = await startPrivateServer({ ADDRESS_HEADER: 'x-forwarded-for', XFF_DEPTH: '1' });
}, 120_000);

afterAll(async () => {
	await server?.stop();
});

/** One request from the client at `address` (as the trusted proxy reports it). */
function from(address: string, path: string, body: unknown, c = new Client(server.baseUrl)) {
	return c.request('POST', path, body, { 'x-forwarded-for': address });
}

function expectLimited(r: { status: number; body: any; headers: Headers }) {
	expect(r.status, JSON.stringify(r.body)).toBe(429);
	expect(r.body.ok).toBe(false);
	expect(r.body.error.message).toMatch(/try again in \d+ s/i);
	expect(Number(r.headers.get('retry-after'))).toBeGreaterThan(0);
}

describe('sign-up', () => {
	it('60 sign-ups in a burst from one address: the first 20 an hour are made, the rest get 429', async () => {
		const stamp = Date.now();
		const statuses: number[] = [];
		let last: Awaited<ReturnType<typeof from>> | undefined;
		for (let i = 0; i < 60; i++) {
			last = await from('203.0.113.10', '/api/auth/signup', {
				email: `burst-${stamp}-${i}@tests.test`,
				password: 'long enough pw',
				name: `Bot ${i}`
			});
			statuses.push(last.status);
		}
		expect(statuses.slice(0, 20).every((s) => s === 201)).toBe(true);
		expect(statuses.slice(20).every((s) => s === 429)).toBe(true);
		expectLimited(last!);
		// another client behind the same proxy is not in that bucket
		const other = await from('198.51.100.20', '/api/auth/signup', {
			email: `honest-${stamp}@tests.test`,
			password: 'long enough pw',
			name: 'Honest'
		});
		expect(other.status).toBe(201);
	});

	it('confirmation resends are limited per target address, whichever client asks', async () => {
		const email = `resend-target-${Date.now()}@tests.test`;
		const statuses: number[] = [];
		for (let i = 0; i < 6; i++) statuses.push((await from(`192.0.2.${30 + i}`, '/api/auth/confirm/resend', { email })).status);
		expect(statuses).toEqual([200, 200, 200, 200, 200, 429]);
	});
});

describe('sign-in', () => {
	it('ten wrong tries from one client do not lock the owner out; that client is slowed with 429', async () => {
		const attacker = '203.0.113.66';
		const email = 'ines@sable.test';
		const statuses: number[] = [];
		for (let i = 0; i < 10; i++) statuses.push((await from(attacker, '/api/auth/signin', { email, password: `guess-${i}` })).status);
		expect(statuses).toEqual(Array(10).fill(401));
		expectLimited(await from(attacker, '/api/auth/signin', { email, password: 'guess-10' }));
		// the owner, from their own address, signs in with the right password at once
		const owner = new Client(server.baseUrl);
		const ok = await from('198.51.100.7', '/api/auth/signin', { email, password: DEMO_PASSWORD }, owner);
		expect(ok.status, JSON.stringify(ok.body)).toBe(200);
		expect(ok.body.user.email).toBe(email);
		// and the attacker's client gets no answer about the password while it waits (not even for the right one)
		expectLimited(await from(attacker, '/api/auth/signin', { email, password: DEMO_PASSWORD }));
	});

	it('successful sign-ins are not counted: the owner signs in many times in a row', async () => {
		for (let i = 0; i < 15; i++) {
			const r = await from('198.51.100.8', '/api/auth/signin', { email: 'tomas@sable.test', password: DEMO_PASSWORD });
			expect(r.status).toBe(200);
		}
	});

	it('one password tried on many accounts from one client is slowed across accounts', async () => {
		const sprayer = '203.0.113.99';
		const statuses: number[] = [];
		for (let i = 0; i < 61; i++) {
			statuses.push((await from(sprayer, '/api/auth/signin', { email: `spray-${i}@tests.test`, password: 'Summer2026!' })).status);
		}
		expect(statuses.slice(0, 60).every((s) => s === 401)).toBe(true);
		expect(statuses[60]).toBe(429);
	});
});

describe('reset and invitations', () => {
	it('resets are limited per target e-mail across clients, and per client', async () => {
		const email = 'referee@sable.test';
		const statuses: number[] = [];
		for (let i = 0; i < 6; i++) statuses.push((await from(`192.0.2.${100 + i}`, '/api/auth/reset', { email })).status);
		expect(statuses).toEqual([200, 200, 200, 200, 200, 429]);
	});

	it('invitations are limited per invited address', async () => {
		const owner = new Client(server.baseUrl);
		expect((await from('198.51.100.9', '/api/auth/signin', { email: 'ines@sable.test', password: DEMO_PASSWORD }, owner)).status).toBe(200);
		const pad = (await owner.request('POST', '/api/pads', { title: 'limits' }, { 'x-forwarded-for': '198.51.100.9' })).body.pad.id;
		const to = `flooded-${Date.now()}@tests.test`;
		const statuses: number[] = [];
		let last;
		for (let i = 0; i < 6; i++) {
			last = await from('198.51.100.9', `/api/pads/${pad}/invite`, { email: to }, owner);
			statuses.push(last.status);
		}
		expect(statuses).toEqual([200, 200, 200, 200, 200, 429]);
		expectLimited(last!);
	});
});
