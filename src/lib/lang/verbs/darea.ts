import { growthGuides } from './growth';
import { ballDeltaArea, quenchAt, quenchFields, stripDeltaArea, valueAt, withSolitonPhase } from './point';
import { defineVerb } from './types';

export const darea = defineVerb({
	name: 'darea',
	kind: 'scalar',
	series: true,
	forms: { strip: { keys: ['l', 'o', 'phase', 't'], required: ['l'] }, ball: { keys: ['R', 'o'], required: ['R'] } },
	symbol: { text: 'ΔA', tex: '\\Delta A' },
	guides: growthGuides,
	help: {
		summary: 'ΔA = A_fin(bulk) − A_fin(vacuum) at the same width',
		method:
			'exact: the difference formed inside one integral (no cancellation between two large areas); o=n: the closed-form small-width series ΔA = l^{2−d} Σ a_k (l/z_h)^{kd} truncated at order n',
		accuracy:
			'exact ≤ 1e-12 relative against mpmath (tests/fixtures/holo/strip.json); series coefficients ≤ 1e-12 relative for d = 4…10, k ≤ 14 (tests/fixtures/holo/series.json); a truncation carries a warning outside its validity range',
		source: 'Ryu & Takayanagi 2006; the series as in PHYSICS.md, "Perturbative series" (checked against the mpmath runner)',
		examples: ['darea l=0.4 o=1,2,3,exact', 'sweep darea l=0.05..1.2:80 o=1,2,3,exact', 'use vaidya d=3; darea l=2 t=1']
	},
	at: (p) => {
		if (p.shape === 'ball') return { value: ballDeltaArea(p, 'darea') };
		const quench = quenchAt(p);
		if (quench) return { value: quench.dA, ...quenchFields(quench) };
		return withSolitonPhase(p, valueAt(p, stripDeltaArea(p)));
	}
});
