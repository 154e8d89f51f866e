// The macro library: who may read, propose, approve, edit and retire; versions; body checks; use from the console.
import { beforeAll, describe, expect, it } from 'vitest';
import { Client, freshMember } from '../helpers/client';
import { expectFailure, freshWithRole, signInPatiently } from '../helpers/roles';

let admin: Client;
let author: Client;
let other: Client;
let reader: Client;
const anon = () => new Client();
const unique = (stem: string) => `${stem}-${Math.random().toString(36).slice(2, 8)}`;

const proposal = (name: string, over: Record<string, unknown> = {}) => ({
	name,
	description: 'ΔA of a strip in the planar brane at width l.',
	params: { l: '0.4', d: '4' },
	body: ['use brane d={d} zh=1', 'darea l={l}'],
	...over
});

async function propose(c: Client, name = unique('lib-test'), over: Record<string, unknown> = {}) {
	const r = await c.post('/api/macros', proposal(name, over));
	expect(r.status, JSON.stringify(r.body)).toBe(201);
	return r.body.macro as { id: string; name: string; state: string; version: number };
}

const names = (r: { body: any }) => (r.body.macros as { name: string }[]).map((m) => m.name);

beforeAll(async () => {
	admin = await signInPatiently('curator@sable.test');
	author = await freshMember('author');
	other = await freshMember('other');
	reader = await freshWithRole(admin, 'reader-lib', 'reader');
});

describe('who may do what', () => {
	it('answers 401 to every route without an account', async () => {
		const seeded = (await admin.get('/api/macros')).body.macros[0].id;
		expectFailure(await anon().get('/api/macros'), 401);
		expectFailure(await anon().post('/api/macros', proposal(unique('anon'))), 401);
		expectFailure(await anon().get(`/api/macros/${seeded}`), 401);
		expectFailure(await anon().patch(`/api/macros/${seeded}`, { action: 'retire' }), 401);
	});

	it('lets a reader browse the approved library but not propose or curate', async () => {
		const r = await reader.get('/api/macros');
		expect(r.status).toBe(200);
		expect(names(r)).toEqual(expect.arrayContaining(['btz-check', 'sym-thermo']));
		expect(names(r)).not.toContain('charged-scan');
		expect(new Set(r.body.macros.map((m: { state: string }) => m.state))).toEqual(new Set(['approved']));
		expectFailure(await reader.post('/api/macros', proposal(unique('reader'))), 403);
		const btz = r.body.macros.find((m: { name: string }) => m.name === 'btz-check');
		expectFailure(await reader.patch(`/api/macros/${btz.id}`, { action: 'retire' }), 403);
	});

	it('shows the whole library, proposals and all, only to admins', async () => {
		const asAdmin = await admin.get('/api/macros?state=proposed');
		expect(names(asAdmin)).toContain('charged-scan');
		const asMember = await other.get('/api/macros?state=proposed');
		expect(asMember.status).toBe(200);
		expect(names(asMember)).not.toContain('charged-scan');
		const id = asAdmin.body.macros.find((m: { name: string }) => m.name === 'charged-scan').id;
		expectFailure(await other.get(`/api/macros/${id}`), 404);
		expectFailure(await other.patch(`/api/macros/${id}`, { action: 'edit', description: 'mine now' }), 404);
	});

	it('refuses an unknown state filter and unknown ids', async () => {
		expectFailure(await admin.get('/api/macros?state=secret'), 400);
		expectFailure(await admin.get('/api/macros/no-such-macro'), 404);
		expectFailure(await admin.patch('/api/macros/no-such-macro', { action: 'approve' }), 404);
	});

	it('answers each macro in the documented shape', async () => {
		const r = await reader.get('/api/macros?state=approved');
		for (const m of r.body.macros) {
			expect(Object.keys(m)).toEqual(
				expect.arrayContaining(['id', 'name', 'description', 'state', 'version', 'params', 'body', 'author', 'updatedAt'])
			);
			expect(typeof m.author.name).toBe('string');
			expect(Array.isArray(m.body)).toBe(true);
		}
	});
});

