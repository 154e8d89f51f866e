// Macros that cannot surprise the pad they run in: a body refers only to its own lines and parameters (the
// library refuses `darea l=#3` with 400), the header declares what it leaves changed in the pad and the rest
// is put back, and the curator's trial run shows the results on the example parameters before approval.
import { beforeAll, describe, expect, it } from 'vitest';
import { Client, freshMember } from '../helpers/client';
import { expectFailure, signInPatiently } from '../helpers/roles';
import { padWithSteps } from './support/pads';

let admin: Client;
let author: Client;
let other: Client;
const unique = (stem: string) => `${stem}_${Math.random().toString(36).slice(2, 8)}`;

beforeAll(async () => {
	admin = await signInPatiently('curator@sable.test');
	author = await freshMember('scope-author');
	other = await freshMember('scope-other');
});

describe('the library refuses bodies that reach outside the macro', () => {
	it('refuses #3 in a body with 400 and a message naming the line', async () => {
		const r = await author.post('/api/macros', {
			name: unique('leaky'),
			description: 'Reads the host pad.',
			params: {},
			body: ['darea l=#3']
		});
		expectFailure(r, 400);
		expect(r.body.error).toMatchObject({ line: 1, start: 8, end: 10 });
		expect(r.body.error.message).toMatch(/^line 1: #3 points outside this macro/);
		// a let-name of some pad, and an edit that would bring a host reference in, are refused the same way
		expectFailure(await author.post('/api/macros', { name: unique('leaky'), description: 'x', params: {}, body: ['darea l=w'] }), 400);
		const ok = await author.post('/api/macros', {
			name: unique('self'),
			description: 'Its own lines only.',
			params: { l: '0.4' },
			body: ['darea l={l}', 'darea l={l} o=2', '#1 - #2']
		});
		expect(ok.status, JSON.stringify(ok.body)).toBe(201);
		const edit = await author.patch(`/api/macros/${ok.body.macro.id}`, { action: 'edit', body: ['darea l={l}', '#1 - #5'] });
		expectFailure(edit, 400);
		expect(edit.body.error.line).toBe(2);
	});
});

describe('a macro in a pad', () => {
	it("answers from its own lines whatever the pad's #1, #2 hold, and puts the bulk back unless declared", async () => {
		const name = unique('selfcheck');
		const m = await author.post('/api/macros', {
			name,
			description: 'Exact minus order 2 at width l, in d=3.',
			params: { l: '0.4' },
			body: ['use brane d=3 zh=1', 'darea l={l}', 'darea l={l} o=2', '#2 - #3']
		});
		expect(m.status, JSON.stringify(m.body)).toBe(201);
		expect(m.body.macro.effects).toEqual([]);
		expect((await admin.patch(`/api/macros/${m.body.macro.id}`, { action: 'approve' })).status).toBe(200);

		const pad = await padWithSteps(other, 'Host', ['use boosted d=4 zh=1 v=0.5', 'darea l=0.9']);
		const r = await other.post('/api/eval', { input: `@${name} l=0.4`, pad });
		expect(r.status, JSON.stringify(r.body)).toBe(200);
		const direct = await other.post('/api/eval', { input: 'use brane d=3 zh=1; darea l=0.4; darea l=0.4 o=2' });
		const [exact, o2] = direct.body.results.filter((x: { kind: string }) => x.kind === 'scalar').map((x: { value: number }) => x.value);
		const diff = r.body.results.filter((x: { kind: string }) => x.kind === 'scalar').at(-1).value;
		expect(diff).toBe(exact - o2);
		// the pad's bulk is put back, and the answer says so
		expect(r.body.bulk).toEqual({ name: 'boosted', params: { d: 4, zh: 1, v: 0.5 } });
		expect(r.body.results.at(-1)).toEqual({ kind: 'note', text: `@${name} ran in its own scope: the pad's bulk is as before` });

		// declared in the header: the bulk stays
		expect((await admin.patch(`/api/macros/${m.body.macro.id}`, { action: 'edit', effects: ['bulk'] })).body.macro.effects).toEqual([
			'bulk'
		]);
		const kept = await other.post('/api/eval', { input: `@${name}`, pad });
		expect(kept.body.bulk).toEqual({ name: 'brane', params: { d: 3, zh: 1 } });
	});
});

describe("the curator's trial run", () => {
	it('runs a proposed macro on its example parameters in a fresh pad and stores nothing', async () => {
		const name = unique('trial');
		const m = (
			await author.post('/api/macros', {
				name,
				description: 'BTZ entropy check.',
				params: { l: '2', c: '12' },
				body: ['use brane d=2 zh=1', 'units cft c={c}', 'dentropy l={l}']
			})
		).body.macro;
		const r = await admin.post(`/api/macros/${m.id}/trial`, {});
		expect(r.status, JSON.stringify(r.body)).toBe(200);
		const t = r.body.trial;
		expect(t).toMatchObject({ input: `@${name}`, ok: true, effects: [], before: { bulk: { name: 'brane', params: { d: 4, zh: 1 } } } });
		// Calabrese–Cardy for BTZ (zh = 1, β = 2π): ΔS = (c/3) ln(sinh(l/2)/(l/2)) at l = 2, c = 12
		const s = t.results.filter((x: { kind: string }) => x.kind === 'scalar').at(-1);
		const expected = 4 * Math.log(Math.sinh(1) / 1);
		expect(Math.abs(s.value - expected)).toBeLessThan(1e-8 * expected);
		// no header effects: a trial pad ends as it began
		expect(t.after.bulk).toEqual({ name: 'brane', params: { d: 4, zh: 1 } });
		// still proposed, and no pad can run it yet
		expect((await admin.get(`/api/macros/${m.id}`)).body.macro.state).toBe('proposed');
		expectFailure(await author.post('/api/eval', { input: `@${name}` }), 400);
		// the author may try their own; another member cannot see it
		expect((await author.post(`/api/macros/${m.id}/trial`, {})).status).toBe(200);
		expectFailure(await other.post(`/api/macros/${m.id}/trial`, {}), 404);
	});

	it('reports a macro that fails on its examples as a failed trial, not a server error', async () => {
		const m = (
			await author.post('/api/macros', {
				name: unique('bad'),
				description: 'A negative width.',
				params: { l: '-1' },
				body: ['darea l={l}']
			})
		).body.macro;
		const r = await admin.post(`/api/macros/${m.id}/trial`, {});
		expect(r.status).toBe(200);
		expect(r.body.trial.ok).toBe(false);
		expect(r.body.trial.error.message).toMatch(/l must be > 0/);
	});
});
