// Deny by default: every route under src/routes (each +server.ts method, each page, each form action) must
// have a row in TABLE saying what each role gets, and the built server must answer exactly that. A new route
// without a row fails the first test; a row whose route is gone fails it too.
//
// Adding a route is one line in TABLE (and, only if the default request does not fit, one line in REQUESTS).
// Columns, in order: anonymous, reader, member (owner of the pad, key, dataset… in the path), another member,
// admin (not the owner). A cell is an exact status (401) or a class (2xx, 3xx); `a|b` accepts either (a rate
// limit shared with other test files may already be spent). A page form action that refuses a visitor who is not
// signed in answers the sign-in redirect (3xx); one that refuses a reader may answer the page's own 404.
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { freshMember } from '../helpers/client';
import { freshWithRole, idOf, signInPatiently } from '../helpers/roles';
import { padWithSteps } from './support/pads';

// prettier-ignore
const TABLE: Record<string, string> = {
	//                                             anon reader member other admin
	'GET /api/admin/outbox':                         '401 403 403 403 2xx',
	'GET /api/admin/users':                          '401 403 403 403 2xx',
	'PATCH /api/admin/users':                        '401 403 403 403 2xx',
	'GET /api/admin/settings':                       '401 403 403 403 2xx',
	'PATCH /api/admin/settings':                     '401 403 403 403 2xx',
	'POST /api/auth/confirm':                         '400 400 400 400 400',
	'POST /api/auth/confirm/resend':                  '2xx|400|429 2xx|400|429 2xx|400|429 2xx|400|429 2xx|400|429',
	'POST /api/auth/password':                        '401 400 400 400 400',
	'GET /api/auth/sessions':                         '401 2xx 2xx 2xx 2xx',
	'DELETE /api/auth/sessions':                      '401 2xx 2xx 2xx 2xx',
	'DELETE /api/auth/sessions/[id]':                 '401 404 404 404 404',
	'POST /api/invitations/accept':                   '401 404 404 404 404',
	'GET /api/pads/[id]/invitations':                 '401 403 2xx 404 404',
	'DELETE /api/pads/[id]/invitations/[invitation]': '401 403|404 404 404 404',
	'GET /api/auth/me':                              '401 2xx 2xx 2xx 2xx',
	'POST /api/auth/reset':                          '2xx|429 2xx|429 2xx|429 2xx|429 2xx|429',
	'POST /api/auth/reset/confirm':                  '400 400 400 400 400',
	'POST /api/auth/signin':                         '401 401 401 401 401',
	'POST /api/auth/signout':                        '2xx 2xx 2xx 2xx 2xx',
	'POST /api/auth/signup':                         '400 400 400 400 400',
	'GET /api/datasets':                             '401 2xx 2xx 2xx 2xx',
	'POST /api/datasets':                            '401 403 2xx 2xx 2xx',
	'GET /api/datasets/[id]':                        '401 404 2xx 404 404',
	'DELETE /api/datasets/[id]':                     '401 403 2xx 404 404',
	'POST /api/eval':                                '401 403 2xx 2xx 2xx',
	'GET /api/health':                               '2xx 2xx 2xx 2xx 2xx',
	'GET /api/openapi.json':                         '2xx 2xx 2xx 2xx 2xx',
	'GET /api/keys':                                 '401 2xx 2xx 2xx 2xx',
	'POST /api/keys':                                '401 403 2xx 2xx 2xx',
	'DELETE /api/keys/[id]':                         '401 404 2xx 404 404',
	'GET /api/macros':                               '401 2xx 2xx 2xx 2xx',
	'POST /api/macros':                              '401 403 2xx 2xx 2xx',
	'GET /api/macros/[id]':                          '401 404 2xx 404 2xx',
	'PATCH /api/macros/[id]':                        '401 403 2xx 404 2xx',
	'POST /api/macros/[id]/trial':                   '401 403 2xx 404 2xx',
	'GET /api/pads':                                 '401 2xx 2xx 2xx 2xx',
	'POST /api/pads':                                '401 403 2xx 2xx 2xx',
	'GET /api/pads/[id]':                            '401 404 2xx 404 404',
	'PATCH /api/pads/[id]':                          '401 403 2xx 404 404',
	'DELETE /api/pads/[id]':                         '401 403 2xx 404 404',
	'GET /api/pads/[id]/export':                     '401 404 2xx 404 404',
	'POST /api/pads/[id]/invite':                    '401 403 2xx 404 404',
	'POST /api/pads/[id]/replay':                    '401 404 2xx 404 404',
	'GET /api/pads/[id]/share':                      '401 403 2xx 404 404',
	'POST /api/pads/[id]/share':                     '401 403 2xx 404 404',
	'DELETE /api/pads/[id]/share/[slug]':            '401 403 2xx 404 404',
	'GET /api/pads/[id]/share/[slug]/comments':      '401 403 2xx 404 404',
	'POST /api/pads/import':                         '401 403 2xx 2xx 2xx',
	'GET /api/pads/[id]/steps/[n]':                  '401 404 2xx 404 404',
	'PATCH /api/pads/[id]/steps/[n]':                '401 403 2xx 404 404',
	'POST /api/pads/[id]/steps/[n]':                 '401 403 2xx 404 404',
	'PATCH /api/pads/[id]/attempts/[attempt]':       '401 403 404 404 404',
	'GET /api/t/[slug]':                             '2xx 2xx 2xx 2xx 2xx',
	'GET /api/t/[slug]/export':                      '2xx 2xx 2xx 2xx 2xx',
	'POST /api/t/[slug]/fork':                       '401 403 2xx 2xx 2xx',
	'POST /api/t/[slug]/replay':                     '2xx 2xx 2xx 2xx 2xx',
	// whoever holds a live link and is signed in reads and writes its comments (readers too)
	'GET /api/t/[slug]/comments':                    '401 2xx 2xx 2xx 2xx',
	'POST /api/t/[slug]/comments':                   '401 2xx 2xx 2xx 2xx',
	// pages (GET) and their form actions (POST), as a browser without JavaScript sends them
	'GET /':                                         '3xx 3xx 3xx 3xx 3xx',
	'GET /admin':                                    '3xx 403 403 403 3xx',
	'GET /admin/outbox':                             '3xx 403 403 403 2xx',
	'GET /admin/users':                              '3xx 403 403 403 2xx',
	'GET /datasets':                                 '3xx 2xx 2xx 2xx 2xx',
	'GET /keys':                                     '3xx 2xx 2xx 2xx 2xx',
	'GET /library':                                  '3xx 2xx 2xx 2xx 2xx',
	'GET /pads':                                     '3xx 3xx 3xx 3xx 3xx',
	'POST /pads':                                    '3xx 403 3xx 3xx 3xx',
	'GET /pads/[id]':                                '3xx 404 2xx 404 404',
	'POST /pads/[id]?/rename':                       '3xx 404 2xx 404 404',
	'POST /pads/[id]?/delete':                       '3xx 404 3xx 404 404',
	'GET /shared':                                   '3xx 2xx 2xx 2xx 2xx',
	'GET /shared/[id]':                              '3xx 404 2xx 404 404',
	'POST /shared/[id]?/share':                      '3xx 403 2xx 404 404',
	'POST /shared/[id]?/revoke':                     '3xx 403 2xx 404 404',
	'POST /shared/[id]?/invite':                     '3xx 403 2xx 404 404',
	'GET /confirm':                                  '2xx 2xx 2xx 2xx 2xx',
	'POST /confirm':                                 '2xx|400|429 2xx|400|429 2xx|400|429 2xx|400|429 2xx|400|429',
	'GET /confirm/[token]':                          '2xx 2xx 2xx 2xx 2xx',
	'POST /confirm/[token]':                         '400 400 400 400 400',
	'GET /invite/[token]':                           '2xx 2xx 2xx 2xx 2xx',
	'POST /invite/[token]':                          '3xx 400|404 400|404 400|404 400|404',
	'POST /shared/[id]?/uninvite':                   '3xx 403 404 404 404',
	'GET /reset':                                    '2xx 2xx 2xx 2xx 2xx',
	'POST /reset':                                   '2xx|429 2xx|429 2xx|429 2xx|429 2xx|429',
	'GET /reset/[token]':                            '2xx 2xx 2xx 2xx 2xx',
	'POST /reset/[token]':                           '400 400 400 400 400',
	'GET /signin':                                   '2xx 3xx 3xx 3xx 3xx',
	'POST /signin':                                  '400 3xx 3xx 3xx 3xx',
	'GET /signup':                                   '2xx 3xx 3xx 3xx 3xx',
	'POST /signup':                                  '400 3xx 3xx 3xx 3xx',
	'GET /signout':                                  '3xx 3xx 3xx 3xx 3xx',
	'POST /signout':                                 '3xx 3xx 3xx 3xx 3xx',
	'GET /t/[slug]':                                 '2xx 2xx 2xx 2xx 2xx',
	'GET /help/api':                                 '2xx 2xx 2xx 2xx 2xx',
	'POST /t/[slug]?/fork':                          '3xx 403 3xx 3xx 3xx'
};

