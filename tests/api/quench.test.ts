import { describe, expect, it } from 'vitest';
import { signedIn } from '../helpers/client';

/**
 * The quench through POST /api/eval: the vaidya bulk, the key t and growth, in the same shapes as every other
 * scalar and record answer. Values are checked against closed forms here only where they are exact and simple
 * (late time = the brane; t ≤ 0 = 0); the numbers themselves are checked in tests/unit/holo/vaidya*.test.ts.
 */
describe('POST /api/eval: quench lines', () => {
	it('darea l=2 t=1 in vaidya is a scalar with the surface record', async () => {
		const c = await signedIn('tomas@sable.test');
		const r = await c.post('/api/eval', { input: 'use vaidya d=3 zh=1; darea l=2 t=1' });
		expect(r.status).toBe(200);
		expect(r.body.bulk).toEqual({ name: 'vaidya', params: { d: 3, zh: 1 } });
		const res = r.body.results[1];
		expect(res.kind).toBe('scalar');
		expect(res.order).toBe('exact');
		expect(res.value).toBeGreaterThan(0);
		expect(res.fields.zstar).toBeGreaterThan(0);
		expect(res.fields.surfaces).toBe(1);
		expect(res.note).toMatch(/HRT surface/);
	});

	it('late time equals use brane exactly; before the quench 0', async () => {
		const c = await signedIn('tomas@sable.test');
		const late = await c.post('/api/eval', { input: 'use vaidya d=4 zh=1; darea l=1.5 t=30' });
		const brane = await c.post('/api/eval', { input: 'use brane d=4 zh=1; darea l=1.5' });
		expect(late.body.results[1].value).toBe(brane.body.results[1].value);
		const before = await c.post('/api/eval', { input: 'use vaidya d=4; darea l=1.5 t=0' });
		expect(before.body.results[1].value).toBe(0);
	});

	it('a growth sweep and growth answer; t on a static bulk is a 400 naming t', async () => {
		const c = await signedIn('tomas@sable.test');
		const sw = await c.post('/api/eval', { input: 'use vaidya d=3; sweep darea l=2 t=0..3:60' });
		expect(sw.status).toBe(200);
		expect(sw.body.results.some((x: { kind: string }) => x.kind === 'table')).toBe(true);
		const g = await c.post('/api/eval', { input: 'use vaidya d=3; growth l=2' });
		expect(g.status).toBe(200);
		expect(g.body.results[1].kind).toBe('record');
		expect(JSON.stringify(g.body.results[1])).toContain('t_sat');
		const bad = await c.post('/api/eval', { input: 'darea l=1 t=1' });
		expect(bad.status).toBe(400);
		expect(bad.body.error.message).toMatch(/static/);
	});
});
