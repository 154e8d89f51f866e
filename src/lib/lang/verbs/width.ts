import { defineVerb } from './types';

export const width = defineVerb({
	name: 'width',
	kind: 'scalar',
	forms: { strip: { keys: ['zstar'], required: ['zstar'] } },
	symbol: { text: 'l', tex: '\\ell' },
	help: {
		summary: 'width l of the strip whose turning point is zstar',
		method: 'the width integral l(z*) by Gauss–Legendre quadrature after removing the endpoint singularity (holo/strip.ts)',
		accuracy: '≤ 1e-12 relative against the mpmath fixtures (tests/fixtures/holo/strip.json)',
		source: 'Ryu & Takayanagi, PRL 96 (2006) 181602; PHYSICS.md, "Strip"',
		examples: ['width zstar=0.5', 'sweep width zstar=0.1..0.95:30']
	},
	// a turning point below the cap is by definition the connected surface's
	at: (p) => ({ value: p.holo.widthOf(p.bulk, p.q.zstar!), ...(p.bulk.name === 'soliton' ? { tag: ' [connected surface]' } : {}) })
});
