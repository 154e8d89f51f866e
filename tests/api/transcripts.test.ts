// Share links, public transcripts, replay with drift marks, fork, and the replay rate limit.
import { request as httpRequest, Agent } from 'node:http';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, freshMember, inviteAndAccept } from '../helpers/client';
import { expectFailure, freshWithRole, signInPatiently } from '../helpers/roles';
import { padWithSteps, sql } from './support/pads';

const LINES = ['use brane d=3 zh=1', 'darea l=0.3 o=2', 'sweep darea l=0.1..0.5:4 o=1,exact', '#2 * 2', 'thermo'];
const anon = new Client();

let owner: Client;
let member: Client;
let reader: Client;
let padId: string;
let slug: string;

beforeAll(async () => {
	const admin = await signInPatiently('curator@sable.test');
	owner = await freshMember('tr-owner');
	member = await freshMember('tr-member');
	reader = await freshWithRole(admin, 'tr-reader', 'reader');
	padId = await padWithSteps(owner, 'Replay me', LINES);
	const shared = await owner.post(`/api/pads/${padId}/share`, {});
	expect(shared.status).toBe(201);
	slug = shared.body.slug;
});

describe('share links', () => {
	it('answers a slug and the transcript URL on this server', () => {
		expect(slug).toMatch(/^[A-Za-z0-9_-]{16}$/);
	});

	it('shows the transcript to anyone, in the shape of API.md', async () => {
		const r = await anon.get(`/api/t/${slug}`);
		expect(r.status).toBe(200);
		expect(Object.keys(r.body).sort()).toEqual(['bulk', 'frozenAt', 'note', 'ok', 'owner', 'steps', 'title']);
		expect(r.body).toMatchObject({
			ok: true,
			title: 'Replay me',
			owner: { name: 'tr-owner' },
			bulk: { name: 'brane', params: { d: 3, zh: 1 } }
		});
		const pad = (await owner.get(`/api/pads/${padId}`)).body.steps;
		expect(r.body.steps).toEqual(pad.map((s: any) => ({ n: s.n, input: s.input, status: s.status, results: s.results, error: s.error })));
		// the page renders for a visitor without an account too
		const page = await anon.get(`/t/${slug}`);
		expect(page.status).toBe(200);
		expect(page.body).toContain('Replay me');
		expect(page.body).toContain('darea l=0.3 o=2');
	});

	it('lists the links of a pad to its owner only', async () => {
		const r = await owner.get(`/api/pads/${padId}/share`);
		expect(r.status).toBe(200);
		expect(r.body.shares).toEqual([
			expect.objectContaining({ slug, url: `${inject('baseUrl')}/t/${slug}`, live: true, expiresAt: null, revokedAt: null })
		]);
		expectFailure(await member.get(`/api/pads/${padId}/share`), 404);
	});

	it('revokes: the transcript, its replay and its export answer 404 afterwards', async () => {
		const extra = (await owner.post(`/api/pads/${padId}/share`, {})).body.slug;
		expect((await anon.get(`/api/t/${extra}`)).status).toBe(200);
		expectFailure(await member.del(`/api/pads/${padId}/share/${extra}`), 404);
		expect((await owner.del(`/api/pads/${padId}/share/${extra}`)).status).toBe(200);
		expectFailure(await anon.get(`/api/t/${extra}`), 404);
		expectFailure(await anon.post(`/api/t/${extra}/replay`), 404);
		expectFailure(await anon.get(`/api/t/${extra}/export?format=md`), 404);
		expectFailure(await member.post(`/api/t/${extra}/fork`), 404);
		expect((await anon.get(`/t/${extra}`)).status).toBe(404);
		const listed = (await owner.get(`/api/pads/${padId}/share`)).body.shares.find((s: { slug: string }) => s.slug === extra);
		expect(listed.live).toBe(false);
		expect(listed.revokedAt).not.toBeNull();
		// the other link still works
		expect((await anon.get(`/api/t/${slug}`)).status).toBe(200);
		expectFailure(await owner.del(`/api/pads/${padId}/share/no-such-link`), 404);
	});

	it('expires: a link past its expiry is 404', async () => {
		const r = await owner.post(`/api/pads/${padId}/share`, { expiresInDays: 7 });
		expect(r.status).toBe(201);
		const days = (Date.parse(r.body.expiresAt) - Date.now()) / 86_400_000;
		expect(days).toBeGreaterThan(6.99);
		expect(days).toBeLessThanOrEqual(7);
		expect((await anon.get(`/api/t/${r.body.slug}`)).status).toBe(200);
		sql('UPDATE shares SET expires_at = ? WHERE slug = ?', Date.now() - 1000, r.body.slug);
		expectFailure(await anon.get(`/api/t/${r.body.slug}`), 404);
		expectFailure(await anon.post(`/api/t/${r.body.slug}/replay`), 404);
		expectFailure(await owner.post(`/api/pads/${padId}/share`, { expiresInDays: 0 }), 400);
		expectFailure(await owner.post(`/api/pads/${padId}/share`, { expiresInDays: 1.5 }), 400);
	});

	it('is for the owner to make', async () => {
		expectFailure(await anon.post(`/api/pads/${padId}/share`, {}), 401);
		expectFailure(await member.post(`/api/pads/${padId}/share`, {}), 404);
		expectFailure(await anon.get('/api/t/no-such-link'), 404);
	});

	it('exports the transcript publicly in each format', async () => {
		const md = await anon.get(`/api/t/${slug}/export?format=md`);
		expect(md.status).toBe(200);
		expect(md.headers.get('content-disposition')).toBe('attachment; filename="replay-me.md"');
		for (const line of LINES) expect(md.body).toContain(line);
		const json = await anon.get(`/api/t/${slug}/export?format=json`);
		expect(json.body.steps.map((s: { input: string }) => s.input)).toEqual(LINES);
	});
});

