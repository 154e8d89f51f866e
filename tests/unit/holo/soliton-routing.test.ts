// The public strip functions on the AdS soliton go through its two surfaces: the RT area is the smaller of
// the connected and disconnected ones (common practice for confining backgrounds; the transition is the one
// checked in tests/unit/holo/analysis against mpmath).
import { describe, expect, it } from 'vitest';
import { areaFinite, deltaArea, makeBulk, vacuumAreaFinite, zstarOf, HoloError } from '../../../src/lib/holo/index';
import { solitonCriticalWidth, solitonDisconnectedArea, solitonConnectedArea } from '../../../src/lib/holo/analysis';

describe('soliton through the public strip functions', () => {
	const P = { d: 4, z0: 1 };
	const bulk = makeBulk('soliton', P);
	const { lc, lmax } = solitonCriticalWidth(P);

	it('answers the connected area below the critical width and the disconnected one above it', () => {
		const below = 0.8 * lc;
		expect(areaFinite(bulk, below)).toBeCloseTo(solitonConnectedArea(P, zstarOf(bulk, below)), 12);
		expect(areaFinite(bulk, below)).toBeLessThan(solitonDisconnectedArea(P));
		for (const l of [1.01 * lc, lmax, 2 * lmax]) expect(areaFinite(bulk, l)).toBe(solitonDisconnectedArea(P));
	});

	it('keeps ΔA = A_fin − A_fin(vacuum) on both sides', () => {
		for (const l of [0.5 * lc, 3 * lmax]) expect(deltaArea(bulk, l)).toBeCloseTo(areaFinite(bulk, l) - vacuumAreaFinite(4, l), 12);
	});

	it('says there is no connected turning point past l_max', () => {
		expect(() => zstarOf(bulk, 1.1 * lmax)).toThrow(HoloError);
	});
});
