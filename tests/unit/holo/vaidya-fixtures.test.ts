import { describe, expect, it } from 'vitest';
import { clearQuenchCache, hrtDeltaArea } from '../../../src/lib/holo/index';
import { emptyContext, runLine } from '../../../src/lib/lang/evaluate';
import type { ScalarResult } from '../../../src/lib/lang/result';
import fx from '../../fixtures/holo/vaidya.json';
import { expectRel } from './check';

type Row = (typeof fx.rows)[number];

/** Every family surface of the answer against the runner's, matched in order of ΔA. */
function expectSurfacesOfRow(a: ReturnType<typeof hrtDeltaArea>, r: Row): void {
	const shells = a.surfaces.filter((s) => s.kind === 'shell').sort((x, y) => x.dA - y.dA);
	const ref = [...r.surfaces].sort((x, y) => Number(x.dA) - Number(y.dA));
	expect(shells.length).toBe(ref.length);
	shells.forEach((s, i) => {
		expectRel(`surface ${i} ΔA`, Number(ref[i].dA), s.dA, 1e-8, 'mpmath runner');
		expectRel(`surface ${i} z*`, Number(ref[i].zstar), s.zstar, 1e-8, 'mpmath runner');
	});
}

/**
 * The quench engine against its independent reference: tests/fixtures/holo/vaidya_runner.py (mpmath at 24
 * digits, tanh-sinh in z, every extremal surface found from scratch). Through the public API (the engine's
 * hrtDeltaArea and a pad line `darea l=… t=…`): ΔA of the winner to ≤ 1e-8 relative, and every competing surface
 * the runner found is found here too.
 */
describe('quench against the mpmath runner (tests/fixtures/holo/vaidya_runner.py)', () => {
	it('the fixture covers d = 2, 3, 4, widths 1–4 (and 5–10 at d = 3, 4) and times where three surfaces compete', () => {
		// all 22 of the runner's cases, with the strips whose competing surfaces climb behind the horizon next to the
		// family's edge (d = 3, l = 4 and d = 4, l = 3 near saturation), d = 4, l = 4 early, and the wide strips
		// (d = 3: l = 6, 8, 10, early, linear regime and three surfaces near saturation; d = 4: l = 5, 6) whose
		// winners are critical surfaces (climb.ts) in the linear regime
		expect(fx.rows.length).toBe(22);
		expect(fx.rows.some((r) => r.d === 4 && r.l === 4)).toBe(true);
		expect(fx.rows.filter((r) => r.l >= 3 && r.count >= 3).length).toBeGreaterThanOrEqual(3);
		expect(fx.rows.filter((r) => r.l >= 5).length).toBe(7);
		expect(fx.rows.filter((r) => r.d === 4 && r.l >= 5).length).toBe(3);
		expect([...new Set(fx.rows.map((r) => r.d))].sort()).toEqual([2, 3, 4]);
		expect([...new Set(fx.rows.map((r) => r.l))].sort((a, b) => a - b)).toEqual([1, 2, 3, 4, 5, 6, 8, 10]);
		expect(fx.rows.filter((r) => r.count >= 3).length).toBeGreaterThanOrEqual(2);
	});
	it('the runner itself: its d = 2 static column is the thermal closed form, its t_sat is l/2', () => {
		// 2 ln((2 zh/l) sinh(l/(2 zh))) and saturation at exactly t = l/2 in BTZ (Balasubramanian et al. 2011;
		// PHYSICS.md "Quench"): a check of the reference's own quadrature next to the horizon, independent of the engine
		const btz = fx.rows.filter((r) => r.d === 2);
		expect(btz.length).toBeGreaterThanOrEqual(3);
		for (const r of btz) {
			const thermal = 2 * Math.log((2 / r.l) * Math.sinh(r.l / 2));
			expectRel(`runner static d=2 l=${r.l}`, thermal, Number(r.static), 1e-14, 'Balasubramanian et al. 2011');
			expectRel(`runner t_sat d=2 l=${r.l}`, r.l / 2, Number(r.tsat), 1e-15, 'Balasubramanian et al. 2011');
		}
	});
	for (const r of fx.rows) {
		it(`d=${r.d} l=${r.l} t=${r.t} (${r.count} surface${r.count > 1 ? 's' : ''})`, () => {
			const a = hrtDeltaArea(r.d, 1, r.l, Number(r.t));
			expectRel(`ΔA d=${r.d} l=${r.l} t=${r.t}`, Number(r.dA), a.dA, 1e-8, 'mpmath runner');
			const line = runLine(`use vaidya d=${r.d} zh=1; darea l=${r.l} t=${r.t}`, emptyContext());
			const v = line.results[1] as ScalarResult;
			expectRel(`pad line ΔA d=${r.d} l=${r.l} t=${r.t}`, Number(r.dA), v.value, 1e-8, 'mpmath runner');
			expect(v.fields?.surfaces).toBe(r.count);
			expect(a.surfaces.length).toBe(r.count);
			expectSurfacesOfRow(a, r);
			if (Number(r.t) >= Number(r.tsat)) {
				const st = a.surfaces.find((s) => s.kind === 'static');
				expect(st).toBeDefined();
				expectRel('static ΔA', Number(r.static), st!.dA, 1e-10, 'mpmath runner');
			}
		});
	}
});

/**
 * The same rows from a cold cache: a single point builds only the grid of its width's family curve and refines it
 * and locates its folds only near its own time (curve.ts), so every row alone must still find every surface the
 * runner found — including the near-saturation rows where three compete.
 */
describe('quench cold points against the mpmath runner (nothing cached before each row)', () => {
	for (const r of fx.rows) {
		it(`d=${r.d} l=${r.l} t=${r.t} cold`, () => {
			clearQuenchCache();
			const a = hrtDeltaArea(r.d, 1, r.l, Number(r.t));
			expectRel(`ΔA d=${r.d} l=${r.l} t=${r.t}`, Number(r.dA), a.dA, 1e-8, 'mpmath runner');
			expect(a.surfaces.length).toBe(r.count);
			expectSurfacesOfRow(a, r);
		});
	}
});
