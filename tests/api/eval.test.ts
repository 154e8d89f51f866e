import { describe, expect, it } from 'vitest';
import { Client, signedIn, freshMember } from '../helpers/client';

/**
 * A line that never finishes inside the test server's budget (20 s) on any machine: each point shoots the exact
 * ball surface (~0.3 s each here), so 2000 of them are minutes of work.
 */
/**
 * A heavy line that can never finish within any test budget, on any machine: 2000 points of mutual information
 * (three strip solves each) in a metric bulk whose f and h are as long as a formula may be, so every quadrature
 * node evaluates ~100 functions (~0.1 s a point here even when idle). Exact balls no longer serve: they take
 * milliseconds since ball-shot.ts.
 */
const HEAVY_LINE = `use metric f="1-z^4+0*(${Array(52).fill('sin(z)').join('+')})" h="1+0*(${Array(52).fill('cos(z)').join('+')})"; sweep mi pair l=0.2..1.2:2000 gap=0.1`;

describe('POST /api/eval', () => {
	it('needs a signed-in user (401) and a member or admin (403 for a reader)', async () => {
		expect((await new Client().post('/api/eval', { input: 'darea l=0.5' })).status).toBe(401);
		const reader = await signedIn('referee@sable.test');
		expect((await reader.post('/api/eval', { input: 'darea l=0.5' })).status).toBe(403);
	});

	it('evaluates a stateless line in the default bulk and stores nothing', async () => {
		const c = await signedIn('tomas@sable.test');
		const r = await c.post('/api/eval', { input: 'darea l=0.5' });
		expect(r.status).toBe(200);
		expect(r.body.ok).toBe(true);
		expect(r.body.step).toBeUndefined();
		expect(r.body.bulk).toEqual({ name: 'brane', params: { d: 4, zh: 1 } });
		expect(typeof r.body.ms).toBe('number');
		const [res] = r.body.results;
		expect(res.kind).toBe('scalar');
		expect(res.order).toBe('exact');
		// ΔA > 0 for the brane: the horizon adds area (common practice; checked in the engine's tests)
		expect(res.value).toBeGreaterThan(0);
	});

	it('answers a language error with 400, a span and the line untouched', async () => {
		const c = await signedIn('tomas@sable.test');
		const input = 'dara l=0.5';
		const r = await c.post('/api/eval', { input });
		expect(r.status).toBe(400);
		expect(r.body.ok).toBe(false);
		expect(r.body.error.message).toMatch(/dara/);
		expect(r.body.error.start).toBe(0);
		expect(r.body.error.end).toBe(4);
	});

	it('refuses an over-long line with 422 naming the limit', async () => {
		const c = await signedIn('tomas@sable.test');
		const r = await c.post('/api/eval', { input: 'darea l=0.5 ' + '// pad '.repeat(400) });
		expect(r.status).toBe(422);
		expect(r.body.error.message).toMatch(/limit/);
	});

	it('works with an API key instead of a cookie', async () => {
		const c = await freshMember('keyuser');
		const k = await c.post('/api/keys', { label: 'script' });
		expect(k.status).toBe(201);
		const script = new Client(undefined, k.body.key);
		const r = await script.post('/api/eval', { input: 'zstar l=0.3' });
		expect(r.status).toBe(200);
		expect(r.body.results[0].kind).toBe('scalar');
		expect((await new Client(undefined, 'bpk_not-a-real-key').post('/api/eval', { input: 'zstar l=0.3' })).status).toBe(401);
	});

	it('stores steps in a pad, keeps its bulk, and resolves references across steps', async () => {
		const c = await freshMember('padder');
		const pad = await c.post('/api/pads', { title: 'refs' });
		expect(pad.status).toBe(201);
		const id = pad.body.pad.id;
		const a = await c.post('/api/eval', { input: 'use boosted d=4 zh=1 v=0.5', pad: id });
		expect(a.status).toBe(200);
		expect(a.body.step.n).toBe(1);
		const b = await c.post('/api/eval', { input: 'darea l=0.3', pad: id });
		expect(b.body.step.n).toBe(2);
		expect(b.body.bulk.name).toBe('boosted');
		const same = await c.post('/api/eval', { input: 'use boosted d=4 zh=1 v=0.5; darea l=0.3' });
		expect(same.status).toBe(200);
		expect(b.body.results[0].value).toBeCloseTo(same.body.results.at(-1).value, 12);
		const ratio = await c.post('/api/eval', { input: '#2 / #2', pad: id });
		expect(ratio.status).toBe(200);
		expect(ratio.body.results[0].value).toBeCloseTo(1, 14);
	});

	it('keeps a failing line as an attempt with its error, taking no step number', async () => {
		const c = await freshMember('failer');
		const id = (await c.post('/api/pads', { title: 'errors' })).body.pad.id;
		const r = await c.post('/api/eval', { input: 'use boosted d=4 v=2', pad: id });
		expect(r.status).toBe(400);
		expect(r.body.error.message).toMatch(/\|v\| < 1/);
		expect(r.body.step).toBeUndefined();
		expect(typeof r.body.attempt.id).toBe('string');
		const pad = await c.get(`/api/pads/${id}`);
		expect(pad.body.steps).toEqual([]);
		expect(pad.body.attempts).toEqual([
			expect.objectContaining({ id: r.body.attempt.id, input: 'use boosted d=4 v=2', status: 'error', afterN: 0, dismissed: false })
		]);
		expect(pad.body.pad.history).toContain('use boosted d=4 v=2');
		// the failed line changed nothing: the pad is still in its default bulk, and the next good line is #1
		expect(pad.body.pad.bulk.name).toBe('brane');
		expect((await c.post('/api/eval', { input: 'darea l=0.3', pad: id })).body.step.n).toBe(1);
	});

	it("answers 404 for another member's pad", async () => {
		const owner = await freshMember('owner');
		const id = (await owner.post('/api/pads', { title: 'mine' })).body.pad.id;
		const other = await freshMember('other');
		expect((await other.post('/api/eval', { input: 'darea l=0.2', pad: id })).status).toBe(404);
	});

	it('answers both statements of `use …; darea …` in order', async () => {
		const c = await signedIn('tomas@sable.test');
		const r = await c.post('/api/eval', { input: 'use boosted d=4 v=0.5; darea l=0.3' });
		expect(r.status).toBe(200);
		expect(r.body.bulk.name).toBe('boosted');
		const kinds = r.body.results.map((x: { kind: string }) => x.kind);
		expect(kinds[kinds.length - 1]).toBe('scalar');
	});

	// waits the budget out (20 s) on purpose: the timeout is the budget plus room for a busy machine
	it('stops a line over its time budget with 422 while light requests keep answering', { timeout: 180_000 }, async () => {
		const heavy = await signedIn('ines@sable.test');
		const light = await signedIn('tomas@sable.test');
		let heavyDoneAt = 0;
		const heavyReq = heavy.post('/api/eval', { input: HEAVY_LINE }).then((r) => ((heavyDoneAt = Date.now()), r));
		await new Promise((r) => setTimeout(r, 100)); // let the heavy line reach its worker first
		for (let i = 0; i < 5; i++) {
			const r = await light.post('/api/eval', { input: 'zstar l=0.4' });
			expect(r.status).toBe(200);
		}
		const lightDoneAt = Date.now();
		const h = await heavyReq;
		expect(h.status).toBe(422);
		expect(h.body.error.message).toMatch(/time budget/);
		// the light lines were answered while the heavy one was still running, not queued behind it (the heavy one
		// can only end by the budget, which is hundreds of light lines long even on a slow machine)
		expect(lightDoneAt).toBeLessThan(heavyDoneAt);
	});
});
