import type { MuOf } from '../../holo/index';
import { firstLawNote } from './first-law-notes';
import { alongOf, valueAt } from './point';
import { defineVerb } from './types';

export const mu = defineVerb({
	name: 'mu',
	kind: 'scalar',
	series: true,
	forms: { strip: { keys: ['l', 'o', 'of', 'along'], required: ['l'] } },
	symbol: { text: 'μ', tex: '\\mu' },
	// a table's label names the charge chemical potential too (a single value's label comes from the answer)
	tableSymbol: (bulk, params) => (bulk === 'charged' && (params.d ?? 4) !== 2 ? 'μ_Q' : undefined),
	help: {
		summary:
			'chemical potential −ζ/α of the first law, of=momentum (ΔP_y = l T^{ty}, boosted/wave) or of=charge (μ_Q, charged; normalised by the action (R + d(d−1) − F²)/16πG, μ = √((d−1)/(2(d−2))) q/zh). Its small-l sign and size are a convention of that split (μ < 0 and |μ| > 1 happen); the large-l limit is thermodynamic: μ → v, μ_Q → μ',
		method: 'as tent: the α, ζ solve of the first law at fixed l (holo/firstlaw.ts)',
		accuracy: 'as tent; the large-l limits μ → v and μ_Q → μ are checked at l = 20 z_h',
		source: 'derived here (PHYSICS.md, "First law of entanglement"); checked against an independent mpmath evaluation',
		examples: [
			'use boosted d=4 v=0.6; mu l=0.4 o=3',
			'use charged d=4 q=0.5; mu l=0.5 of=charge',
			'use metric d=4 f="1 - m*z^4 + q^2*z^6" m=1.2 q=0.4; mu l=0.3 o=2 along=m,q'
		]
	},
	at: (p) => {
		const r = p.holo.mu(p.bulk, p.q.l!, p.order, p.words.of as MuOf | undefined, alongOf(p));
		const note = firstLawNote(p, 'mu');
		if (r.param)
			return valueAt(p, r.value, {
				symbol: `μ_${r.param}`,
				tag: ` (conjugate to Δ${r.param} = l ${r.param}/16πG)`,
				...(note ? { note } : {})
			});
		const tag = r.of === 'charge' ? ' (conjugate to ΔQ)' : ' (conjugate to ΔP_y)';
		return valueAt(p, r.value, { symbol: r.of === 'charge' ? 'μ_Q' : 'μ', tag, ...(note ? { note } : {}) });
	}
});
