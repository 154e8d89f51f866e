import { describe, expect, it } from 'vitest';
import { hrtProfile, makeBulk, staticProfile, zstarOf } from '../../../src/lib/holo/index';
import { expectAbs, expectRel } from './check';

describe('surface profiles', () => {
	it('HRT profiles reach the boundary at x = l/2 and v = t (the width and time integrals, traced)', () => {
		for (const [d, l, t] of [
			[2, 2, 0.7],
			[3, 2, 1.0],
			[3, 2, 1.48],
			[4, 3, 2.0], // climbs behind the horizon before turning back
			[4, 4, 3.2] // a critical winner (climb.ts criticalTail)
		]) {
			const r = hrtProfile(d, 1, l, t);
			const end = r.points[r.points.length - 1];
			expectRel(`x end d=${d} l=${l} t=${t}`, l / 2, end.x, 1e-8, 'the profile integrates dx/dz of the same surface');
			expectRel(`v end d=${d} l=${l} t=${t}`, t, end.v!, 1e-8, 'boundary time t = v at z = 0');
			expectAbs(`z end`, 0, end.z, 1e-12, 'boundary');
			// no point outside the bulk: the boundary end is z = 0, not an ulp beyond it (a table shows every digit)
			for (const p of r.points) expect(p.z).toBeGreaterThanOrEqual(0);
			expectRel(`tip`, r.answer.winner.zstar, r.points[0].z, 1e-14, 'tip at z*');
			// inside the shell the surface lies on v + z = z_c (pure AdS before the shell: PHYSICS.md)
			expect(r.points[0].v!).toBeLessThan(0);
		}
		expect(hrtProfile(4, 1, 3, 2.0).answer.winner.behindHorizon).toBe(true);
	});
	it('a saturated profile is the brane surface on v = t − ∫dz/f; before the quench the vacuum one', () => {
		const r = hrtProfile(3, 1, 2, 3);
		expect(r.answer.winner.kind).toBe('static');
		expectRel('tip v', 3 - r.answer.tsat, r.points[0].v!, 1e-6, 'v* = t − t_sat by definition of t_sat');
		const b = hrtProfile(3, 1, 2, -1);
		expectRel('vacuum tip', 2 / 1.1981402347355923, b.points[0].z, 1e-6, 'l = W₀ z*, W₀(d=3) = 2√π Γ(3/4)/Γ(1/4)');
	});
	it('static profiles in any bulk end at x = l/2 and start at the solver’s z*', () => {
		for (const [name, p] of [
			['brane', { d: 4, zh: 1 }],
			['boosted', { d: 4, zh: 1, v: 0.5 }],
			['wave', { d: 3, zp: 1 }],
			['charged', { d: 4, zh: 1, q: 0.5 }]
		] as const) {
			const bulk = makeBulk(name, p as Record<string, number>);
			const pr = staticProfile(bulk.slice, 1.2, 80);
			expectRel(`${name} tip`, zstarOf(bulk, 1.2), pr.zstar, 1e-14, 'solveStrip');
			// the traced width before the last point is pinned: the second to last point is close to x = l/2
			const before = pr.points[pr.points.length - 2];
			expect(before.x).toBeLessThan(0.6);
			expect(before.x).toBeGreaterThan(0.55);
			for (let i = 1; i < pr.points.length; i++) expect(pr.points[i].x).toBeGreaterThanOrEqual(pr.points[i - 1].x);
		}
	});
});
