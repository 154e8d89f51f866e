import { defineVerb } from './types';

export const phases = defineVerb({
	name: 'phases',
	kind: 'record',
	forms: { '': { keys: [], required: [] } },
	symbol: { text: 'soliton phases', tex: '' },
	help: {
		summary: 'soliton: critical width l_c, largest connected width l_max, the jump of ∂A/∂l at l_c',
		method:
			'the connected branch l(z*) and its area against the disconnected pair of sheets; l_c where the areas cross (holo/bulks/soliton.ts)',
		accuracy:
			'widths and areas ≤ 1e-12 relative, l_c to ~1e-12 relative against an independent mpmath evaluation of both branches (tests/fixtures/holo/analysis/soliton.py)',
		source: 'Nishioka & Takayanagi, JHEP 01 (2007) 090; Klebanov, Kutasov & Murugan, NPB 796 (2008) 274',
		examples: ['use soliton d=4; phases', 'use soliton d=5 z0=2; phases']
	},
	at: (p) => {
		if (p.bulk.name !== 'soliton')
			throw new p.holo.HoloError(
				`phases is for the soliton, whose strips have two surfaces (got ${p.bulk.name})`,
				'bulk',
				'use soliton d=4 z0=1'
			);
		const ph = p.holo.solitonPhases({ d: p.bulk.d, z0: Number(p.bulk.params.z0) });
		return {
			fields: { l_c: ph.lc, l_max: ph.lmax, zstar_c: ph.zstarC, zstar_max: ph.zstarMax, dA_dl_jump: ph.jump },
			note: 'soliton strip: connected surface below l_c, disconnected (two sheets to the cap) above; dA_dl_jump = ∂A/∂l above l_c minus below'
		};
	}
});
