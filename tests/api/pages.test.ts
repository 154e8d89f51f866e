// Every page of the app, found by walking src/routes, requested as a visitor without a session and as a
// member who does not own the resource: no 500 anywhere (page or __data.json), and where a route takes an id,
// an existing id and a missing one answer alike — no existence oracle.
import { readdirSync } from 'node:fs';
import { join, relative, sep } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { Client, signedIn, type Reply } from '../helpers/client';
import { sql } from './support/pads';

const ROUTES = join(process.cwd(), 'src/routes');
const PAGE_FILES = new Set(['+page.svelte', '+page.server.ts', '+page.ts']);

/** Route patterns like `/pads/[id]`: each folder with a page (layout groups dropped, as the router does). */
function pageRoutes(dir = ROUTES): string[] {
	const entries = readdirSync(dir, { withFileTypes: true });
	const here = entries.some((e) => e.isFile() && PAGE_FILES.has(e.name)) ? [routeOf(dir)] : [];
	const below = entries.filter((e) => e.isDirectory() && e.name !== 'api').flatMap((e) => pageRoutes(join(dir, e.name)));
	return [...here, ...below];
}
function routeOf(dir: string): string {
	const parts = relative(ROUTES, dir)
		.split(sep)
		.filter((p) => p && !/^\(.*\)$/.test(p));
	return '/' + parts.join('/');
}

/**
 * What each route parameter is filled with. `hidden` params name something a visitor must not learn exists:
 * the test asks for an existing value and a missing one and wants the same answer. `public` params are the
 * secret themselves (a share link's slug, an e-mailed token): knowing one is the permission, so an existing
 * one may show more than a missing one — only "no 500" is asked, and the missing one must be a 404 or alike.
 * A new parameter name fails the test until it is added here.
 */
type Param = { kind: 'hidden' | 'public'; existing: () => string; missing: string };
let sharedPadId = '';
const PARAMS: Record<string, Param> = {
	id: { kind: 'hidden', existing: () => sharedPadId, missing: 'no-such-pad-0000000000' },
	slug: { kind: 'public', existing: () => 'sable-boosted-first-law', missing: 'no-such-transcript' },
	token: { kind: 'public', existing: () => 'not-a-live-token-aaaaaaaaaaaaaaaa', missing: 'not-a-live-token-bbbbbbbbbbbbbbbb' }
};

function paramsOf(route: string): string[] {
	return [...route.matchAll(/\[(?:\.\.\.)?([^\]=]+)(?:=[^\]]+)?\]/g)].map((m) => m[1]!);
}
function fill(route: string, pick: (p: Param) => string): string {
	return route.replace(/\[(?:\.\.\.)?([^\]=]+)(?:=[^\]]+)?\]/g, (_, name: string) => pick(PARAMS[name]!));
}
const dataUrl = (path: string) => (path === '/' ? '/__data.json' : `${path}/__data.json`);

/**
 * The __data.json requests a browser makes: all loads, and — on a client-side navigation between two pages of
 * one layout — only the page's own load, the layouts' nodes skipped (`x-sveltekit-invalidated` is one flag per
 * node, root layout first). Then a page load runs without its layout's redirect in front of it.
 */
const PAGE_ONLY = [1, 2, 3, 4].map((depth) => `?x-sveltekit-invalidated=${'0'.repeat(depth)}1`);
const dataUrls = (path: string) => [dataUrl(path), ...PAGE_ONLY.map((q) => dataUrl(path) + q)];

/**
 * No server error: not a 5xx, and no error node in a __data.json answer that is not an expected 4xx (an
 * unexpected error is a node with no status at all, whatever message handleError gave it).
 */
function expectNoServerError(r: Reply, what: string) {
	expect(r.status, `${what} → ${r.status} ${JSON.stringify(r.body).slice(0, 300)}`).toBeLessThan(500);
	const nodes: { type?: string; status?: number }[] = typeof r.body === 'object' && Array.isArray(r.body?.nodes) ? r.body.nodes : [];
	for (const node of nodes.filter((n) => n?.type === 'error')) {
		expect(node.status, `${what}: ${JSON.stringify(node)}`).toBeTypeOf('number');
		expect(node.status, `${what}: ${JSON.stringify(node)}`).toBeLessThan(500);
	}
}

/** The parts of an answer a visitor can compare, with the requested id itself written as a placeholder. */
function shapeOf(r: Reply, value: string, html: boolean) {
	const hide = (s: string | null) => (s ?? '').split(value).join(':param').split(encodeURIComponent(value)).join(':param');
	// HTML may carry per-request values (a CSP nonce); its status and redirect are what a visitor compares
	return { status: r.status, location: hide(r.headers.get('location')), body: html ? undefined : hide(JSON.stringify(r.body)) };
}

