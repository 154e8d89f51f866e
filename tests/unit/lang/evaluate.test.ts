/**
 * runLine against the engine. Expected values come from the engine's own functions called directly, or from
 * closed forms named beside each check — never from numbers this evaluator printed.
 */
import { describe, expect, it } from 'vitest';
import * as holo from '../../../src/lib/holo/index';
import type { RecordResult, ScalarResult, SeriesResult, TableResult } from '../../../src/lib/lang/result';
import { Pad } from './pad';

const brane = (d = 4, zh = 1) => holo.makeBulk('brane', { d, zh });
const boosted = (v: number, d = 4, zh = 1) => holo.makeBulk('boosted', { d, zh, v });
const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

describe('one verb, one l, one order → one scalar', () => {
	it('darea with the default bulk (brane d=4 zh=1) is the engine ΔA', () => {
		const out = new Pad().run('darea l=0.4');
		expect(out.results).toHaveLength(1);
		const r = out.results[0] as ScalarResult;
		expect(r.kind).toBe('scalar');
		expect(r.order).toBe('exact');
		expect(r.value).toBe(holo.deltaArea(brane(), 0.4));
		expect(r.label).toContain('brane d=4 zh=1');
		expect(r.latex).toMatch(/^\\Delta A\\big\|_\{\\ell=0\.4\} = 0\.0899/);
		expect(out.ref).toEqual({ value: r.value, fields: { l: 0.4 }, order: 'exact' });
		expect(out.bulk).toEqual({ name: 'brane', params: { d: 4, zh: 1 } });
	});

	it('a perturbative value always states its order', () => {
		const r = new Pad().run('darea l=0.3 o=2').results[0] as ScalarResult;
		expect(r.order).toBe(2);
		expect(r.value).toBe(holo.deltaAreaSeries(brane(), 0.3, 2));
		expect(r.latex).toContain('\\Delta A^{(2)}');
		expect(r.warning).toBeUndefined();
	});

	it('warns when l is outside the range where the series is reliable', () => {
		const r = new Pad().run('darea l=1.5 o=3').results[0] as ScalarResult;
		expect(r.order).toBe(3);
		expect(r.warning).toBe(holo.seriesWarning(brane(), 1.5, 3));
		expect(r.warning).toMatch(/radius of convergence/);
	});

	it('d=2 matches the BTZ closed form ΔA = 2 ln(sinh(l/2zh)/(l/2zh)) (PHYSICS.md; Calabrese & Cardy 2004)', () => {
		const l = 1.3;
		const r = new Pad().run('darea l=1.3 d=2').results[0] as ScalarResult;
		const x = l / 2;
		expect(rel(r.value, 2 * Math.log(Math.sinh(x) / x))).toBeLessThan(1e-9);
	});

	it('vacuum d=2 area is 2 ln l (Ryu & Takayanagi 2006, finite part in our scheme)', () => {
		const r = new Pad().run('use vacuum d=2; area l=3').results[1] as ScalarResult;
		expect(rel(r.value, 2 * Math.log(3))).toBeLessThan(1e-12);
	});

	it('zstar and width invert each other through the engine', () => {
		const p = new Pad();
		const z = (p.run('zstar l=0.7').results[0] as ScalarResult).value;
		const w = (p.run('width zstar=#1').results[0] as ScalarResult).value;
		expect(rel(w, 0.7)).toBeLessThan(1e-9);
		expect(z).toBe(holo.zstarOf(brane(), 0.7));
	});

	it('entropy is A/(4G) with G from the units', () => {
		const p = new Pad();
		p.run('units geo G=0.5');
		const r = p.run('entropy l=0.4').results[0] as ScalarResult;
		expect(r.value).toBe(holo.areaFinite(brane(), 0.4) / 2);
		const ds = p.run('dentropy l=0.4 G=2').results[0] as ScalarResult;
		expect(ds.value).toBe(holo.deltaArea(brane(), 0.4) / 8);
	});
});