describe('lifecycle: propose → approve → edit → retire', () => {
	it('walks a macro through its states, keeping every version', async () => {
		const m = await propose(author);
		expect(m).toMatchObject({ state: 'proposed', version: 1 });
		expect(names(await author.get('/api/macros'))).toContain(m.name);
		expect(names(await other.get('/api/macros'))).not.toContain(m.name);
		expectFailure(await other.get(`/api/macros/${m.id}`), 404);

		expectFailure(await author.patch(`/api/macros/${m.id}`, { action: 'approve' }), 403);
		const approved = await admin.patch(`/api/macros/${m.id}`, { action: 'approve' });
		expect(approved.status).toBe(200);
		expect(approved.body.macro.state).toBe('approved');
		expectFailure(await admin.patch(`/api/macros/${m.id}`, { action: 'approve' }), 409);
		expect(names(await other.get('/api/macros?state=approved'))).toContain(m.name);
		expect(names(await reader.get('/api/macros'))).toContain(m.name);

		// once approved only an admin edits it, and the edit is a new version with the old one kept
		expectFailure(await author.patch(`/api/macros/${m.id}`, { action: 'edit', body: ['darea l={l}'] }), 403);
		const newBody = ['use brane d={d} zh=1', 'darea l={l} o=2'];
		const edited = await admin.patch(`/api/macros/${m.id}`, { action: 'edit', body: newBody, description: 'ΔA at second order.' });
		expect(edited.status, JSON.stringify(edited.body)).toBe(200);
		expect(edited.body.macro).toMatchObject({ version: 2, state: 'approved', body: newBody, description: 'ΔA at second order.' });
		const full = await other.get(`/api/macros/${m.id}`);
		expect(full.status).toBe(200);
		expect(full.body.macro.versions.map((v: { version: number }) => v.version)).toEqual([1, 2]);
		expect(full.body.macro.versions[0].body).toEqual(proposal(m.name).body);
		expect(full.body.macro.versions[1].body).toEqual(newBody);

		const retired = await admin.patch(`/api/macros/${m.id}`, { action: 'retire' });
		expect(retired.body.macro.state).toBe('retired');
		expect(names(await other.get('/api/macros'))).not.toContain(m.name);
		expectFailure(await other.get(`/api/macros/${m.id}`), 404);
		expect(names(await admin.get('/api/macros?state=retired'))).toContain(m.name);
		// a retired macro can come back
		expect((await admin.patch(`/api/macros/${m.id}`, { action: 'approve' })).body.macro.state).toBe('approved');
	});

	it('lets an author edit their own proposal, and nobody else', async () => {
		const m = await propose(author);
		const r = await author.patch(`/api/macros/${m.id}`, { action: 'edit', params: { l: '0.6', d: '3' } });
		expect(r.status, JSON.stringify(r.body)).toBe(200);
		expect(r.body.macro).toMatchObject({ version: 2, state: 'proposed', params: { l: '0.6', d: '3' } });
		expectFailure(await other.patch(`/api/macros/${m.id}`, { action: 'edit', description: 'hijacked' }), 404);
		expectFailure(await author.patch(`/api/macros/${m.id}`, { action: 'edit' }), 400);
	});

	it('keeps names unique across the library', async () => {
		const m = await propose(author);
		expectFailure(await other.post('/api/macros', proposal(m.name)), 409);
		expectFailure(await other.post('/api/macros', proposal('btz-check')), 409);
	});
});

describe('body and name checks', () => {
	it('names the line that does not parse, with the parser’s message', async () => {
		const r = await author.post('/api/macros', proposal(unique('bad'), { body: ['use brane d={d} zh=1', 'dara l={l}'] }));
		const message = expectFailure(r, 400);
		expect(r.body.error.line).toBe(2);
		expect(message).toMatch(/line 2/);
		expect(message).toMatch(/dara/);
		expect(r.body.error.start).toBe(0);
	});

	it('checks lines with the defaults put in for their placeholders', async () => {
		// `v={v}` parses only because the default is a number; a default that breaks the line is caught
		const okay = await author.post('/api/macros', proposal(unique('ph'), { params: { v: '0.5' }, body: ['use boosted d=4 zh=1 v={v}'] }));
		expect(okay.status, JSON.stringify(okay.body)).toBe(201);
		const broken = await author.post(
			'/api/macros',
			proposal(unique('ph'), { params: { v: '0.5 =' }, body: ['use boosted d=4 zh=1 v={v}'] })
		);
		expectFailure(broken, 400);
		expect(broken.body.error.line).toBe(1);
	});

	it('refuses a placeholder with no parameter behind it', async () => {
		const r = await author.post('/api/macros', proposal(unique('ph'), { params: {}, body: ['use brane d=4', 'darea l={l}'] }));
		expect(expectFailure(r, 400)).toMatch(/\{l\}/);
		expect(r.body.error.line).toBe(2);
	});

	it('holds the size limits: 1..20 lines of at most 300 characters', async () => {
		expectFailure(await author.post('/api/macros', proposal(unique('n'), { body: [] })), 400);
		expectFailure(await author.post('/api/macros', proposal(unique('n'), { body: Array.from({ length: 21 }, () => 'thermo') })), 400);
		const long = 'darea l=0.4 ' + '// ' + 'x'.repeat(300);
		const r = await author.post('/api/macros', proposal(unique('n'), { body: ['thermo', long] }));
		expectFailure(r, 400);
		expect(r.body.error.line).toBe(2);
		const twenty = await author.post(
			'/api/macros',
			proposal(unique('n'), { params: {}, body: Array.from({ length: 20 }, () => 'thermo') })
		);
		expect(twenty.status, JSON.stringify(twenty.body)).toBe(201);
	});

	it('wants a lower-case identifier for a name', async () => {
		for (const name of ['BTZ', '9lives', 'two words', 'trailing-', 'a/b', '']) {
			expectFailure(await author.post('/api/macros', proposal(name)), 400);
		}
	});

	it('applies the same checks to an edit', async () => {
		const m = await propose(author);
		const r = await admin.patch(`/api/macros/${m.id}`, { action: 'edit', body: ['thermo', 'thermo', 'use nowhere'] });
		expectFailure(r, 400);
		expect(r.body.error.line).toBe(3);
		expect((await admin.get(`/api/macros/${m.id}`)).body.macro.version).toBe(1);
	});
});

