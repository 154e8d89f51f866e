import { defineVerb } from './types';

export const thermo = defineVerb({
	name: 'thermo',
	kind: 'record',
	usesG: true,
	forms: { '': { keys: ['G'], required: [] } },
	symbol: { text: 'thermodynamics', tex: '' },
	help: {
		summary: 'temperature, entropy density, energy density, pressure: T, s, e, p (μ, ρ when charged)',
		method: 'T from the surface gravity, s from the horizon area density, e and p from the stress tensor (holo/bulks/*)',
		accuracy: 'closed form: rounding only; e + p = T s (+ μ ρ, + v T^{ty}) checked in tests/unit/holo/physics.test.ts',
		source: 'T from the surface gravity, s = horizon area/(4G) (common practice); the charged brane: μ, ρ derived in holo/bulks/charged.ts',
		examples: ['thermo', 'use charged d=4 q=0.5; thermo']
	},
	at: (p) => {
		const t = p.holo.thermo(p.bulk, p.G);
		const fields: Record<string, number> = { T: t.T, s: t.s, e: t.e, p: t.p };
		if (t.py !== undefined) fields.py = t.py;
		if (t.mu !== undefined) fields.mu = t.mu;
		if (t.rho !== undefined) fields.rho = t.rho;
		const note =
			p.bulk.name === 'charged' && p.bulk.d > 2
				? 'μ, ρ in the normalisation of the action (R + d(d−1) − F²)/16πG: μ = √((d−1)/(2(d−2))) q/zh, e + p = T s + μ ρ'
				: undefined;
		return note ? { fields, note } : { fields };
	}
});
