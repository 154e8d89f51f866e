import { defineVerb } from './types';

export const stress = defineVerb({
	name: 'stress',
	kind: 'record',
	usesG: true,
	forms: { '': { keys: ['G'], required: [] } },
	symbol: { text: '⟨T_μν⟩', tex: '\\langle T_{\\mu\\nu}\\rangle' },
	help: {
		summary: '⟨T_μν⟩ from the Fefferman–Graham expansion: tt, ty, xx, yy',
		method: "each bulk's closed form, lower indices, per unit G (holo/bulks/*)",
		accuracy: 'closed form: rounding only; traceless and conserved (tests/unit/holo/physics.test.ts)',
		source: 'de Haro, Skenderis & Solodukhin, CMP 217 (2001) 595',
		examples: ['stress', 'use boosted d=4 v=0.6; stress']
	},
	at: (p) => {
		const t = p.holo.stressTensor(p.bulk, p.G);
		return { fields: { tt: t.tt, ty: t.ty, xx: t.xx, yy: t.yy } };
	}
});
