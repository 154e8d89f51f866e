import { ballZh } from './point';
import { defineVerb, type RecordAt } from './types';

export const energy = defineVerb({
	name: 'energy',
	kind: 'record',
	usesG: true,
	forms: { strip: { keys: ['l', 'G'], required: ['l'] }, ball: { keys: ['R', 'G'], required: ['R'] } },
	symbol: { text: 'ΔE', tex: '\\Delta E' },
	help: {
		summary: 'ΔE (and ΔP_y when boosted, ΔQ when charged) in the strip, from the stress tensor',
		method:
			'ΔE = l T_tt, ΔP_y = l T^{ty} from the Fefferman–Graham stress tensor (per unit transverse volume); balls: T_tt × the ball volume',
		accuracy: 'closed form: rounding only',
		source: 'de Haro, Skenderis & Solodukhin, CMP 217 (2001) 595; PHYSICS.md, "First law of entanglement"',
		examples: ['energy l=0.4', 'energy ball R=0.5']
	},
	at: (p): RecordAt => {
		if (p.shape === 'ball') {
			const zh = ballZh(p, 'energy');
			return { fields: { E: zh === undefined ? 0 : p.holo.ballEnergy(p.bulk.d, p.q.R!, zh, p.G), P: 0 } };
		}
		const e = p.holo.energy(p.bulk, p.q.l!, p.G);
		const rho = p.bulk.name === 'charged' ? p.holo.thermo(p.bulk, p.G).rho : undefined;
		if (rho === undefined) return { fields: { E: e.E, P: e.P } };
		return { fields: { E: e.E, P: e.P, Q: rho * p.q.l! }, ...(p.bulk.d > 2 ? { note: 'Q = ρ l, ρ as in thermo' } : {}) };
	}
});
