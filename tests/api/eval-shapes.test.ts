// Every result kind of API.md, as a script sees it: each named field present with its type.
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, type Client } from '../helpers/client';

let c: Client;
beforeAll(async () => {
	c = await signedIn('tomas@sable.test');
});

async function results(input: string) {
	const r = await c.post('/api/eval', { input });
	expect(r.status, JSON.stringify(r.body).slice(0, 300)).toBe(200);
	return r.body.results as Record<string, unknown>[];
}

describe('result shapes of POST /api/eval (API.md)', () => {
	it('scalar: label, value, order (a number for a series value, with its warning past validity)', async () => {
		const [s] = await results('darea l=0.6 o=1');
		expect(s).toMatchObject({ kind: 'scalar', label: expect.any(String), value: expect.any(Number), order: 1 });
		expect(s.warning).toMatch(/order 1/);
		const [e] = await results('darea l=0.2');
		expect(e).toMatchObject({ kind: 'scalar', order: 'exact' });
	});

	it('record: stress → tt, ty, xx, yy; thermo → T, s, e, p; energy → E, P; mi → I, gap_crit; validity → l_max, radius', async () => {
		const want: [string, string[]][] = [
			['stress', ['tt', 'ty', 'xx', 'yy']],
			['thermo', ['T', 's', 'e', 'p']],
			['energy l=0.4', ['E', 'P']],
			['mi pair l=1 gap=0.3', ['I', 'gap_crit']],
			['validity darea o=3', ['l_max', 'radius']]
		];
		for (const [line, fields] of want) {
			const [r] = await results(line);
			expect(r.kind, line).toBe('record');
			expect(typeof r.label).toBe('string');
			for (const f of fields) expect(typeof (r.fields as Record<string, unknown>)[f], `${line}: ${f}`).toBe('number');
		}
	});

	it('issue 11 fields: resum error, validity radius_err, entropy note, the soliton phases record', async () => {
		const [r] = await results('resum l=0.8 o=6');
		expect(r).toMatchObject({ kind: 'scalar', label: expect.stringMatching(/± /), note: expect.any(String) });
		expect(typeof (r.fields as Record<string, unknown>).error).toBe('number');
		const [v] = await results('validity darea o=3');
		expect(typeof (v.fields as Record<string, unknown>).radius_err).toBe('number');
		const [s] = await results('entropy l=0.4');
		expect(s).toMatchObject({ label: expect.stringMatching(/^S_fin/), note: expect.stringContaining('subtracted') });
		const [, p] = await results('use soliton d=4; phases');
		expect(p.kind).toBe('record');
		for (const f of ['l_c', 'l_max', 'dA_dl_jump']) expect(typeof (p.fields as Record<string, unknown>)[f], f).toBe('number');
	});

	it('table: first column the swept key, then o1, o2, exact', async () => {
		const [t] = await results('darea l=0.1,0.2 o=1,2,exact');
		expect(t).toMatchObject({ kind: 'table', label: expect.any(String), columns: ['l', 'o1', 'o2', 'exact'] });
		expect(t.rows).toHaveLength(2);
		expect((t.rows as number[][])[1][0]).toBe(0.2);
	});

	it('series: terms with k, coeff and latex, and the whole latex', async () => {
		const [s] = await results('coeffs darea o=3');
		expect(s).toMatchObject({ kind: 'series', label: expect.any(String), latex: expect.any(String) });
		const terms = s.terms as { k: number; coeff: number; latex: string }[];
		expect(terms.map((t) => t.k)).toEqual([1, 2, 3]);
		for (const t of terms) expect(typeof t.coeff === 'number' && typeof t.latex === 'string').toBe(true);
	});

	it('check: pass, lhs, rhs, residual, tolerance', async () => {
		const [k] = await results('firstlaw l=0.3 o=2');
		expect(k).toMatchObject({
			kind: 'check',
			label: expect.any(String),
			pass: expect.any(Boolean),
			lhs: expect.any(Number),
			rhs: expect.any(Number),
			residual: expect.any(Number),
			tolerance: expect.any(Number)
		});
		expect(Math.abs((k.lhs as number) - (k.rhs as number) - (k.residual as number))).toBeLessThan(1e-12 * Math.abs(k.lhs as number));
	});

	it('note: text (what `use` did)', async () => {
		const [n] = await results('use vacuum d=3; zstar l=1');
		expect(n).toMatchObject({ kind: 'note', text: expect.stringContaining('vacuum') });
	});
});
