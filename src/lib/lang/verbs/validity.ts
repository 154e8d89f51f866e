import { requireSeries } from './point';
import { defineVerb } from './types';

/**
 * The default validity tolerance: relative 1e-3, the accuracy of a quick check on a plot. A pad may set its own
 * (PadContext.validityTol); series warnings, `validity` without tol= and the plot's shading all use that one.
 */
export const DEFAULT_VALIDITY_TOL = 1e-3;

export const validity = defineVerb({
	name: 'validity',
	kind: 'record',
	wholeOrder: true,
	forms: { darea: { keys: ['o', 'tol'], required: ['o'] } },
	symbol: { text: 'validity', tex: '' },
	help: {
		summary:
			'largest l where order n stays within tol (default: the pad’s validity tolerance, 1e-3) of exact, and the radius of convergence ± its uncertainty (Domb–Sykes)',
		method:
			'l_max: a log-spaced scan and bisection on |ΔA⁽ⁿ⁾ − ΔA| = tol·|ΔA| against the exact ΔA; radius: Domb–Sykes extrapolation of the coefficient ratios in 1/k (charged: a fit of their growth)',
		accuracy:
			'l_max to 1e-6 relative (the bisection’s stop); radius ± radius_err as stated (checked against the mpmath radius runner, tests/fixtures/holo/radius.json)',
		source: 'Domb & Sykes, Proc. R. Soc. A 240 (1957) 214; the rest derived here',
		examples: ['validity o=3 tol=1e-3', 'validity darea o=6 tol=1e-4']
	},
	at: (p) => {
		const v = p.holo.validity(p.bulk, requireSeries(p), p.q.tol ?? p.validityTol);
		return {
			fields: { l_max: v.l_max, radius: v.radius, radius_err: v.radius_err },
			note: 'radius ± radius_err: Domb–Sykes extrapolation of the coefficient ratios in 1/k (charged: a fit of their growth)'
		};
	}
});
