/**
 * The quench in the language: `use vaidya`, the key t on strip verbs, `growth`. Expected values come from the
 * engine's own quench functions (checked against closed forms and mpmath in tests/unit/holo/vaidya*.test.ts).
 */
import { describe, expect, it } from 'vitest';
import * as holo from '../../../src/lib/holo/index';
import type { RecordResult, ScalarResult, TableResult } from '../../../src/lib/lang/result';
import { emptyContext, runLine } from '../../../src/lib/lang/evaluate';
import { Pad } from './pad';

describe('vaidya bulk and the key t', () => {
	it('darea l=2 t=1 is the HRT ΔA with the surface record beside it', () => {
		const out = new Pad().run('use vaidya d=3 zh=1; darea l=2 t=1');
		const r = out.results[1] as ScalarResult;
		const a = holo.hrtDeltaArea(3, 1, 2, 1);
		expect(r.value).toBe(a.dA);
		expect(r.fields?.zstar).toBe(a.winner.zstar);
		expect(r.fields?.zc).toBe(a.winner.zc);
		expect(r.fields?.surfaces).toBe(1);
		expect(r.fields?.saturated).toBe(0);
		expect(r.note).toMatch(/HRT surface/);
	});
	it('a growth table does not put its first row’s surface note under the whole curve', () => {
		const t = new Pad().run('use vaidya d=3 zh=1; sweep darea l=2 t=0..3:12').results[1] as TableResult;
		expect(t.kind).toBe('table');
		// rows from before the quench, on the shell and saturated: no single "HRT surface: …" describes them all
		expect(t.note ?? '').not.toMatch(/HRT surface/);
	});
	it('several extremal surfaces near saturation: the record says which won and by how much', () => {
		const r = new Pad().run('use vaidya d=3; darea l=2 t=1.48').results[1] as ScalarResult;
		expect(r.fields?.surfaces).toBe(3);
		expect(r.fields?.gap).toBeGreaterThan(0);
		expect(r.note).toMatch(/smallest of 3/);
	});
	it('late times equal `use brane` exactly; t ≤ 0 gives 0', () => {
		const p = new Pad();
		const late = (p.run('use vaidya d=4 zh=1; darea l=1.5 t=20').results[1] as ScalarResult).value;
		const brane = (p.run('use brane d=4 zh=1; darea l=1.5').results[1] as ScalarResult).value;
		expect(late).toBe(brane);
		expect((new Pad().run('use vaidya d=4; darea l=1.5 t=-1').results[1] as ScalarResult).value).toBe(0);
	});
	it('dentropy and zstar take t too', () => {
		const p = new Pad();
		p.run('use vaidya d=2 zh=1');
		const s = p.run('dentropy l=2 t=0.5').results[0] as ScalarResult;
		expect(s.value).toBeCloseTo(holo.hrtDeltaArea(2, 1, 2, 0.5).dA / 4, 14);
		const z = p.run('zstar l=2 t=0.5').results[0] as ScalarResult;
		expect(z.value).toBe(holo.hrtDeltaArea(2, 1, 2, 0.5).winner.zstar);
	});
	it('a growth sweep is a table over t', () => {
		const out = new Pad().run('use vaidya d=2; sweep darea l=2 t=0..1.5:16');
		const tab = out.results.find((r) => r.kind === 'table') as TableResult | undefined;
		expect(tab).toBeDefined();
		expect(JSON.stringify(tab)).toContain('0.3228787');
	});
	it('t without a quench, vaidya without t, and orders are refused with the key', () => {
		expect(new Pad().fail('darea l=1 t=1').message).toMatch(/static/);
		expect(new Pad().fail('use vaidya d=3; darea l=1').message).toMatch(/needs t=/);
		expect(new Pad().fail('use vaidya d=3; darea l=1 t=1 o=2').message).toMatch(/exact only/);
		expect(new Pad().fail('use vaidya d=7').message).toMatch(/d ≤ 6/);
	});
});

describe('growth', () => {
	it('reports the early law, slope, t_c, saturation and the kind of saturation', () => {
		const r = new Pad().run('use vaidya d=3 zh=1; growth l=2').results[1] as RecordResult;
		const g = holo.analyseGrowth(3, 1, 2);
		expect(r.kind).toBe('record');
		expect(JSON.stringify(r)).toContain(String(g.saturation.time));
		expect(JSON.stringify(r)).toContain('continuous');
	});
	it('refuses a static bulk', () => {
		expect(new Pad().fail('growth l=2').message).toMatch(/vaidya/);
	});
});

describe('a quench line answers the same bits whatever ran before it (curves live for one line)', () => {
	it('a growth sweep after other lines at the same width equals the same sweep run first', () => {
		// the earlier lines refine the width's family curve at their own times; a later sweep would otherwise start
		// from that curve (other brackets: last bits differed at most of these 40 times)
		const sweep = 'use vaidya d=3 zh=1; sweep darea l=2 t=-0.5..3:40';
		holo.clearQuenchCache(); // whatever the tests before left: the first run starts from nothing either way
		const first = JSON.stringify(runLine(sweep, emptyContext()).results);
		for (const other of [
			'use vaidya d=3 zh=1; sweep dentropy l=2 t=0..3:24',
			'use vaidya d=3 zh=1; sweep dentropy l=2 t=0,0.13043478260869565,0.2608695652173913,0.391304347826087,0.5217391304347826',
			'use vaidya d=3 zh=1; sweep dentropy l=2 t=1.5,1.6304347826086956,1.7608695652173914,1.891304347826087'
		])
			runLine(other, emptyContext());
		expect(JSON.stringify(runLine(sweep, emptyContext()).results)).toBe(first);
	});
});
