import { describe, expect, it } from 'vitest';
import { surfaceExists } from '../../../src/lib/holo/vaidya/family';
import { surfaceForWidth } from '../../../src/lib/holo/vaidya/solve';
import { expectRel } from './check';

/**
 * The tip solve at fixed (l, ζ) next to the family's edge (holo/vaidya/solve.ts): climbing surfaces of a d = 4,
 * l = 4 strip have their tip within 1e−6…1e−10 of the edge, where the width diverges logarithmically. Derived: the
 * width is an integral of the surface (family.ts), checked against mpmath in vaidya-fixtures.test.ts; here the
 * solver must hit the asked width on the side of the edge where the surface exists.
 */
describe('tip solve next to the family edge', () => {
	for (const zeta of [0.3098, 0.4527]) {
		it(`d=4 l=4 ζ=${zeta}: width hit, tip just inside the edge`, () => {
			const s = surfaceForWidth(4, 4, zeta, 4);
			expect(s).not.toBeNull();
			// one ulp of z* moves ln l by ~3e−8 this close to the edge, so a solve in z* hit the width only to that
			// quantum; labelled by λ (climb.ts) the surface has exactly the asked width
			expectRel('width', 4, s!.l, 1e-13, 'the asked width');
			expect(s!.critical?.branch).toBe('climb');
			expect(s!.a).toBeGreaterThan(1); // a climbing surface
			expect(surfaceExists(4, s!.zstar, zeta)).toBe(true);
			// one part in 1e−6 wider in the tip is already past the edge: the log map's regime
			expect(surfaceExists(4, s!.zstar * (1 + 1e-6), zeta)).toBe(false);
		});
	}
});
