import { FIRSTLAW_TOL } from './first-law-notes';
import { alongOf, ballZh } from './point';
import { defineVerb, type CheckAt, type Point } from './types';

/**
 * The ball's first law (Blanco, Casini, Hung & Myers, JHEP 08 (2013) 060): ΔS = ΔE/T with T = (d+1)/(2πR)
 * holds at first order in R^d/zh^d. The check sets the exact ΔS (shooting) against ΔE/T; the residual is the
 * second-order part, which grows like (R/zh)^{2d}.
 */
function ballFirstLaw(p: Point): CheckAt {
	const zh = ballZh(p, 'firstlaw');
	if (zh === undefined) throw new p.holo.HoloError('firstlaw ball needs a bulk with a horizon (brane)', 'bulk', 'use brane …');
	const { d } = p.bulk;
	const R = p.q.R!;
	const tol = p.q.tol ?? FIRSTLAW_TOL;
	const exact = p.holo.ballDeltaArea(d, R, zh).value / (4 * p.G);
	const T = p.holo.ballTent(d, R);
	const rhs = p.holo.ballEnergy(d, R, zh, p.G) / T;
	const residual = exact - rhs;
	return {
		relation: 'ΔS = ΔE/T_ent',
		lhs: exact,
		rhs,
		residual,
		tolerance: tol * Math.abs(exact),
		pass: Math.abs(residual) <= tol * Math.abs(exact),
		fields: { tent: T }
	};
}

/**
 * A metric along its named parameters (holo/metric/along.ts): one direction per parameter, δp = 1; the first is
 * shown (lhs, rhs, residual), every one is in the fields as lhs_<p>, rhs_<p>, residual_<p>.
 */
function alongFirstLaw(p: Point, along: string[]): CheckAt {
	const c = p.holo.firstLaw(p.bulk, p.q.l!, p.order, p.G, along);
	const tol = p.q.tol ?? FIRSTLAW_TOL;
	const dirs = c.directions!;
	const pass = dirs.every((d) => Math.abs(d.residual) <= tol * Math.abs(d.lhs));
	const fields: Record<string, number> = { alpha: c.alpha, tent: c.tent };
	const law = c.along!;
	law.params.forEach((name, i) => {
		const d = dirs[i]!;
		Object.assign(fields, { [`lhs_${name}`]: d.lhs, [`rhs_${name}`]: d.rhs, [`residual_${name}`]: d.residual });
		if (Number.isFinite(d.residualExact)) fields[`residual_exact_${name}`] = d.residualExact;
		if (i > 0) Object.assign(fields, { [`beta_${name}`]: law.beta[i]!, [`mu_${name}`]: law.mu[i]! });
	});
	const rest = law.params.slice(1);
	const relation = `T_ent δΔS = δΔE${rest.map((x) => ` − μ_${x} δΔ${x}`).join('')}`;
	return {
		relation,
		note: `${relation}, along δ${law.params[0]} (shown)${rest.length ? ` and ${rest.map((x) => `δ${x} (fields *_${x})`).join(', ')}` : ''}; Δp = l p/16πG held as charges; residual = the next order's term (o=exact: the relation's own rounding)`,
		lhs: dirs[0]!.lhs,
		rhs: dirs[0]!.rhs,
		residual: dirs[0]!.residual,
		tolerance: tol * Math.abs(dirs[0]!.lhs),
		pass,
		fields
	};
}

function stripFirstLaw(p: Point): CheckAt {
	const named = alongOf(p);
	if (named) return alongFirstLaw(p, named);
	const c = p.holo.firstLaw(p.bulk, p.q.l!, p.order, p.G);
	const tol = p.q.tol ?? FIRSTLAW_TOL;
	// the scale direction (δ ln zh) is the one every bulk has; a boosted bulk's second direction must hold too
	const dirs = c.shape ? [c.scale, c.shape] : [c.scale];
	const pass = dirs.every((d) => Math.abs(d.residual) <= tol * Math.abs(d.lhs));
	const fields: Record<string, number> = { alpha: c.alpha, zeta: c.zeta, tent: c.tent, mu: c.mu, residual_exact: c.scale.residualExact };
	// the second direction: δv for the boost, δ(temperature) for the wave, δq at fixed zh for the charge
	const sfx = c.conjugate === 'charge' ? 'q' : 'v';
	if (c.shape) Object.assign(fields, { [`lhs_${sfx}`]: c.shape.lhs, [`rhs_${sfx}`]: c.shape.rhs, [`residual_${sfx}`]: c.shape.residual });
	const relation =
		c.conjugate === 'charge' ? 'T_ent δΔS = δΔE − μ_Q δΔQ' : c.conjugate === 'momentum' ? 'T_ent δΔS = δΔE − μ δΔP_y' : 'T_ent δΔS = δΔE';
	const along =
		c.conjugate === 'charge'
			? 'along δzh (shown) and δq (fields *_q)'
			: c.conjugate === 'momentum'
				? 'along δzh (shown) and the second parameter (fields *_v)'
				: 'along δzh';
	return {
		relation,
		note: `${relation}, ${along}; residual = the next order's term (o=exact: the relation's own rounding)`,
		lhs: c.scale.lhs,
		rhs: c.scale.rhs,
		residual: c.scale.residual,
		tolerance: tol * Math.abs(c.scale.lhs),
		pass,
		fields
	};
}

export const firstlaw = defineVerb({
	name: 'firstlaw',
	kind: 'check',
	series: true,
	usesG: true,
	forms: { strip: { keys: ['l', 'o', 'tol', 'G', 'along'], required: ['l'] }, ball: { keys: ['R', 'o', 'tol', 'G'], required: ['R'] } },
	symbol: { text: 'first law', tex: '\\delta\\Delta S' },
	help: {
		summary: 'checks T_ent δΔS = δΔE − μ δΔX at order n (X = P_y or Q) in each parameter direction; each side and the residual',
		method:
			'α, ζ of order n (tent, mu) against δΔS of order n+1 along each parameter direction; the residual is the next order’s term formed directly (no cancellation); o=exact uses the exact gradient; balls set the exact ΔS against ΔE/T_ent',
		accuracy: 'passes when |residual| ≤ tol·|δΔS| (tol = 1e-3 by default); the residual itself is accurate to ~1e-11 relative',
		source:
			'strips, order 1: Bhattacharya, Nozaki, Takayanagi & Ugajin 2013; balls: Blanco, Casini, Hung & Myers 2013; higher orders derived here',
		examples: [
			'firstlaw l=0.4 o=3',
			'use boosted d=4 v=0.6; firstlaw l=0.3 o=1,2,3',
			'use metric d=4 f="1 - m*z^4 + q^2*z^6" m=1.2 q=0.4; firstlaw l=0.3 o=2 along=m,q'
		]
	},
	at: (p) => (p.shape === 'ball' ? ballFirstLaw(p) : stripFirstLaw(p))
});