describe("the owner's sharing panel (/shared/[id] form actions)", () => {
	// a browser posting the form without JavaScript: the answer is the page, with the action's status
	const HTML = { accept: 'text/html' };
	const form = (fields: Record<string, string>) => {
		const f = new FormData();
		for (const [k, v] of Object.entries(fields)) f.set(k, v);
		return f;
	};

	it('makes a link with an expiry, lists it and revokes it', async () => {
		const made = await owner.request('POST', `/shared/${padId}?/share`, form({ days: '3' }), HTML);
		expect(made.status).toBe(200);
		const fresh = (await owner.get(`/api/pads/${padId}/share`)).body.shares[0];
		expect(fresh.live).toBe(true);
		expect((Date.parse(fresh.expiresAt) - Date.now()) / 86_400_000).toBeCloseTo(3, 2);
		expect((await owner.get(`/shared/${padId}`)).body).toContain(fresh.url);

		expect((await owner.request('POST', `/shared/${padId}?/revoke`, form({ slug: fresh.slug }), HTML)).status).toBe(200);
		expectFailure(await anon.get(`/api/t/${fresh.slug}`), 404);
		expect((await owner.request('POST', `/shared/${padId}?/share`, form({ days: '0' }), HTML)).status).toBe(400);
	});

	it('refuses the actions to anyone but the owner, whatever the page shows them', async () => {
		const before = (await owner.get(`/api/pads/${padId}/share`)).body.shares.length;
		expect((await reader.request('POST', `/shared/${padId}?/share`, form({ days: '' }), HTML)).status).toBe(403);
		expect((await member.request('POST', `/shared/${padId}?/share`, form({ days: '' }), HTML)).status).toBe(404);
		expect((await member.request('POST', `/shared/${padId}?/revoke`, form({ slug }), HTML)).status).toBe(404);
		expect((await owner.get(`/api/pads/${padId}/share`)).body.shares.length).toBe(before);
		expect((await anon.get(`/api/t/${slug}`)).status).toBe(200);
	});
});

