import { describe, expect, it } from 'vitest';
import { makeBulk, seriesRadiusEstimate, seriesValues, seriesWarning, validity } from '$lib/holo/index';
import { radiusEstimate } from '$lib/holo/series/radius';
import ref from '../../fixtures/holo/radius.json';
import { expectRel } from './check';

type Ref = { a: string[]; radius_tau: string; radius_l: string; uncertainty_rel: string };
const R = ref as unknown as Record<string, Ref>;

describe('radius of convergence of the brane series (issue 11, item 3)', () => {
	it('d = 2: 2π zh exactly — ΔA = 2 ln(sinh x / x), x = l/(2zh), is singular where sinh x = 0, x = iπ (Calabrese & Cardy, J. Stat. Mech. (2004) P06002)', () => {
		for (const zh of [1, 2.5]) {
			const e = seriesRadiusEstimate(makeBulk('brane', { d: 2, zh }));
			expectRel(`d=2 zh=${zh} radius`, 2 * Math.PI * zh, e.radius, 1e-4, 'BTZ closed form');
			expect(Math.abs(e.radius - 2 * Math.PI * zh)).toBeLessThanOrEqual(e.uncertainty);
		}
		expect(Number(R['2'].radius_l)).toBeCloseTo(2 * Math.PI, 14);
	});

	it('d = 3, 4, 6, 10: within 1e-3 (measured ≲ 1e-5) of the order-80 references, inside the stated uncertainty (derived, checked against an independent mpmath evaluation in the fixture runner radius_runner.py)', () => {
		for (const d of [3, 4, 6, 10]) {
			const r = R[String(d)];
			expect(Number(r.uncertainty_rel)).toBeLessThan(1e-8); // the reference's own spread
			const e = seriesRadiusEstimate(makeBulk('brane', { d, zh: 1 }));
			const exact = Number(r.radius_l);
			expectRel(`brane d=${d} radius in l/zh`, exact, e.radius, 1e-4, 'order-80 Domb–Sykes, mpmath');
			expect(Math.abs(e.radius - exact), `d=${d}: error ${e.radius - exact}, stated ±${e.uncertainty}`).toBeLessThanOrEqual(e.uncertainty);
			expect(e.uncertainty / e.radius).toBeLessThan(1e-3);
		}
	});

	it("the order-80 runner's first coefficients agree with the engine's closed-form a_k (two independent expansions)", () => {
		for (const d of [2, 3, 4, 6, 10]) {
			const a = seriesValues(makeBulk('brane', { d, zh: 1 }), 14);
			// measured: the engine's double-precision a_14 at d = 3 is off by 1.4e-11 relative, the rest ≤ 1e-11
			a.forEach((x, i) => expectRel(`d=${d} a_${i + 1}`, Number(R[String(d)].a[i]), x, i < 12 ? 1e-11 : 5e-11, 'radius_runner.py'));
		}
	});

	it('issue case: no "beyond the radius" warning on a converging series just below the radius (d = 4 at l = 0.697, d = 10 at l = 0.2650)', () => {
		for (const [d, l] of [
			[4, 0.697],
			[10, 0.265]
		]) {
			const w = seriesWarning(makeBulk('brane', { d, zh: 1 }), l, 12) ?? '';
			expect(w, w).not.toMatch(/beyond the series' radius/);
		}
		const w = seriesWarning(makeBulk('brane', { d: 4, zh: 1 }), 0.71, 12) ?? '';
		expect(w).toMatch(/beyond the series' radius of convergence \(0\.6989 ± /);
	});

	it('validity reports radius_err; a sequence without a sign pattern falls back to the root test with a wide uncertainty', () => {
		const v = validity(makeBulk('brane', { d: 4, zh: 1 }), 3, 1e-3);
		expect(v.radius_err).toBeGreaterThan(0);
		expect(v.radius_err / v.radius).toBeLessThan(1e-3);
		const e = radiusEstimate([1, 0.5, -0.3, -0.2, 0.1, 0.05, -0.02, 0.01, 0.01, -0.004]);
		expect(e.method).toBe('root');
		expect(e.uncertainty).toBeGreaterThan(0.1 * e.radius - 1e-15);
	});
});
