import { defineVerb } from './types';

export const mi = defineVerb({
	name: 'mi',
	kind: 'record',
	usesG: true,
	forms: { pair: { keys: ['l', 'gap', 'G'], required: ['l', 'gap'] } },
	symbol: { text: 'I', tex: 'I' },
	help: {
		summary: 'mutual information of a pair of strips and the critical gap',
		method: 'I = 2S(l) − min(S(2l+s) + S(s), 2S(l)) from exact strip areas; the critical gap by bracketing and bisection (holo/mutual.ts)',
		accuracy: 'as the exact strip areas; s_c/l to ~1e-13 relative; d = 2 vacuum gives √2 − 1 (tested)',
		source: 'Headrick, PRD 82 (2010) 126010',
		examples: ['mi pair l=1 gap=0.3', 'sweep mi pair l=1 gap=0.05..0.6:12']
	},
	at: (p) => {
		// the engine answers I·4G (area units) and s_c/l; API.md's fields are I (entropy) and gap_crit
		const m = p.holo.mutualInformation(p.bulk, p.q.l!, p.q.gap!);
		const fields = { I: p.holo.entropy(m.I, p.G), gap_crit: m.gapCrit };
		const note =
			p.bulk.name === 'soliton' ? 'each strip area is the RT (minimal) one of the connected and disconnected surfaces' : undefined;
		return note ? { fields, note } : { fields };
	}
});