describe('replay', () => {
	it('reproduces an untouched pad: no drift, deltas near zero', async () => {
		const r = await anon.post(`/api/t/${slug}/replay`);
		expect(r.status, JSON.stringify(r.body)).toBe(200);
		expect(r.body.drifted).toBe(0);
		expect(r.body.steps.map((s: { n: number }) => s.n)).toEqual([1, 2, 3, 4, 5]);
		for (const s of r.body.steps) {
			expect(s.drift).toBe(false);
			expect(s.delta).toBeLessThanOrEqual(1e-8);
			expect(Array.isArray(s.results)).toBe(true);
		}
	});

	it('reproduces the seeded shared transcript too', async () => {
		const r = await anon.post('/api/t/sable-boosted-first-law/replay');
		expect(r.status).toBe(200);
		const t = (await anon.get('/api/t/sable-boosted-first-law')).body;
		expect(r.body.steps).toHaveLength(t.steps.length);
		// a step the seed could not evaluate replays as the same error, which is no drift either
		expect(r.body.steps.filter((s: { drift: boolean }) => s.drift)).toEqual([]);
	});

	// a link shows its snapshot: tampering means changing the copy in the share's row
	const snapshotOf = () => sql<{ snapshot: string }>('SELECT snapshot FROM shares WHERE slug = ?', slug)[0].snapshot;
	const writeSnapshot = (text: string) => sql('UPDATE shares SET snapshot = ? WHERE slug = ?', text, slug);

	it('marks the step whose stored result was tampered with, with its relative delta, and stores nothing', async () => {
		const saved = snapshotOf();
		const snap = JSON.parse(saved);
		const original = snap.steps[1].results;
		const tampered = structuredClone(original);
		tampered[0].value *= 1.01;
		snap.steps[1].results = tampered;
		writeSnapshot(JSON.stringify(snap));
		try {
			const r = await anon.post(`/api/t/${slug}/replay`);
			expect(r.status).toBe(200);
			expect(r.body.drifted).toBe(1);
			const marks = Object.fromEntries(r.body.steps.map((s: { n: number; drift: boolean }) => [s.n, s.drift]));
			expect(marks).toEqual({ 1: false, 2: true, 3: false, 4: false, 5: false });
			const step2 = r.body.steps[1];
			// |1.01 x − x| / (1.01 x): the relative difference the drift check uses
			expect(step2.delta).toBeCloseTo(0.01 / 1.01, 12);
			expect(step2.results[0].value).toBeCloseTo(original[0].value, 14);
			// nothing stored: the tampered value is still what the transcript shows
			expect((await anon.get(`/api/t/${slug}`)).body.steps[1].results[0].value).toBe(tampered[0].value);
		} finally {
			writeSnapshot(saved);
		}
		expect((await anon.post(`/api/t/${slug}/replay`)).body.drifted).toBe(0);
	});

	it('marks a changed table cell and a recorded error that no longer happens', async () => {
		const saved = snapshotOf();
		const snap = JSON.parse(saved);
		snap.steps[2].results[0].rows[2][2] += 1e-3;
		Object.assign(snap.steps[4], { status: 'error', results: null, error: { message: 'recorded failure', start: 0, end: 6 } });
		writeSnapshot(JSON.stringify(snap));
		try {
			const r = await anon.post(`/api/t/${slug}/replay`);
			expect(r.body.drifted).toBe(2);
			expect(r.body.steps[2]).toMatchObject({ n: 3, drift: true });
			expect(r.body.steps[2].delta).toBeGreaterThan(1e-3);
			expect(r.body.steps[4]).toMatchObject({ n: 5, drift: true, delta: null });
		} finally {
			writeSnapshot(saved);
		}
	});

	it('replays an invited pad for the person invited (the /shared view), and for nobody else', async () => {
		expectFailure(await member.post(`/api/pads/${padId}/replay`), 404);
		await inviteAndAccept(owner, padId, member);
		const r = await member.post(`/api/pads/${padId}/replay`);
		expect(r.status).toBe(200);
		expect(r.body.drifted).toBe(0);
		expectFailure(await anon.post(`/api/pads/${padId}/replay`), 401);
	});
});

