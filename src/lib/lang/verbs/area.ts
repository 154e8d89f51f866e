import { ballArea, stripArea, valueAt, withSolitonPhase } from './point';
import { defineVerb } from './types';

export const area = defineVerb({
	name: 'area',
	kind: 'scalar',
	series: true,
	forms: { strip: { keys: ['l', 'o', 'phase'], required: ['l'] }, ball: { keys: ['R', 'o'], required: ['R'] } },
	symbol: { text: 'A_fin', tex: 'A_{\\mathrm{fin}}' },
	help: {
		summary: 'finite part of the RT area, A_fin',
		method:
			'exact: the cutoff-free strip integral (the area-law term subtracted analytically), balls by shooting; o=n: the vacuum area plus the order-n series of ΔA',
		accuracy:
			'exact strips ≤ 1e-12 relative against mpmath (tests/fixtures/holo/strip.json); exact balls: worst 2e-12 relative over 21 independent cases (d = 3…5, R/z_h 0.1…3)',
		source: 'Ryu & Takayanagi, PRL 96 (2006) 181602; PHYSICS.md, "Strip" and "Ball"',
		examples: ['area l=0.4', 'area ball R=0.5']
	},
	at: (p) => (p.shape === 'ball' ? { value: ballArea(p, 'area') } : withSolitonPhase(p, valueAt(p, stripArea(p))))
});
