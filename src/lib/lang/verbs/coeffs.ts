import { requireSeries } from './point';
import { defineVerb } from './types';

export const coeffs = defineVerb({
	name: 'coeffs',
	kind: 'series',
	wholeOrder: true,
	forms: { darea: { keys: ['o'], required: ['o'] } },
	symbol: { text: 'ΔA series', tex: '\\Delta A' },
	help: {
		summary: 'closed-form series coefficients of ΔA up to order n',
		method:
			'the small-width expansion of the width and area integrals, inverted order by order in exact rational arithmetic times Beta functions (holo/series)',
		accuracy:
			'values ≤ 1e-12 relative for d = 4…10, k ≤ 14 against 60-digit mpmath (tests/fixtures/holo/series.json); LaTeX exact where marked',
		source: 'order 1: Bhattacharya, Nozaki, Takayanagi & Ugajin 2013; higher orders derived here (PHYSICS.md, "Perturbative series")',
		examples: ['coeffs darea o=4 | tex', 'use boosted d=4 v=0.6; coeffs darea o=3']
	},
	at: (p) => {
		const n = requireSeries(p);
		const c = p.holo.seriesCoeffs(p.bulk, n);
		return {
			terms: c.map((t) => ({ k: t.k, coeff: t.value, latex: t.latex, power: t.power ?? t.k * p.bulk.d })),
			d: p.bulk.d,
			scale: p.bulk.name === 'wave' ? 'z_p' : 'z_h'
		};
	}
});
