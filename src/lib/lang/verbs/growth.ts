import type { PlotGuide } from '../result';
import { defineVerb, type Point } from './types';

export const growth = defineVerb({
	name: 'growth',
	kind: 'record',
	forms: { strip: { keys: ['l'], required: ['l'] } },
	symbol: { text: 'growth', tex: '' },
	help: {
		summary: 'vaidya: how ΔA(t) of a strip grows after the quench — early law, linear slope, t_c, saturation, kink',
		method:
			'the family of HRT surfaces at this width (holo/vaidya): early ΔA/t² Richardson-extrapolated to t → 0; the largest dΔA/dt = 2|E|/z*^{d−1} before saturation; t_c = ∫dz/f on the static surface; saturation where the rising surface’s ΔA meets the static one',
		accuracy:
			'early coefficient ≤ 1e-6 relative of m/2; t_c and the d = 2 saturation time ≤ 1e-12 relative (tests/unit/holo/vaidya.test.ts); at l = 20 zh the slope is 2 v_E to ≤ 1e-3 in d = 3, 4 (vaidya-wide.test.ts); below l = 10 zh there is no linear regime and the record says so (linear_regime = 0); l ≥ 1e-8 zh',
		source: 'Liu & Suh, PRD 89 (2014) 066012; Balasubramanian et al., PRD 84 (2011) 026010',
		examples: ['use vaidya d=3; growth l=2', 'use vaidya d=2 zh=1; growth l=4']
	},
	at: (p) => {
		if (p.bulk.name !== 'vaidya') {
			throw new p.holo.HoloError(`growth is for the quench bulk vaidya (got ${p.bulk.name})`, 'bulk', 'use vaidya d=3 zh=1');
		}
		const g = p.holo.analyseGrowth(p.bulk.d, p.bulk.horizon!, p.q.l!);
		return {
			fields: {
				early: g.early.coefficient,
				early_expected: g.early.predicted,
				slope: g.linear.slope,
				slope_expected: g.linear.predicted,
				v_E: g.linear.vE,
				linear_regime: g.linear.regime ? 1 : 0,
				t_slope: g.linear.atTime,
				t_c: g.tc.value,
				t_sat: g.saturation.time,
				dA_sat: g.saturation.dA,
				continuous: g.kind.continuous ? 1 : 0,
				slope_before_sat: g.kind.slopeBefore
			},
			note: [
				`early = ${g.early.how}; expected m/2`,
				g.linear.regime ? `slope: ${g.linear.how}; expected 2 v_E/zh^{d−1}` : `slope (no linear regime): ${g.linear.how}`,
				g.tc.how,
				`t_sat: ${g.saturation.how}`,
				g.kind.how
			].join('. ')
		};
	}
});

/**
 * The plot guides of a growth curve (`sweep darea l=… t=…` in vaidya): the thermal value, the early law (m/2)t² and
 * the linear-growth line at slope 2 v_E/zh^{d−1} (PHYSICS.md, "Quench"). Only for a sweep over t in vaidya.
 */
export function growthGuides(p: Point, xKey: string, xs: number[]): PlotGuide[] | undefined {
	if (p.bulk.name !== 'vaidya' || xKey !== 't' || p.shape !== 'strip' || xs.length < 2) return undefined;
	const g = p.holo.growthGuides(p.bulk.d, p.bulk.horizon!, p.q.l!, xs);
	// always the three, in this order, even with no point in range: a sweep split into chunks joins them by label
	return [
		{ label: '\\Delta A_{\\text{thermal}}', points: g.thermal },
		{ label: '(m/2)\\,t^2', points: g.early },
		{ label: '2 v_E\\, t / z_h^{d-1}', points: g.linear }
	];
}