const ROLES = ['anon', 'reader', 'member', 'other', 'admin'] as const;
type Role = (typeof ROLES)[number];

interface Fixtures {
	padId: string;
	padToDelete: string;
	padToDeleteByForm: string;
	slug: string;
	slugToRevoke: string;
	slugToRevokeByForm: string;
	keyId: string;
	datasetId: string;
	macroId: string;
	otherId: string;
}
interface Req {
	path?: string;
	json?: unknown;
	form?: Record<string, string>;
	multipart?: () => FormData;
}

const csv = () => {
	const f = new FormData();
	f.append('file', new File(['l,darea\n0.1,0.0123\n0.2,0.0456\n'], `${unique('rt')}.csv`, { type: 'text/csv' }));
	return f;
};
const unique = (stem: string) => `${stem}-${Math.random().toString(36).slice(2, 8)}`;

/** Requests that differ from the default: params filled from the route's own kind, `{}` as JSON for writes, an empty form for actions. */
// prettier-ignore
const REQUESTS: Record<string, (f: Fixtures) => Req> = {
	'PATCH /api/admin/settings': () => ({ json: { signup: { mode: 'open', domains: [] } } }),
	'POST /api/auth/confirm': () => ({ json: { token: 'not-a-confirmation-token' } }),
	'POST /api/auth/password': () => ({ json: { current: 'wrong password', password: 'x' } }),
	'POST /api/invitations/accept': () => ({ json: { token: 'not-an-invitation-token' } }),
	'POST /shared/[id]?/uninvite': () => ({ form: { invitation: 'no-such-invitation' } }),
	'PATCH /api/admin/users': (f) => ({ json: { id: f.otherId, role: 'member' } }),
	'POST /api/auth/reset': () => ({ json: { email: `${unique('nobody')}@tests.test` } }),
	'POST /api/auth/reset/confirm': () => ({ json: { token: 'not-a-token', password: 'correct horse battery staple' } }),
	'POST /api/auth/signin': () => ({ json: { email: 'nobody-routes-table@tests.test', password: 'wrong password' } }),
	'POST /api/auth/signup': () => ({ json: { email: 'not an address', password: 'x', name: '' } }),
	'POST /api/datasets': () => ({ multipart: csv }),
	'DELETE /api/datasets/[id]': (f) => ({ path: `/api/datasets/${f.datasetId}` }),
	'POST /api/eval': () => ({ json: { input: 'darea l=0.3 o=2' } }),
	'POST /api/t/[slug]/comments': () => ({ json: { step: 1, body: 'A comment from the routes table.' } }),
	'POST /api/keys': () => ({ json: { label: 'routes table' } }),
	'POST /api/macros': () => ({ json: { name: unique('rt'), description: 'ΔA of a strip.', params: { l: '0.4' }, body: ['darea l={l}'] } }),
	'PATCH /api/macros/[id]': () => ({ json: { action: 'edit', description: 'edited by the routes table' } }),
	'PATCH /api/pads/[id]': () => ({ json: { title: 'Routes table pad' } }),
	'DELETE /api/pads/[id]': (f) => ({ path: `/api/pads/${f.padToDelete}` }),
	'POST /api/pads/[id]/invite': () => ({ json: { email: 'invitee-routes-table@tests.test' } }),
	'DELETE /api/pads/[id]/share/[slug]': (f) => ({ path: `/api/pads/${f.padId}/share/${f.slugToRevoke}` }),
	'GET /api/pads/[id]/steps/[n]': (f) => ({ path: `/api/pads/${f.padId}/steps/1` }),
	'PATCH /api/pads/[id]/steps/[n]': (f) => ({ path: `/api/pads/${f.padId}/steps/1`, json: { hidden: false } }),
	'POST /api/pads/[id]/steps/[n]': (f) => ({ path: `/api/pads/${f.padId}/steps/1`, json: { input: 'darea l=0.3 o=2' } }),
	'PATCH /api/pads/[id]/attempts/[attempt]': (f) => ({ path: `/api/pads/${f.padId}/attempts/no-such-attempt`, json: { dismissed: true } }),
	'POST /api/pads/import': () => ({ json: { format: 'bulkpad-pad', version: 1, title: 'Imported', bulk: { name: 'brane', params: { d: 4, zh: 1 } }, units: { system: 'geo', G: 1 }, steps: [] } }),
	'POST /pads/[id]?/rename': () => ({ form: { title: 'Routes table pad' } }),
	'POST /pads/[id]?/delete': (f) => ({ path: `/pads/${f.padToDeleteByForm}?/delete`, form: {} }),
	'POST /shared/[id]?/share': () => ({ form: { days: '3' } }),
	'POST /shared/[id]?/revoke': (f) => ({ form: { slug: f.slugToRevokeByForm } }),
	'POST /shared/[id]?/invite': () => ({ form: { email: 'invitee-routes-table@tests.test' } }),
	'POST /reset': () => ({ form: { email: `${unique('nobody')}@tests.test` } }),
	'POST /reset/[token]': () => ({ form: { password: 'x' } }),
	'POST /signin': () => ({ form: { email: '', password: '' } }),
	'POST /signup': () => ({ form: { email: 'not an address', password: 'x', name: '' } })
};

