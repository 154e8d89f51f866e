import { solitonSurfaceAt, withSolitonPhase } from './point';
import { defineVerb } from './types';

export const zstar = defineVerb({
	name: 'zstar',
	kind: 'scalar',
	forms: { strip: { keys: ['l', 'phase'], required: ['l'] } },
	symbol: { text: 'z*', tex: 'z_*' },
	help: {
		summary: 'turning point z* of the RT surface for width l',
		method: 'Newton on the width integral l(z*) with its analytic slope, the endpoint singularity removed (holo/strip.ts)',
		accuracy: '≤ 1e-12 relative against the mpmath fixtures (tests/fixtures/holo/strip.json)',
		source: 'Ryu & Takayanagi, PRL 96 (2006) 181602; the strip integrals as in PHYSICS.md, "Strip"',
		examples: ['zstar l=0.8', 'sweep zstar l=0.1..3:40']
	},
	at: (p) => withSolitonPhase(p, { value: p.bulk.name === 'soliton' ? solitonSurfaceAt(p).zstar : p.holo.zstarOf(p.bulk, p.q.l!) })
});
