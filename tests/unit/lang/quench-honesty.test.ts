/**
 * What the quench lines say about their own validity (holo/vaidya): `growth` on a strip too narrow for a linear
 * regime, and widths below the solver's range. Expected numbers come from the engine (checked against closed
 * forms and the tsunami law in tests/unit/holo/vaidya*.test.ts).
 */
import { describe, expect, it } from 'vitest';
import * as holo from '../../../src/lib/holo/index';
import type { RecordResult, ScalarResult } from '../../../src/lib/lang/result';
import { Pad } from './pad';

describe('growth says when there is no linear regime', () => {
	it('a narrow strip (l = 2 zh): linear_regime = 0 and the note calls the slope only the largest one', () => {
		const r = new Pad().run('use vaidya d=3 zh=1; growth l=2').results[1] as RecordResult;
		expect(r.fields?.linear_regime).toBe(0);
		expect(r.note).toMatch(/too narrow for a linear regime/);
		expect(r.note).not.toMatch(/expected 2 v_E/);
		// the slope itself is still the engine's largest slope (33 % below 2 v_E here, Liu & Suh 2014)
		expect(r.fields?.slope).toBe(holo.analyseGrowth(3, 1, 2).linear.slope);
		expect(Number(r.fields?.slope)).toBeLessThan(0.8 * Number(r.fields?.slope_expected));
	});
	it('a wide strip (l = 20 zh): linear_regime = 1 and the slope is compared with 2 v_E', () => {
		const r = new Pad().run('use vaidya d=4 zh=1; growth l=20').results[1] as RecordResult;
		expect(r.fields?.linear_regime).toBe(1);
		expect(r.note).toMatch(/expected 2 v_E/);
		expect(Math.abs(Number(r.fields?.slope) / Number(r.fields?.slope_expected) - 1)).toBeLessThan(1e-3);
	});
	it('growth l=1e-9 at d=6 is refused with the reason, not answered with a meaningless slope', () => {
		const e = new Pad().fail('use vaidya d=6; growth l=1e-9');
		expect(e.message).toMatch(/growth needs l ≥ 1e-8 zh/);
	});
	it('growth l=50 at d=4 answers (the default vaidya zh = 1), with the tsunami slope', () => {
		const r = new Pad().run('use vaidya d=4; growth l=50').results[1] as RecordResult;
		expect(r.fields?.linear_regime).toBe(1);
		expect(Math.abs(Number(r.fields?.slope) / Number(r.fields?.slope_expected) - 1)).toBeLessThan(1e-3);
	});
});

describe('absurdly small widths and times', () => {
	it('darea l=1e-300 t=1e-300: saturated (t ≥ t_sat), the brane’s own number, not "width too large"', () => {
		const p = new Pad();
		const v = (p.run('use vaidya d=2; darea l=1e-300 t=1e-300').results[1] as ScalarResult).value;
		const brane = (p.run('use brane d=2 zh=1; darea l=1e-300').results[1] as ScalarResult).value;
		expect(v).toBe(brane);
	});
	it('before saturation below the range: an error naming the range and the (m/2)t² scale', () => {
		const e = new Pad().fail('use vaidya d=3; darea l=1e-300 t=1e-302');
		expect(e.message).toMatch(/below the quench solver's range/);
		expect(e.hint ?? '').toMatch(/\(m\/2\)t²/);
		expect(e.hint ?? '').not.toMatch(/too large/);
		// d = 4: t_sat ≈ z* = l/W₀ > t here, and (m/2)t² underflows: said so, not printed as 0
		const u = new Pad().fail('use vaidya d=4; darea l=1e-300 t=1e-300');
		expect(u.hint ?? '').toMatch(/below the smallest double/);
	});
	it('t_sat of a narrow strip keeps its digits (d = 3, l = 1e−7 zh: t_sat ≈ z*, not (d−1)/d of it)', () => {
		const r = holo.hrtDeltaArea(3, 1, 1e-7, 1e-7);
		const zstar = 1e-7 / 1.1981402347355923; // vacuum tip l/W₀ (Ryu & Takayanagi 2006), W₀(d=3) from memory
		expect(Math.abs(r.tsat / zstar - 1)).toBeLessThan(1e-6);
	});
});