describe('records name their fields as API.md lists them', () => {
	it('thermo → T, s, e, p; T = d/(4π zh) (PHYSICS.md)', () => {
		const r = new Pad().run('thermo zh=2').results[0] as RecordResult;
		expect(r.kind).toBe('record');
		expect(Object.keys(r.fields)).toEqual(['T', 's', 'e', 'p']);
		expect(rel(r.fields.T!, 4 / (4 * Math.PI * 2))).toBeLessThan(1e-15);
		expect(r.latex).toContain('T = ');
	});

	it('units sym N=3 gives s = (π²/2) N² T³ (Gubser, Klebanov & Peet 1996)', () => {
		const p = new Pad();
		const r = p.run('units sym N=3; thermo').results[1] as RecordResult;
		const { T, s } = r.fields;
		expect(rel(s!, (Math.PI ** 2 / 2) * 9 * T! ** 3)).toBeLessThan(1e-12);
	});

	it('stress → tt, ty, xx, yy; energy → E, P; validity → l_max, radius', () => {
		const p = new Pad();
		p.run('use boosted d=4 v=0.6');
		const st = p.run('stress').results[0] as RecordResult;
		expect(st.fields).toEqual(holo.stressTensor(boosted(0.6), 1));
		const en = p.run('energy l=0.5').results[0] as RecordResult;
		expect(en.fields).toEqual(holo.energy(boosted(0.6), 0.5, 1));
		const va = p.run('validity o=3').results[0] as RecordResult;
		expect(va.fields).toEqual(holo.validity(boosted(0.6), 3, 1e-3));
	});

	it('coeffs → a series with the engine coefficients', () => {
		const r = new Pad().run('use boosted d=4 zh=1 v=0.6; coeffs darea o=4 | tex').results[1] as SeriesResult;
		expect(r.kind).toBe('series');
		const c = holo.seriesCoeffs(boosted(0.6), 4);
		expect(r.terms).toEqual(c.map((t) => ({ k: t.k, coeff: t.value, latex: t.latex, power: 4 * t.k })));
		expect(r.latex).toMatch(/^\\Delta A = \\ell\^\{-2\}\\Big\[/);
		expect(r.order).toBe(4);
	});

	it('coeffs of the charged brane carry each term at its own power of l/zh (d and 2(d−1) mix)', () => {
		const r = new Pad().run('use charged d=4 zh=1 q=0.5; coeffs darea o=3').results[1] as SeriesResult;
		const c = holo.seriesCoeffs(holo.makeBulk('charged', { d: 4, zh: 1, q: 0.5 }), 3);
		expect(r.terms.map((t) => t.power)).toEqual(c.map((t) => t.power));
		// order 3 keeps every power ≤ 3d = 12: 4, 6, 8, 10, 12 (the q² term enters at 2(d−1) = 6)
		expect(r.terms.map((t) => t.power)).toEqual([4, 6, 8, 10, 12]);
		expect(r.latex).toContain('\\left(\\frac{\\ell}{z_h}\\right)^{6}');
	});

	it('writes the plane wave series in l/zp', () => {
		const r = new Pad().run('use wave d=4 zp=1; coeffs darea o=2').results[1] as SeriesResult;
		expect(r.latex).toContain('\\frac{\\ell}{z_p}');
		expect(r.latex).not.toContain('z_h');
	});
});

describe('lists and ranges → tables', () => {
	it('o=1,2,3,exact gives columns l, o1, o2, o3, exact', () => {
		const p = new Pad();
		p.run('use boosted d=4 zh=1 v=0.6');
		const t = p.run('darea l=0.4 o=1,2,3,exact').results[0] as TableResult;
		expect(t.kind).toBe('table');
		expect(t.columns).toEqual(['l', 'o1', 'o2', 'o3', 'exact']);
		const b = boosted(0.6);
		expect(t.rows).toEqual([[0.4, ...[1, 2, 3].map((n) => holo.deltaAreaSeries(b, 0.4, n)), holo.deltaArea(b, 0.4)]]);
	});

	it('a range has 50 points by default, both ends included', () => {
		const t = new Pad().run('darea l=0.05..1.5').results[0] as TableResult;
		expect(t.rows).toHaveLength(50);
		expect(t.rows[0]![0]).toBe(0.05);
		expect(t.rows[49]![0]).toBe(1.5);
		expect(t.plot?.show).toBeUndefined();
	});

	it('sweep with :N points defaults to table + plot with the validity region per order', () => {
		const p = new Pad();
		p.run('use boosted d=4 zh=1 v=0.6');
		const t = p.run('sweep darea l=0.05..1.2:80 o=1,2,3,exact').results[0] as TableResult;
		expect(t.rows).toHaveLength(80);
		expect(t.rows[79]![0]).toBe(1.2);
		expect(t.plot).toMatchObject({ x: 'l', show: true });
		expect(t.plot?.validity?.o3).toBe(holo.validity(boosted(0.6), 3, 1e-3).l_max);
		// past the radius every truncation gets the same warning, so the orders are named once together
		expect(t.warning).toMatch(/^o1, o2, o3: l=1\.2 is beyond the series' radius of convergence/);
		expect(t.warning).toContain(String(Number(holo.validity(boosted(0.6), 3, 1e-2).radius.toPrecision(4))));
	});

	it('names each order apart when their warnings differ', () => {
		const p = new Pad();
		const t = p.run('sweep darea l=0.05..0.69:10 o=1,2,exact').results[0] as TableResult;
		// in the default brane (radius ≈ 0.7 in l) order 1 and 2 leave their 1% range at different widths
		expect(t.warning).toMatch(/^o1: order 1 is off .*; o2: order 2 is off /);
	});

	it('sweeping a bulk key re-evaluates keys written with it (l=zh/2)', () => {
		const t = new Pad().run('darea zh=1,2 l=zh/2').results[0] as TableResult;
		expect(t.columns).toEqual(['zh', 'exact']);
		expect(t.rows[1]).toEqual([2, holo.deltaArea(brane(4, 2), 1)]);
	});

	it('a record verb over a list sweeps its key; validity over orders sweeps o', () => {
		const t = new Pad().run('thermo zh=1,2').results[0] as TableResult;
		expect(t.columns).toEqual(['zh', 'T', 's', 'e', 'p']);
		const v = new Pad().run('validity o=1,2').results[0] as TableResult;
		// radius_err (the radius states its uncertainty) is a field added after l_max and radius
		expect(v.columns).toEqual(['o', 'l_max', 'radius', 'radius_err']);
		expect(v.rows[1]).toEqual([
			2,
			holo.validity(brane(), 2, 1e-3).l_max,
			holo.validity(brane(), 2, 1e-3).radius,
			holo.validity(brane(), 2, 1e-3).radius_err
		]);
	});

	it('sweep always answers a table, even for one point', () => {
		const t = new Pad().run('sweep darea l=0.4').results[0] as TableResult;
		expect(t).toMatchObject({
			kind: 'table',
			columns: ['l', 'exact'],
			rows: [[0.4, holo.deltaArea(brane(), 0.4)]],
			plot: { x: 'l', show: true }
		});
	});

	it('reports progress point by point', () => {
		const seen: [number, number][] = [];
		new Pad().run('darea l=0.1..0.5:5 o=1,exact', { onProgress: (d, t) => seen.push([d, t]) });
		expect(seen).toHaveLength(10);
		expect(seen[9]).toEqual([10, 10]);
	});
});

describe('sinks', () => {
	it('| table turns a scalar into a one-row table; | csv marks it for download; | tex adds an array', () => {
		const t = new Pad().run('darea l=0.4 o=2 | table | csv | tex').results[0] as TableResult;
		expect(t.columns).toEqual(['l', 'o2']);
		expect(t.rows).toEqual([[0.4, holo.deltaAreaSeries(brane(), 0.4, 2)]]);
		expect(t.download).toEqual({ format: 'csv', filename: 'darea.csv' });
		expect(t.latex).toMatch(/^\\begin\{array\}\{c\|c\}/);
	});
	it('| plot shows the plot', () => {
		const t = new Pad().run('darea l=0.1..1:4 | plot').results[0] as TableResult;
		expect(t.plot?.show).toBe(true);
	});
});

describe('the pad: bulk, overrides, references, let', () => {
	it('use boosted d=4 v=0.5; darea l=0.3 answers both in order', () => {
		const out = new Pad().run('use boosted d=4 v=0.5; darea l=0.3');
		expect(out.results.map((r) => r.kind)).toEqual(['note', 'scalar']);
		expect(out.results[0]).toEqual({ kind: 'note', text: 'bulk: boosted d=4 zh=1 v=0.5' });
		expect((out.results[1] as ScalarResult).value).toBe(holo.deltaArea(boosted(0.5), 0.3));
		expect(out.bulk).toEqual({ name: 'boosted', params: { d: 4, zh: 1, v: 0.5 } });
	});

	it('keys on a verb line override the bulk for that line only', () => {
		const p = new Pad();
		p.run('use boosted d=4 v=0.5');
		const a = p.run('darea l=0.3 v=0.2');
		expect((a.results[0] as ScalarResult).value).toBe(holo.deltaArea(boosted(0.2), 0.3));
		expect(a.bulk.params.v).toBe(0.5);
		const b = p.run('darea l=0.3');
		expect((b.results[0] as ScalarResult).value).toBe(holo.deltaArea(boosted(0.5), 0.3));
		const c = p.run('darea l=0.3 rapidity=0.4');
		expect((c.results[0] as ScalarResult).value).toBe(holo.deltaArea(holo.makeBulk('boosted', { d: 4, zh: 1, rapidity: 0.4 }), 0.3));
	});

	it('darea l=0.2 d=5 o=3 works with no use before it', () => {
		const r = new Pad().run('darea l=0.2 d=5 o=3').results[0] as ScalarResult;
		expect(r.value).toBe(holo.deltaAreaSeries(brane(5), 0.2, 3));
	});

	it('#n and #n.field read earlier steps; arithmetic keeps the order of what it used', () => {
		const p = new Pad();
		const a = (p.run('darea l=0.4 o=2').results[0] as ScalarResult).value;
		const b = (p.run('darea l=0.4').results[0] as ScalarResult).value;
		const q = p.run('#1 / #2').results[0] as ScalarResult;
		expect(q.value).toBe(a / b);
		expect(q.order).toBe(2);
		expect(q.latex).toMatch(/^\\frac\{\\#1\}\{\\#2\} = /);
		p.run('thermo');
		const t = p.run('#4.T * 2').results[0] as ScalarResult;
		expect(t.value).toBe(2 * holo.thermo(brane(), 1).T);
		expect((p.run('darea l=#1.l').results[0] as ScalarResult).value).toBe(b);
	});

	it('let keeps a value; later arithmetic and keys use it', () => {
		const p = new Pad();
		const out = p.run('let area_fin = area l=0.4');
		expect(out.lets.area_fin?.value).toBe(holo.areaFinite(brane(), 0.4));
		expect(out.results.at(-1)).toMatchObject({ kind: 'note' });
		expect((p.run('area_fin * 4').results[0] as ScalarResult).value).toBe(4 * holo.areaFinite(brane(), 0.4));
		p.run('let w = 0.25');
		expect((p.run('darea l=w*2').results[0] as ScalarResult).value).toBe(holo.deltaArea(brane(), 0.5));
	});

	it('2*pi/3 is arithmetic', () => {
		const r = new Pad().run('2*pi/3').results[0] as ScalarResult;
		expect(r.value).toBe((2 * Math.PI) / 3);
		expect(r.order).toBe('exact');
	});

	it('names in values may be bulk keys: l=2*zh/3', () => {
		const r = new Pad().run('darea l=2*zh/3 zh=1.5').results[0] as ScalarResult;
		expect(r.value).toBe(holo.deltaArea(brane(4, 1.5), 1));
	});
});
