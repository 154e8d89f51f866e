/**
 * The `profile` verb: the surface itself as a table (x, z[, v]) with a plot and CSV. Expected values come from the
 * engine's strip solver (z*, checked against mpmath in tests/unit/holo) and from the geometry (PHYSICS.md, "Quench":
 * the shell is v = 0; the boundary is z = 0 at x = ±l/2 and v = t).
 */
import { describe, expect, it } from 'vitest';
import * as holo from '../../../src/lib/holo/index';
import type { TableResult } from '../../../src/lib/lang/result';
import { expectAbs, expectRel } from '../holo/check';
import { Pad } from './pad';

const col = (t: TableResult, name: string) => t.rows.map((r) => r[t.columns.indexOf(name)] as number);

describe('profile in static bulks', () => {
	for (const [use, l] of [
		['use brane d=4 zh=1', 1.5],
		['use brane d=2 zh=1', 3],
		['use charged d=4 zh=1 q=0.5', 1.2]
	] as const) {
		it(`${use}: the RT surface reaches z* at x = 0 and the boundary at x = ±l/2`, () => {
			const p = new Pad();
			const bulk = p.run(use).bulk;
			const out = p.run(`profile l=${l}`);
			const t = out.results[0] as TableResult;
			expect(t.kind).toBe('table');
			expect(t.columns).toEqual(['x', 'z']);
			expect(t.plot?.x).toBe('x');
			expect(t.plot?.show).toBe(true);
			const x = col(t, 'x');
			const z = col(t, 'z');
			const zs = holo.zstarOf(holo.makeBulk(bulk.name, bulk.params as Record<string, number>), l);
			const mid = x.indexOf(0);
			expect(mid).toBeGreaterThan(0);
			expectRel('tip', zs, z[mid], 1e-14, 'the strip solver’s z*');
			expect(Math.max(...z)).toBe(z[mid]);
			expectRel('left end', -l / 2, x[0], 1e-14, 'x = −l/2');
			expectRel('right end', l / 2, x[x.length - 1], 1e-14, 'x = l/2');
			expectAbs('boundary', 0, z[0], 0, 'z = 0');
			expectAbs('boundary', 0, z[z.length - 1], 0, 'z = 0');
			// the traced half-width just before the pinned end point is already close to l/2 (nothing is forced there)
			expect(Math.abs(x[x.length - 2] - l / 2)).toBeLessThan(0.05 * l);
			// a symmetric, single-valued x(z): mirror rows agree and x rises monotonically
			for (let i = 0; i < x.length; i++) expect(x[i] + x[x.length - 1 - i]).toBeCloseTo(0, 14);
			for (let i = 1; i < x.length; i++) expect(x[i]).toBeGreaterThan(x[i - 1]);
			expect(out.ref?.fields.zstar).toBe(zs);
		});
	}
	it('| csv marks the table for download', () => {
		const t = new Pad().run('profile l=1 | csv').results[0] as TableResult;
		expect(t.download).toEqual({ format: 'csv', filename: 'profile.csv' });
	});
	it('sweeps, orders and t in a static bulk are refused', () => {
		expect(new Pad().fail('sweep profile l=0.5..1:3').message).toMatch(/one surface/);
		expect(new Pad().fail('profile l=1 t=1').message).toMatch(/static/);
		expect(new Pad().fail('profile l=1 o=2').message).toMatch(/o/);
	});
});

describe('profile in vaidya (HRT surfaces)', () => {
	for (const [d, l, tt] of [
		[2, 2, 0.7],
		[3, 2, 1.0],
		[4, 3, 2.0] // refracted past m z_c^d = 2: climbs behind the horizon before turning back
	] as const) {
		it(`d=${d} l=${l} t=${tt}: the surface crosses the shell v = 0 at z_c and reaches the boundary at v = t`, () => {
			const out = new Pad().run(`use vaidya d=${d} zh=1; profile l=${l} t=${tt}`);
			const t = out.results[1] as TableResult;
			expect(t.columns).toEqual(['x', 'z', 'v']);
			const [x, z, v] = [col(t, 'x'), col(t, 'z'), col(t, 'v')];
			const a = holo.hrtDeltaArea(d, 1, l, tt);
			expect(a.winner.kind).toBe('shell');
			// the row on the shell: z = z_c with v = 0 (PHYSICS.md: the shell is v = 0)
			const k = z.findIndex((zz, i) => i >= z.length / 2 && Math.abs(zz - a.winner.zc) < 1e-12 * a.winner.zc);
			expect(k).toBeGreaterThan(0);
			expectAbs('v on the shell', 0, v[k], 1e-12, 'the shell is v = 0');
			// inside (the tip side) v < 0, outside towards the boundary v > 0: v changes sign once, at the shell
			const mid = x.indexOf(0);
			expect(v[mid]).toBeLessThan(0);
			expectRel('tip', a.winner.zstar, z[mid], 1e-14, 'the HRT surface’s z*');
			for (let i = mid; i < k; i++) expect(v[i]).toBeLessThan(1e-12);
			for (let i = k + 1; i < v.length; i++) expect(v[i]).toBeGreaterThan(0);
			expectRel('x at the boundary', l / 2, x[x.length - 1], 1e-8, 'the width integral, traced');
			expectRel('v at the boundary', tt, v[v.length - 1], 1e-8, 'boundary time t = v at z = 0');
			expect(out.ref?.fields.zc).toBe(a.winner.zc);
			if (d === 4) expect(Math.max(...z.slice(k))).toBeGreaterThan(a.winner.zc);
		});
	}
	it('vaidya without t is refused; saturated profiles are the static brane surface', () => {
		expect(new Pad().fail('use vaidya d=3; profile l=1').message).toMatch(/needs t=/);
		const t = new Pad().run('use vaidya d=3 zh=1; profile l=2 t=5').results[1] as TableResult;
		const z = col(t, 'z');
		expectRel('static tip', holo.zstarOf(holo.makeBulk('brane', { d: 3, zh: 1 }), 2), Math.max(...z), 1e-14, 'the brane strip');
	});
});
