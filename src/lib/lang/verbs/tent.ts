import { firstLawNote } from './first-law-notes';
import { alongOf, valueAt } from './point';
import { defineVerb } from './types';

export const tent = defineVerb({
	name: 'tent',
	kind: 'scalar',
	series: true,
	forms: { strip: { keys: ['l', 'o', 'along'], required: ['l'] }, ball: { keys: ['R', 'o'], required: ['R'] } },
	symbol: { text: 'T_ent', tex: 'T_{\\mathrm{ent}}' },
	help: {
		summary:
			'entanglement temperature 1/α of δΔS = α δΔE + ζ δΔX at order n (order 1: c_d/l); X = P_y (boosted), Q (charged); large l: T_H (T/γ when boosted)',
		method:
			'α, ζ solve the first law over the bulk’s parameter directions at fixed l: order n from the closed-form series term by term, exact from the extremality formula for ∂_λA (holo/firstlaw.ts)',
		accuracy: 'exact α, ζ agree with 25-digit mpmath central differences of ΔA to 3e-11 relative (tests/fixtures/holo/analysis)',
		source:
			'order 1: Bhattacharya, Nozaki, Takayanagi & Ugajin, PRL 110 (2013) 091602; balls: Blanco, Casini, Hung & Myers, JHEP 08 (2013) 060; higher orders derived here',
		examples: [
			'tent l=0.4 o=3',
			'sweep tent l=0.1..4:40 o=1,2,exact',
			'use metric d=4 f="1 - m*z^4 + q^2*z^6" m=1.2 q=0.4; tent l=0.3 o=2 along=m,q'
		]
	},
	at: (p) => {
		if (p.shape === 'ball') {
			// Blanco, Casini, Hung & Myers 2013: the ball's first law holds with T = (d+1)/(2πR) at order 1
			if (p.order !== 1) throw new p.holo.HoloError('tent ball is known at order 1: use o=1', 'o');
			return { value: p.holo.ballTent(p.bulk.d, p.q.R!) };
		}
		const note = firstLawNote(p, 'tent');
		return valueAt(p, p.holo.tent(p.bulk, p.q.l!, p.order, alongOf(p)).value, note ? { note } : {});
	}
});
