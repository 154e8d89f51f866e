// Web security against the built server: headers on every kind of answer, cross-site writes refused and
// changing nothing, 413 for oversized bodies, titles without control characters.
import { request as httpRequest } from 'node:http';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, freshMember } from '../helpers/client';
import { expectFailure } from '../helpers/roles';
import { padWithSteps } from './support/pads';

let victim: Client;
let padId: string;
let slug: string;
let key: string;

/** Another port of the same host: same site (the SameSite cookie goes along), other origin. */
const EVIL = 'http://127.0.0.1:1';

beforeAll(async () => {
	victim = await freshMember('websec-victim');
	padId = await padWithSteps(victim, 'Victim pad', ['darea l=0.3 o=2']);
	const share = await victim.post(`/api/pads/${padId}/share`, {});
	expect(share.status).toBe(201);
	slug = share.body.slug;
	const made = await victim.post('/api/keys', { label: 'websec script' });
	expect(made.status, JSON.stringify(made.body)).toBe(201);
	key = made.body.key;
});

describe('headers on every answer', () => {
	const expectBasics = (h: Headers, what: string) => {
		expect(h.get('x-content-type-options'), what).toBe('nosniff');
		expect(h.get('referrer-policy'), what).toBe('same-origin');
		expect(h.get('x-frame-options'), what).toBe('DENY');
		expect(h.get('content-security-policy'), what).toMatch(/frame-ancestors 'none'/);
		// the test server is plain http: HSTS there would be ignored at best (tests/unit/server/websec-headers.test.ts covers https)
		expect(h.get('strict-transport-security'), what).toBeNull();
	};

	it('pages carry kit.csp with a nonce that the inline theme script uses', async () => {
		const r = await new Client().get('/signin');
		expect(r.status).toBe(200);
		expectBasics(r.headers, 'page');
		const csp = r.headers.get('content-security-policy')!;
		for (const d of ["default-src 'self'", "object-src 'none'", "base-uri 'self'", "form-action 'self'", "frame-ancestors 'none'"])
			expect(csp).toContain(d);
		// no nonce or hash beside 'unsafe-inline': a browser would then ignore it, and KaTeX's inline styles with it
		expect(csp).toMatch(/style-src 'self' 'unsafe-inline'(;|$)/);
		const nonce = /script-src 'self' 'nonce-([^']+)'/.exec(csp)?.[1];
		expect(nonce).toBeTruthy();
		expect(csp).not.toMatch(/script-src[^;]*unsafe-(inline|eval)/);
		expect(r.body).toContain(`<script nonce="${nonce}">`);
		// a new nonce for every page
		const again = (await new Client().get('/signin')).headers.get('content-security-policy');
		expect(again).not.toBe(csp);
	});

	it('API answers with a session, with a key, anonymous, errors, downloads, redirects and refusals', async () => {
		const bearer = new Client(undefined, key);
		const cases: [string, Promise<{ status: number; headers: Headers }>, number][] = [
			['API with a session', victim.get('/api/pads'), 200],
			['API with a key', bearer.get('/api/pads'), 200],
			['a write with a key', bearer.post('/api/eval', { input: 'darea l=0.3 o=2' }), 200],
			['API anonymous', new Client().get('/api/pads'), 401],
			['unknown API route', victim.get('/api/no-such-route'), 404],
			['download', victim.get(`/api/pads/${padId}/export?format=md`), 200],
			['public transcript', new Client().get(`/api/t/${slug}`), 200],
			['redirect', new Client().get('/pads'), 303],
			['refused cross-site write', victim.request('POST', '/api/pads', undefined, { origin: EVIL }), 415],
			['health', new Client().get('/api/health'), 200]
		];
		for (const [what, pending, status] of cases) {
			const r = await pending;
			expect(r.status, what).toBe(status);
			expectBasics(r.headers, what);
			// nothing but pages may run or load anything
			if (!(r.headers.get('content-type') ?? '').startsWith('text/html'))
				expect(r.headers.get('content-security-policy'), what).toMatch(/default-src 'none'/);
		}
	});
});