/** Every route file's methods, pages and form actions, keyed like TABLE. */
function discoverRoutes(root = 'src/routes'): string[] {
	const found: string[] = [];
	const walk = (dir: string) => {
		const entries = readdirSync(dir, { withFileTypes: true });
		const id =
			'/' +
			relative(root, dir)
				.split('/')
				.filter((s) => s && !/^\(.*\)$/.test(s))
				.join('/');
		for (const e of entries) {
			if (e.isDirectory()) walk(join(dir, e.name));
			else if (e.name === '+server.ts' || e.name === '+server.js') {
				const src = readFileSync(join(dir, e.name), 'utf8');
				for (const m of src.matchAll(/export\s+(?:const|(?:async\s+)?function)\s+(GET|POST|PUT|PATCH|DELETE|HEAD|OPTIONS|fallback)\b/g))
					found.push(`${m[1]} ${id}`);
			}
		}
		const names = entries.map((e) => e.name);
		if (names.some((n) => /^\+page\.(svelte|server\.ts|ts)$/.test(n))) found.push(`GET ${id}`);
		if (names.includes('+page.server.ts')) {
			const src = readFileSync(join(dir, '+page.server.ts'), 'utf8');
			const actions = /export const actions[^{]*\{([\s\S]*)\};?\s*$/.exec(src)?.[1] ?? '';
			for (const m of actions.matchAll(/^\t(\w+)\s*:/gm)) found.push(m[1] === 'default' ? `POST ${id}` : `POST ${id}?/${m[1]}`);
		}
	};
	walk(root);
	return found.sort();
}

/** The concrete request of a row: path params from the fixtures by the route's kind. */
function requestOf(key: string, f: Fixtures): { method: string; path: string; req: Req } {
	const [method, route] = key.split(' ');
	const req = REQUESTS[key]?.(f) ?? {};
	const kind = route.split('/').filter(Boolean)[route.startsWith('/api/') ? 1 : 0];
	const ids: Record<string, string> = { pads: f.padId, shared: f.padId, keys: f.keyId, datasets: f.datasetId, macros: f.macroId };
	const path =
		req.path ??
		route
			.replace('[id]', ids[kind] ?? 'unknown')
			.replace('[slug]', f.slug)
			.replace('[token]', 'not-a-token');
	const isAction = !route.startsWith('/api/') && method === 'POST';
	return { method, path, req: isAction && !req.form ? { ...req, form: {} } : req };
}

/** One request as the role, through fetch directly so an answer's cookie never changes who the role is. */
async function send(base: string, cookie: string, method: string, path: string, req: Req): Promise<number> {
	const headers: Record<string, string> = { origin: base, accept: 'text/html,application/json' };
	if (cookie) headers.cookie = cookie;
	let body: BodyInit | undefined;
	if (req.multipart) body = req.multipart();
	else if (req.form) {
		body = new URLSearchParams(req.form).toString();
		headers['content-type'] = 'application/x-www-form-urlencoded';
	} else if (method !== 'GET') {
		body = JSON.stringify(req.json ?? {});
		headers['content-type'] = 'application/json';
	}
	const r = await fetch(base + path, { method, headers, body, redirect: 'manual' });
	await r.arrayBuffer();
	return r.status;
}

const matches = (status: number, want: string): boolean =>
	want.split('|').some((w) => (w.endsWith('xx') ? Math.floor(status / 100) === Number(w[0]) : status === Number(w)));

/** Reads, then writes, then deletes, then the rows that end a session — so no row takes away what a later one needs. */
function phase(key: string): number {
	if (/signout/.test(key)) return 3;
	if (key.startsWith('DELETE') || key.endsWith('?/delete')) return 2;
	return key.startsWith('GET') ? 0 : 1;
}

describe('deny by default', () => {
	it('has a row for every route, and no row for a route that is gone', () => {
		const routes = discoverRoutes();
		expect(routes.length).toBeGreaterThan(50);
		expect(
			routes.filter((r) => !(r in TABLE)),
			'routes without a row in TABLE'
		).toEqual([]);
		expect(
			Object.keys(TABLE).filter((k) => !routes.includes(k)),
			'rows for routes that do not exist'
		).toEqual([]);
		for (const [key, row] of Object.entries(TABLE)) expect(row.split(/\s+/), key).toHaveLength(ROLES.length);
		for (const key of Object.keys(REQUESTS)) expect(TABLE, `REQUESTS has ${key} but TABLE does not`).toHaveProperty([key]);
	});

	describe('answers each role as the table says', () => {
		const base = inject('baseUrl');
		const cookies: Record<Role, string> = { anon: '', reader: '', member: '', other: '', admin: '' };
		let f: Fixtures;

		beforeAll(async () => {
			const admin = await signInPatiently('curator@sable.test');
			const member = await freshMember('rt-member');
			const other = await freshMember('rt-other');
			const reader = await freshWithRole(admin, 'rt-reader', 'reader');
			Object.assign(cookies, { reader: reader.cookie, member: member.cookie, other: other.cookie, admin: admin.cookie });
			const padId = await padWithSteps(member, 'Routes table pad', ['darea l=0.3 o=2']);
			const padToDelete = (await member.post('/api/pads', { title: 'to delete' })).body.pad.id;
			const padToDeleteByForm = (await member.post('/api/pads', { title: 'to delete by form' })).body.pad.id;
			const slug = (await member.post(`/api/pads/${padId}/share`, {})).body.slug;
			const slugToRevoke = (await member.post(`/api/pads/${padId}/share`, {})).body.slug;
			const slugToRevokeByForm = (await member.post(`/api/pads/${padId}/share`, {})).body.slug;
			const keyId = (await member.post('/api/keys', { label: 'to delete' })).body.id;
			const datasetId = (await member.post('/api/datasets', csv())).body.dataset.id;
			const macroId = (
				await member.post('/api/macros', {
					name: unique('rt-own'),
					description: 'ΔA of a strip.',
					params: { l: '0.4' },
					body: ['darea l={l}']
				})
			).body.macro.id;
			f = {
				padId,
				padToDelete,
				padToDeleteByForm,
				slug,
				slugToRevoke,
				slugToRevokeByForm,
				keyId,
				datasetId,
				macroId,
				otherId: await idOf(other)
			};
			for (const [k, v] of Object.entries(f)) expect(v, k).toBeTruthy();
		});

		it('for every row and role', { timeout: 240_000 }, async () => {
			const wrong: string[] = [];
			const keys = Object.keys(TABLE).sort((a, b) => phase(a) - phase(b));
			// the owner goes last in each row, so a successful change or delete comes after the others have tried
			const order: Role[] = ['anon', 'reader', 'other', 'admin', 'member'];
			for (const key of keys) {
				const want = TABLE[key].split(/\s+/);
				for (const role of order) {
					// per role, so a row that makes something named (a macro, a dataset) makes a new one each time
					const { method, path, req } = requestOf(key, f);
					const status = await send(base, cookies[role], method, path, req);
					const expected = want[ROLES.indexOf(role)];
					if (!matches(status, expected)) wrong.push(`${key} as ${role}: ${status}, table says ${expected}`);
				}
			}
			expect(wrong).toEqual([]);
		});
	});
});
