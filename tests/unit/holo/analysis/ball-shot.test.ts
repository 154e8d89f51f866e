import { describe, it, expect } from 'vitest';
import { ballDeltaArea, ballDeltaAreaSweep, ballTip, sphereArea } from '../../../../src/lib/holo/ball';
import { ballDeltaAreaByW, ballTipByW, shootBall } from '../../../../src/lib/holo/ball-w';
import { shootBallTip } from '../../../../src/lib/holo/ball-shot';
import { expectRel } from '../check';
import fixture from '../../../fixtures/holo/ball.json';

describe('exact ball ΔA, one shot per Newton step (ball-shot.ts)', () => {
	it('matches the independent mpmath evaluation (direct subtraction of cut-off areas, Richardson in the cutoff; tests/fixtures/holo/ball_runner.py), d = 3…5, R/zh 0.1…3', () => {
		expect(fixture.cases.length).toBeGreaterThanOrEqual(18);
		for (const c of fixture.cases) {
			const R = Number(c.R);
			const ref = Number(c.deltaArea);
			// the fixture's own error estimate (last Richardson step) is part of the tolerance where it is larger
			const tol = Math.max(1e-9, 10 * c.richardsonStep);
			expectRel(`ball d=${c.d} R=${R} zh=${c.zh}`, ref, ballDeltaArea(c.d, R, c.zh).value, tol, 'mpmath fixture');
		}
	});

	it('agrees with the w-integral of ∂_w A (ball-w.ts, the earlier method; common practice: two methods)', () => {
		for (const [d, R] of [
			[3, 0.5],
			[4, 1],
			[5, 2]
		]) {
			expectRel(`ball d=${d} R=${R}`, ballDeltaAreaByW(d, R, 1).value, ballDeltaArea(d, R, 1).value, 1e-9, 'ball-w.ts');
			expectRel(`tip d=${d} R=${R}`, ballTipByW(d, R, 1), ballTip(d, R, 1), 1e-10, 'ball-w.ts (Brent on the same map)');
		}
	}, 120_000);

	it('lands where the old shooting lands, and dR/dτ equals a central difference of two shots (derived; variational equations)', () => {
		const d = 4;
		const tau = 0.5;
		const a = shootBallTip(d, tau, 1 - tau);
		expectRel('R̂(τ=0.5) vs ball-w shootBall', shootBall(d, tau, 1).R, a.R, 1e-10, 'ball-w.ts');
		const h = 1e-5;
		const up = shootBallTip(d, tau + h, 1 - tau - h);
		const dn = shootBallTip(d, tau - h, 1 - tau + h);
		expectRel('dR̂/dτ', (up.R - dn.R) / (2 * h), a.dR, 1e-6, 'central difference');
		expectRel('dK/dτ', (up.K - dn.K) / (2 * h), a.dK, 1e-6, 'central difference');
	});

	it('a sweep started from its neighbours answers what cold balls answer', () => {
		const Rs = [0.3, 0.6, 0.9, 1.2, 1.5];
		const warm = ballDeltaAreaSweep(4, Rs, 1);
		Rs.forEach((R, i) => expectRel(`sweep R=${R}`, ballDeltaArea(4, R, 1).value, warm[i], 1e-11, 'same ball, cold start'));
	});

	it('small balls in large d use ΔA⁽¹⁾(1 + b (R/zh)^d) and join the shot continuously (BCHM 2013 for the first order)', () => {
		for (const d of [6, 8, 10]) {
			const om = sphereArea(d - 2);
			const small = ballDeltaArea(d, 0.2, 1);
			expect(small.value / small.firstOrder - 1, `d=${d}`).toBeLessThan(0);
			expect(small.value / small.firstOrder - 1, `d=${d}`).toBeGreaterThan(-1e-3);
			// just below and just above the switch (R/zh)^d = 1e-4 (d ≥ 6)
			const x = Math.pow(1e-4, 1 / d);
			const ratio = (R: number) => {
				const r = ballDeltaArea(d, R, 1);
				return r.value / r.firstOrder;
			};
			// the shot's own error at (R/zh)^d = 1e-4 grows with d (ball-shot.ts, accuracy): ~1e-9 at d = 8, 3e-8 at 10
			const tol = d < 8 ? 1e-9 : d < 10 ? 3e-9 : 5e-8;
			expectRel(`d=${d} ΔA/ΔA⁽¹⁾ across the switch`, ratio(x * (1 - 1e-9)), ratio(x * (1 + 1e-9)), tol, 'continuity');
			expect(om).toBeGreaterThan(0);
		}
	});

	it('refuses what it cannot answer, naming the key', () => {
		expect(() => ballDeltaArea(4, -1, 1)).toThrow(/R must be > 0/);
		expect(() => ballDeltaArea(4, 40, 1)).toThrow(/too large/);
		expect(() => ballDeltaArea(2, 1, 1)).toThrow(/3 ≤ d ≤ 10/);
	});
});