describe('cross-site writes', () => {
	/** What the victim has: pads, the pad's steps and links, keys, and whether the session still works. */
	async function state() {
		const pads = (await victim.get('/api/pads')).body.pads.map((p: { id: string; title: string }) => `${p.id}:${p.title}`).sort();
		const pad = await victim.get(`/api/pads/${padId}`);
		const shares = (await victim.get(`/api/pads/${padId}/share`)).body.shares.map(
			(s: { slug: string; live: boolean }) => `${s.slug}:${s.live}`
		);
		const keys = (await victim.get('/api/keys')).body.keys.length;
		const me = (await victim.get('/api/auth/me')).status;
		return { pads, steps: pad.body.steps?.length, shares, keys, me };
	}

	// what a page on another port can send without a preflight: no body, text/plain, or a form
	const attacks = (): [string, string, string | undefined, string | undefined][] => [
		['POST', '/api/pads', undefined, undefined],
		['POST', '/api/pads', 'text/plain', '{"title":"made by a stranger"}'],
		['POST', `/api/t/${slug}/fork`, undefined, undefined],
		['POST', `/api/t/${slug}/fork`, 'text/plain', '{}'],
		['POST', '/api/auth/signout', undefined, undefined],
		['POST', '/api/auth/signout', 'text/plain', '{}'],
		['DELETE', `/api/pads/${padId}`, undefined, undefined],
		['DELETE', `/api/pads/${padId}/share/${slug}`, undefined, undefined],
		['POST', `/api/pads/${padId}/share`, undefined, undefined],
		['POST', `/api/pads/${padId}/share`, 'text/plain', '{"expiresInDays":1}'],
		['POST', `/api/pads/${padId}/replay`, undefined, undefined],
		['POST', `/api/t/${slug}/replay`, undefined, undefined],
		['PATCH', `/api/pads/${padId}`, 'text/plain', '{"title":"renamed by a stranger"}'],
		['POST', '/api/eval', 'text/plain', JSON.stringify({ input: 'darea l=0.2', pad: padId })],
		['POST', '/api/keys', 'text/plain', '{"label":"stolen"}'],
		['POST', '/api/pads', 'application/x-www-form-urlencoded', 'title=x'],
		['POST', '/api/pads/import', 'multipart/form-data; boundary=x', '--x--'],
		// the pages' form actions, as a form on another origin would post them
		['POST', '/pads', 'application/x-www-form-urlencoded', 'title=x'],
		['POST', '/signout', 'application/x-www-form-urlencoded', ''],
		['POST', `/pads/${padId}?/delete`, 'application/x-www-form-urlencoded', ''],
		['POST', `/pads/${padId}?/rename`, 'text/plain', 'title=x'],
		['POST', `/t/${slug}?/fork`, 'application/x-www-form-urlencoded', '']
	];

	it('refuses every one with 403 or 415 and changes nothing', async () => {
		const before = await state();
		expect(before.me).toBe(200);
		for (const [method, path, type, body] of attacks()) {
			const headers: Record<string, string> = { origin: EVIL };
			if (type) headers['content-type'] = type;
			const r = await fetch(inject('baseUrl') + path, { method, headers: { ...headers, cookie: victim.cookie }, body, redirect: 'manual' });
			expect([403, 415], `${method} ${path} (${type ?? 'no body'}) answered ${r.status}`).toContain(r.status);
		}
		expect(await state()).toEqual(before);
	});

	it('refuses a bare POST even from the same origin, with a message that says what to send', async () => {
		const r = await victim.request('POST', `/api/t/${slug}/fork`);
		expect(expectFailure(r, 415)).toMatch(/content-type: application\/json/);
	});

	it('still serves the same writes sent as JSON, from a page or a script with a key', async () => {
		const empty = await victim.request('POST', '/api/pads', undefined, { 'content-type': 'application/json' });
		expect(empty.status).toBe(201);
		const bearer = new Client(undefined, key);
		const forked = await bearer.post(`/api/t/${slug}/fork`, {});
		expect(forked.status).toBe(201);
		expect((await bearer.del(`/api/pads/${forked.body.pad.id}`)).status).toBe(200);
		expect((await victim.del(`/api/pads/${empty.body.pad.id}`)).status).toBe(200);
	});
});