describe('macros in the console', () => {
	const lastScalar = (results: any[]) => [...results].reverse().find((x) => x.kind === 'scalar');

	it('runs @btz-check with its keys and matches the Calabrese–Cardy entropy', async () => {
		const r = await author.post('/api/eval', { input: '@btz-check l=2 c=12' });
		expect(r.status, JSON.stringify(r.body)).toBe(200);
		const s = lastScalar(r.body.results);
		expect(s, JSON.stringify(r.body.results)).toBeDefined();
		// BTZ (zh=1, β = 2π): ΔS = (c/3) ln( sinh(l/2) / (l/2) )
		const l = 2,
			c = 12;
		const expected = (c / 3) * Math.log(Math.sinh(l / 2) / (l / 2));
		expect(Math.abs(s.value - expected), `got ${s.value}, expected ${expected}`).toBeLessThan(1e-6 * Math.abs(expected));
		// and it is exactly its body with the keys put in
		const direct = await author.post('/api/eval', { input: 'use brane d=2 zh=1; units cft c=12; dentropy l=2' });
		expect(lastScalar(direct.body.results).value).toBeCloseTo(s.value, 12);
	});

	it('uses defaults for keys not given, and runs only approved macros', async () => {
		// an underscore name, so this test does not depend on how the lexer reads '-' in `@name`
		const m = await propose(author, unique('use').replace('-', '_'), { params: { l: '0.3' }, body: ['use brane d=4 zh=1', 'darea l={l}'] });
		const before = await author.post('/api/eval', { input: `@${m.name}` });
		expectFailure(before, 400);
		await admin.patch(`/api/macros/${m.id}`, { action: 'approve' });
		const viaMacro = await author.post('/api/eval', { input: `@${m.name}` });
		expect(viaMacro.status, JSON.stringify(viaMacro.body)).toBe(200);
		const direct = await author.post('/api/eval', { input: 'darea l=0.3 d=4 zh=1' });
		expect(lastScalar(viaMacro.body.results).value).toBeCloseTo(lastScalar(direct.body.results).value, 12);
		await admin.patch(`/api/macros/${m.id}`, { action: 'retire' });
		expectFailure(await author.post('/api/eval', { input: `@${m.name}` }), 400);
	});
});

describe('the library page', () => {
	it('shows the approved library to everyone signed in, proposals only to admins and their authors', async () => {
		const m = await propose(author);
		const asAuthor = await author.get('/library');
		expect(asAuthor.status).toBe(200);
		expect(asAuthor.body).toContain('btz-check');
		expect(asAuthor.body).toContain('Propose a macro');
		// the page's data carries the macros the viewer may see, whichever tab is open
		expect(asAuthor.body).toContain(m.name);
		expect((await other.get('/library')).body).not.toContain(m.name);
		expect((await admin.get('/library')).body).toContain(m.name);
		const asReader = await reader.get('/library');
		expect(asReader.body).toContain('sym-thermo');
		expect(asReader.body).not.toContain('Propose a macro');
		expect(asReader.body).not.toContain('charged-scan');
	});
});
