import { describe, it, expect } from 'vitest';
import { makeBulk } from '$lib/holo/index';
import { mutualInformation, criticalGapRatio, makeSolitonBulk } from '$lib/holo/analysis';
import { expectRel } from '../check';

describe('mutual information', () => {
	it('d = 2 vacuum: I vanishes for s/l ≥ √2 − 1 (Headrick, PRD 82 (2010) 126010)', () => {
		const b = makeBulk('vacuum', { d: 2 });
		for (const l of [0.3, 1, 5]) {
			const r = mutualInformation(b, l, 0.2 * l);
			expectRel(`vacuum d=2 l=${l} gap_crit/l`, Math.SQRT2 - 1, r.gapCrit, 1e-12, 'Headrick 2010');
			expectRel(`vacuum d=2 l=${l} gap=0.2l: I = 2 ln(l²/((2l+s)s))`, 2 * Math.log(1 / (2.2 * 0.2)), r.I, 1e-12, 'Headrick 2010');
			expect(mutualInformation(b, l, 0.42 * l).I).toBe(0);
		}
	});

	it('d = 4 vacuum: s_c/l solves (2+x)^{−2} + x^{−2} = 2 (derived from the Ryu–Takayanagi area l^{2−d})', () => {
		const x = criticalGapRatio(makeBulk('vacuum', { d: 4 }), 1);
		expectRel('vacuum d=4 gap_crit/l residual', 2, Math.pow(2 + x, -2) + Math.pow(x, -2), 1e-12, 'derived');
	});

	it('brane: the critical gap ratio falls with l (thermal entropy is extensive) and I ≥ 0 (common practice)', () => {
		const b = makeBulk('brane', { d: 4, zh: 1 });
		const r = [0.2, 0.6, 1.2].map((l) => criticalGapRatio(b, l));
		expect(r[0] > r[1] && r[1] > r[2], `gap_crit/l at l = 0.2, 0.6, 1.2: ${r}`).toBe(true);
		expect(mutualInformation(b, 1, 0.1).I > 0).toBe(true);
	});

	it('soliton: the minimum over connected/disconnected surfaces enters S(2l+s) (exact numerics)', () => {
		const r = mutualInformation(makeSolitonBulk({ d: 4, z0: 1 }), 0.2, 0.05);
		expect(r.I > 0 && Number.isFinite(r.gapCrit), JSON.stringify(r)).toBe(true);
	});
});