describe('oversized bodies', () => {
	// the test server's BODY_SIZE_LIMIT is 1 065 536 bytes (tests/helpers/server-setup.ts)
	const big = 'x'.repeat(1_200_000);

	it('answers 413 with a clear message when the declared length is over the limit', async () => {
		const eval413 = await victim.post('/api/eval', { input: big });
		expect(expectFailure(eval413, 413)).toMatch(/too large.*1065536 bytes/);
		expect(expectFailure(await victim.patch(`/api/pads/${padId}`, { title: big }), 413)).toMatch(/too large/);
	});

	it('answers 413 when a body without a declared length streams past the limit', async () => {
		const url = new URL(inject('baseUrl') + '/api/eval');
		const answer = await new Promise<{ status: number; body: string }>((resolve, reject) => {
			let status = 0;
			let body = '';
			const req = httpRequest(
				{
					host: url.hostname,
					port: url.port,
					path: url.pathname,
					method: 'POST',
					headers: { 'content-type': 'application/json', 'transfer-encoding': 'chunked', cookie: victim.cookie }
				},
				(res) => {
					status = res.statusCode ?? 0;
					res.on('data', (b) => (body += b));
					res.on('end', () => resolve({ status, body }));
				}
			);
			// the server may close the connection once it has answered, while the rest of the body is still going out
			req.on('error', (e) => (status ? resolve({ status, body }) : reject(e)));
			req.write('{"input":"');
			for (let i = 0; i < 12; i++) req.write('x'.repeat(100_000));
			req.end('"}');
		});
		expect(answer.status).toBe(413);
		expect(JSON.parse(answer.body).error.message).toMatch(/too large/);
	});

	it('still answers 400 for a small body that is not JSON', async () => {
		const r = await victim.request('POST', '/api/eval', undefined, { 'content-type': 'application/json' });
		expect(expectFailure(r, 400)).toMatch(/must be JSON/);
	});
});

describe('titles', () => {
	it.each([
		['a NUL', 'pad\u0000'],
		['an escape sequence', '\u001b[31mred'],
		['DEL', 'pad\u007f'],
		['a C1 control', 'pad\u0085x'],
		['a direction override', 'report\u202etxt.exe'],
		['an isolate', 'a\u2066b'],
		['a line separator', 'a\u2028b']
	])('refuses %s through the API with a clear 400', async (_, title) => {
		expect(expectFailure(await victim.patch(`/api/pads/${padId}`, { title }), 400)).toMatch(/control characters or direction overrides/);
		expect(expectFailure(await victim.post('/api/pads', { title }), 400)).toMatch(/control characters/);
	});

	it('refuses an over-long title and keeps the old one', async () => {
		expect(expectFailure(await victim.patch(`/api/pads/${padId}`, { title: 'x'.repeat(201) }), 400)).toMatch(/under 200 characters/);
		expect((await victim.get(`/api/pads/${padId}`)).body.pad.title).toBe('Victim pad');
	});

	it('refuses the same through the rename form, and takes accents and symbols', async () => {
		const rename = (title: string) => {
			const f = new FormData();
			f.set('title', title);
			return victim.request('POST', `/pads/${padId}?/rename`, f, { accept: 'application/json', 'x-sveltekit-action': 'true' });
		};
		const bad = await rename('bell\u0007');
		expect(bad.body).toMatchObject({ type: 'failure', status: 400 });
		expect(JSON.stringify(bad.body)).toMatch(/control characters/);
		expect((await rename('x'.repeat(201))).body).toMatchObject({ type: 'failure', status: 400 });
		expect((await victim.get(`/api/pads/${padId}`)).body.pad.title).toBe('Victim pad');
		expect((await rename('Inès — ΔA ≤ 0 ✓')).body).toMatchObject({ type: 'success' });
		expect((await victim.get(`/api/pads/${padId}`)).body.pad.title).toBe('Inès — ΔA ≤ 0 ✓');
		expect((await victim.patch(`/api/pads/${padId}`, { title: 'Victim pad' })).status).toBe(200);
	});
});
