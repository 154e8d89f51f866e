import { ballDeltaArea, stripDeltaArea, valueAt, withSolitonPhase } from './point';
import { defineVerb } from './types';

export const dentropy = defineVerb({
	name: 'dentropy',
	kind: 'scalar',
	series: true,
	usesG: true,
	forms: { strip: { keys: ['l', 'o', 'G', 'phase'], required: ['l'] }, ball: { keys: ['R', 'o', 'G'], required: ['R'] } },
	symbol: { text: 'ΔS', tex: '\\Delta S' },
	help: {
		summary: 'ΔS = ΔA/(4G): cutoff-independent, no scheme',
		method: "darea's ΔA divided by 4G in the pad's units",
		accuracy: 'as darea (ΔS = ΔA/(4G) adds only rounding)',
		source: 'Ryu & Takayanagi 2006',
		examples: ['dentropy l=0.4 o=2', 'sweep dentropy l=0.1..1:20 o=1,exact']
	},
	at: (p) => {
		if (p.shape === 'ball') return { value: p.holo.entropy(ballDeltaArea(p, 'dentropy'), p.G) };
		return withSolitonPhase(p, valueAt(p, p.holo.entropy(stripDeltaArea(p), p.G)));
	}
});
