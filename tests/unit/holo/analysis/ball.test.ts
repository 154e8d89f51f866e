import { describe, it, expect } from 'vitest';
import { ballVacuumAreaFinite, ballDeltaArea, ballDeltaAreaFirstOrder, ballTent, ballEnergy, sphereArea } from '$lib/holo/analysis';
import { expectRel, expectAbs } from '../check';
import ref from '../../../fixtures/holo/analysis/reference.json';

describe('ball', () => {
	it('vacuum finite part against a direct mpmath integration minus divergences (fixture); d = 3 gives −2π (Ryu & Takayanagi, JHEP 08 (2006) 045)', () => {
		for (const r of ref.ball_vacuum)
			expectRel(`ball vacuum d=${r.d} A_fin`, r.areaFinite, ballVacuumAreaFinite(r.d), 1e-13, 'mpmath fixture');
		expectRel('ball vacuum d=3 A_fin', -2 * Math.PI, ballVacuumAreaFinite(3), 1e-15, 'RT 2006');
	});

	it('first law T = ΔE/ΔS⁽¹⁾ = (d+1)/(2πR) (Blanco, Casini, Hung & Myers, JHEP 08 (2013) 060)', () => {
		for (const d of [3, 4, 5, 6]) {
			for (const R of [0.1, 0.7]) {
				const G = 0.3;
				const dS = ballDeltaAreaFirstOrder(d, R, 1.3) / (4 * G);
				expectRel(`ball d=${d} R=${R}: ΔE/ΔS⁽¹⁾`, ballTent(d, R), ballEnergy(d, R, 1.3, G) / dS, 1e-14, 'BCHM 2013');
			}
		}
	});

	it('exact ΔA → first-order value at small R, with a relative correction ∝ R^d (BCHM 2013 for the first order; derived; exact numerics)', () => {
		for (const d of [3, 4]) {
			const c = [0.05, 0.1, 0.2].map((R) => {
				const r = ballDeltaArea(d, R, 1);
				return (r.value / r.firstOrder - 1) / Math.pow(R, d);
			});
			// the R^d-scaled correction must tend to a constant (second order of the series)
			expect(
				c.every((x) => x < 0),
				`d=${d}: (ΔA/ΔA⁽¹⁾ − 1)/R^d = ${c}`
			).toBe(true);
			expectRel(`ball d=${d}: (ΔA/ΔA⁽¹⁾ − 1)/R^d at R=0.05 vs R=0.1`, c[1], c[0], 1e-2, 'second-order term dominates');
		}
	}, 120_000);

	it('exact ΔA is stable under halving the ODE tolerance and between the 16- and 24-node w-rules (common practice)', () => {
		for (const R of [0.5, 2]) {
			const a = ballDeltaArea(4, R, 1, 1e-12);
			const b = ballDeltaArea(4, R, 1, 5e-13);
			expectRel(`ball d=4 R=${R} ΔA rtol 1e-12 vs 5e-13`, b.value, a.value, 1e-9, 'self-consistency');
			expect(a.error / a.value < 1e-9, `w-rule error ${a.error}`).toBe(true);
		}
	}, 120_000);

	it('large R: ΔA approaches the thermal volume law s·Vol = Ω R^{d−1}/((d−1) zh^{d−1}) from below (PHYSICS.md, large-l check)', () => {
		const d = 3;
		const R = 4;
		const vol = (sphereArea(d - 2) * Math.pow(R, d - 1)) / (d - 1);
		const r = ballDeltaArea(d, R, 1);
		expect(r.value < vol && r.value > 0.6 * vol, `ΔA=${r.value}, volume law ${vol}`).toBe(true);
		expectAbs('Ω_1', 2 * Math.PI, sphereArea(1), 1e-15, 'definition');
	}, 120_000);
});