describe('fork', () => {
	it('copies the transcript into a new pad of the member, which continues where it stopped', async () => {
		const r = await member.post(`/api/t/${slug}/fork`);
		expect(r.status, JSON.stringify(r.body)).toBe(201);
		const id = r.body.pad.id;
		expect(id).not.toBe(padId);
		const fork = (await member.get(`/api/pads/${id}`)).body;
		const original = (await owner.get(`/api/pads/${padId}`)).body;
		expect(fork.pad).toMatchObject({
			title: 'Replay me (fork)',
			bulk: original.pad.bulk,
			units: original.pad.units,
			owner: { name: 'tr-member' }
		});
		const strip = (s: any) => ({ n: s.n, input: s.input, status: s.status, results: s.results, error: s.error });
		expect(fork.steps.map(strip)).toEqual(original.steps.map(strip));
		// the fork's state: the bulk carries on and `#2` refers to the copied step 2
		const next = await member.post('/api/eval', { input: '#2 * 3', pad: id });
		expect(next.status).toBe(200);
		expect(next.body.step.n).toBe(6);
		expect(next.body.bulk).toEqual(original.pad.bulk);
		expect(next.body.results[0].value).toBeCloseTo(3 * original.steps[1].results[0].value, 14);
		// the original did not change
		expect((await owner.get(`/api/pads/${padId}`)).body.steps).toHaveLength(5);
		expect((await member.get('/api/pads')).body.pads.map((p: { id: string }) => p.id)).toContain(id);
	});

	it('is refused to readers (403) and to visitors without an account (401)', async () => {
		expectFailure(await reader.post(`/api/t/${slug}/fork`), 403);
		expectFailure(await anon.post(`/api/t/${slug}/fork`), 401);
		expect((await reader.get('/api/pads')).body.pads).toEqual([]);
	});
});

/** One POST from a chosen loopback address, so this client has a rate-limit bucket of its own. */
function postFrom(localAddress: string, path: string, agent: Agent): Promise<number> {
	const url = new URL(inject('baseUrl') + path);
	return new Promise((resolve, reject) => {
		const headers = { 'content-type': 'application/json' };
		const req = httpRequest(
			{ host: url.hostname, port: url.port, path: url.pathname, method: 'POST', headers, localAddress, agent },
			(res) => {
				res.resume();
				res.on('end', () => resolve(res.statusCode ?? 0));
			}
		);
		req.on('error', reject);
		req.end();
	});
}

describe('replay rate limit', () => {
	it('answers 429 once an address is over its replays per minute, and other addresses carry on', async () => {
		// the test server allows BULKPAD_REPLAY_PER_MINUTE=1000; an unknown link is the cheapest request it counts
		const limit = 1000;
		const agent = new Agent({ keepAlive: true, maxSockets: 16 });
		const statuses: number[] = [];
		for (let i = 0; i < limit; i += 50) {
			statuses.push(
				...(await Promise.all(
					Array.from({ length: Math.min(50, limit - i) }, () => postFrom('127.0.0.77', '/api/t/no-such-link/replay', agent))
				))
			);
		}
		expect(statuses.every((s) => s === 404)).toBe(true);
		expect(await postFrom('127.0.0.77', '/api/t/no-such-link/replay', agent)).toBe(429);
		expect(await postFrom('127.0.0.77', `/api/t/${slug}/replay`, agent)).toBe(429);
		expect(await postFrom('127.0.0.78', `/api/t/${slug}/replay`, agent)).toBe(200);
		agent.destroy();
	}, 60_000);
});
