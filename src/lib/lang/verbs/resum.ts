import { requireSeries } from './point';
import { defineVerb, type ScalarAt } from './types';

export const resum = defineVerb({
	name: 'resum',
	kind: 'scalar',
	series: true,
	wholeOrder: true,
	errorField: 'error',
	forms: { strip: { keys: ['l', 'o'], required: ['l'] } },
	symbol: { text: 'ΔA (Padé)', tex: '\\Delta A_{\\mathrm{Pad\\acute e}}' },
	help: {
		summary:
			'Padé-resummed series at l ± an error estimate (neighbouring approximants), warned when unreliable, with the exact value beside it',
		method:
			'diagonal or next-to-diagonal Padé approximant of the order-n series in τ = (l/z_h)^d; spurious poles (Froissart doublets) counted',
		accuracy:
			'no guarantee: the error estimate is the largest difference from [L−1/M] and [L/M−1]; above 1 % it warns, above 25 % it says there is no value',
		source: 'Baker & Graves-Morris, "Padé Approximants", 2nd ed. (1996)',
		examples: ['resum l=0.8 o=6', 'sweep resum l=0.2..1.5:14 o=8']
	},
	at: (p) => {
		const r = p.holo.resum(p.bulk, p.q.l!, requireSeries(p));
		const fields: Record<string, number> = { error: r.error, series: r.series, exact: r.exact, L: r.L, M: r.M, froissart: r.froissart };
		if (r.pole) fields.pole_l = r.pole.l;
		// no resummed value without its error estimate: it is in the label, the fields and (when large) the warning
		const out: ScalarAt = { value: r.value, fields, tag: ` [${r.L}/${r.M}] ± ${Number(r.error.toPrecision(2))}` };
		out.note = 'error estimate: the largest difference from the neighbouring approximants [L−1/M], [L/M−1]';
		if (r.warning) out.warning = r.warning;
		return out;
	}
});
