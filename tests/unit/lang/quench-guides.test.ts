/**
 * Plot guides of a growth sweep (`sweep darea l=… t=…` in vaidya): the data the paper helper draws. Sources:
 * the thermal value is the static brane's ΔA (PHYSICS.md, "Quench": late times equal the brane); the early law
 * ΔA → (m/2) t², m = zh^{−d}, and the linear slope 2 v_E/zh^{d−1} with v_E = (η−1)^{(η−1)/2}/η^{η/2},
 * η = 2(d−1)/d (Liu & Suh, PRD 89 (2014) 066012).
 */
import { describe, expect, it } from 'vitest';
import * as holo from '../../../src/lib/holo/index';
import type { ScalarResult, TableResult } from '../../../src/lib/lang/result';
import { expectRel } from '../holo/check';
import { labelRuns } from '../../../src/lib/client/figure/texlabel';
import { Pad } from './pad';

const vE = (d: number) => {
	const eta = (2 * (d - 1)) / d;
	return Math.pow(eta - 1, (eta - 1) / 2) / Math.pow(eta, eta / 2);
};

function guidesOf(line: string) {
	const out = new Pad().run(line);
	const t = out.results.find((r) => r.kind === 'table') as TableResult;
	return { table: t, guides: t.plot?.guides ?? [] };
}

describe('growth sweep guides', () => {
	// enough points that each guide's window holds two of them (d = 2 grows linearly over a short stretch only)
	for (const [d, zh, l, t1, n] of [
		[3, 1, 2, 3, 13],
		[2, 1, 2, 2, 41],
		[4, 2, 3, 6, 13] // zh ≠ 1: every guide scales (ΔA ∝ zh^{2−d}, t ∝ zh)
	] as const) {
		it(`d=${d} zh=${zh} l=${l}: thermal value, early law and linear line`, () => {
			const { table, guides } = guidesOf(`use vaidya d=${d} zh=${zh}; sweep darea l=${l} t=0..${t1}:${n}`);
			expect(table.plot?.show).toBe(true);
			expect(guides.map((g) => g.label)).toEqual(['\\Delta A_{\\text{thermal}}', '(m/2)\\,t^2', '2 v_E\\, t / z_h^{d-1}']);
			// every label is one the figures can set (no command printed as its name, as \\tfrac once was)
			for (const g of guides)
				expect(
					labelRuns(g.label)
						.map((r) => r.text)
						.join('')
				).not.toMatch(/frac|\\/);
			const [thermal, early, linear] = guides;

			// every guide sits at the sweep's own times (so chunks of a split sweep join into the whole one)
			const times = table.rows.map((r) => r[0] as number);
			for (const g of guides) for (const [t] of g.points) expect(times).toContain(t);

			// thermal: the brane's own ΔA(l), at every plotted time
			const brane = (new Pad().run(`use brane d=${d} zh=${zh}; darea l=${l}`).results[1] as ScalarResult).value;
			expect(thermal.points).toEqual(times.map((t) => [t, brane]));
			// and the sweep's last row (saturated) is that value
			expect(table.rows[table.rows.length - 1][1]).toBe(brane);

			// early: (m/2) t² on the early part only (t ≤ zh/2), and the engine's curve follows it there
			const m = Math.pow(zh, -d);
			for (const [t, y] of early.points) expectRel(`(m/2)t² at t=${t}`, 0.5 * m * t * t, y, 1e-15, 'Liu & Suh 2014');
			expect(early.points.length).toBeGreaterThanOrEqual(2);
			for (const [t] of early.points) expect(t).toBeLessThanOrEqual(zh / 2 + 1e-15);
			expect(early.points[0]).toEqual([0, 0]);
			const tiny = 0.002 * zh;
			expectRel('engine at small t', 0.5 * m * tiny * tiny, holo.hrtDeltaArea(d, zh, l, tiny).dA, 1e-2, 'Liu & Suh 2014 (early law)');

			// linear: slope 2 v_E/zh^{d−1}, touching the curve at its steepest point, between ΔA = 0 and the thermal value
			expect(linear.points.length).toBeGreaterThanOrEqual(2);
			const [xa, ya] = linear.points[0];
			const [xb, yb] = linear.points[linear.points.length - 1];
			expectRel('slope', (2 * vE(d)) / Math.pow(zh, d - 1), (yb - ya) / (xb - xa), 1e-12, 'Liu & Suh 2014');
			const g = holo.growthGuides(d, zh, l, times);
			const gr = holo.analyseGrowth(d, zh, l);
			expectRel('touch time', gr.linear.atTime, g.touch.t, 1e-15, 'growth’s steepest point');
			expectRel(
				'touches the curve',
				holo.hrtDeltaArea(d, zh, l, g.touch.t).dA,
				ya + ((yb - ya) * (g.touch.t - xa)) / (xb - xa),
				1e-9,
				'the line passes through the curve there'
			);
			for (const [, y] of linear.points) {
				expect(y).toBeGreaterThanOrEqual(-1e-12 * brane);
				expect(y).toBeLessThanOrEqual(brane * (1 + 1e-12));
			}
		});
	}
	it('only for a sweep over t in vaidya', () => {
		expect(guidesOf('use vaidya d=3; sweep darea l=1..2:3 t=1').guides).toEqual([]);
		expect(guidesOf('use brane d=3; sweep darea l=1..2:3').guides).toEqual([]);
		expect(guidesOf('use vaidya d=3; sweep zstar l=2 t=0..2:5').guides).toEqual([]);
	});
});