const routes = pageRoutes();
let anonymous: Client;
let otherMember: Client;

beforeAll(async () => {
	const [row] = sql<{ pad_id: string }>('SELECT pad_id FROM shares WHERE slug = ?', 'sable-boosted-first-law');
	sharedPadId = row!.pad_id; // Inès's pad, shared by link and with the referee, never with Tomás
	anonymous = new Client();
	otherMember = await signedIn('tomas@sable.test');
});

describe('the page routes', () => {
	it('are found by walking src/routes, and every parameter has a value to try', () => {
		expect(routes).toEqual(
			expect.arrayContaining(['/', '/signin', '/pads/[id]', '/shared/[id]', '/t/[slug]', '/reset/[token]', '/library'])
		);
		const unknown = routes.flatMap(paramsOf).filter((p) => !(p in PARAMS));
		expect(unknown, `add these route parameters to PARAMS in ${relative(process.cwd(), import.meta.filename)}`).toEqual([]);
	});
});

describe.each([
	['a visitor without a session', () => anonymous],
	['a member who owns none of it', () => otherMember]
])('as %s', (_who, client) => {
	it.each(routes)('%s never answers 500, as a page or as __data.json', async (route) => {
		for (const pick of [(p: Param) => p.existing(), (p: Param) => p.missing]) {
			const path = fill(route, pick);
			expectNoServerError(await client().get(path), `GET ${path}`);
			for (const data of dataUrls(path)) expectNoServerError(await client().get(data), `GET ${data}`);
		}
	});

	it.each(routes.filter((r) => paramsOf(r).some((p) => PARAMS[p]?.kind === 'hidden')))(
		'%s answers an existing id and a missing one alike',
		async (route) => {
			const existing = fill(route, (p) => p.existing());
			const missing = fill(route, (p) => p.missing);
			const value = (path: string) => path.split('/').find((seg, i) => seg !== route.split('/')[i])!;
			const data = PAGE_ONLY.map((q) => [(p: string) => dataUrl(p) + q, false] as const);
			for (const [url, html] of [[(p: string) => p, true] as const, [dataUrl, false] as const, ...data]) {
				const a = await client().get(url(existing));
				const b = await client().get(url(missing));
				expect(shapeOf(a, value(existing), html), `${url(existing)} vs ${url(missing)}`).toEqual(shapeOf(b, value(missing), html));
				expect([303, 404, 200], `${url(existing)}`).toContain(a.status);
			}
		}
	);

	it.each(routes.filter((r) => paramsOf(r).some((p) => PARAMS[p]?.kind === 'public')))(
		'%s answers a missing value as missing',
		async (route) => {
			const missing = fill(route, (p) => p.missing);
			const page = await client().get(missing);
			expect([200, 303, 404], `${missing} → ${page.status}`).toContain(page.status);
		}
	);
});

describe('what a visitor without a session sees of a pad', () => {
	it('is the sign-in redirect, for the page and for its data, whether or not the pad exists', async () => {
		for (const id of [sharedPadId, PARAMS.id!.missing]) {
			const page = await anonymous.get(`/pads/${id}`);
			expect(page.status).toBe(303);
			expect(page.headers.get('location')).toBe(`/signin?next=${encodeURIComponent(`/pads/${id}`)}`);
			// all loads, and the pad page's own load alone (root layout, (app) layout, page: flags 0 0 1)
			for (const url of [`/pads/${id}/__data.json`, `/pads/${id}/__data.json?x-sveltekit-invalidated=001`]) {
				const data = await anonymous.get(url);
				expect(data.status).toBe(200);
				expect(data.body, url).toEqual({ type: 'redirect', location: `/signin?next=${encodeURIComponent(`/pads/${id}`)}` });
			}
		}
	});

	it('is a 404 for a member it is not shared with, exactly as for a pad that does not exist', async () => {
		const pages: string[] = [];
		for (const id of [sharedPadId, PARAMS.id!.missing]) {
			const pad = await otherMember.get(`/pads/${id}`);
			expect(pad.status).toBe(404);
			expect((await otherMember.get(`/shared/${id}`)).status).toBe(404);
			// the app's own error page, with the ways on, and the same words whether the pad exists or not
			expect(pad.body).toContain('Nothing here');
			expect(pad.body).toContain('href="/pads"');
			pages.push(
				String(pad.body)
					.replace(/\/pads\/[A-Za-z0-9_-]+/g, '/pads/ID')
					.replace(/nonce="[^"]*"/g, 'nonce')
			);
		}
		expect(pages[0]).toBe(pages[1]);
	});
});
