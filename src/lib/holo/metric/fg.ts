import type { Stress } from '../types';
import { isNonzero, taylorOf, coefficientValue, type MetricKey, type MetricModel } from './model';
import { addQPoly, constQPoly, makeQ, scaleQPoly, type QPoly } from './rational';
import { latexOf } from './taylor-exact';

/**
 * ⟨T_μν⟩ of a static metric from the Fefferman–Graham expansion (de Haro, Skenderis & Solodukhin, Commun. Math.
 * Phys. 217 (2001) 595): ⟨T_μν⟩ = (d/16πG) g_(d)μν.
 *
 * FG gauge: dz/(z√f) = dρ/ρ, i.e. ln ρ = ln z + ∫₀^z (f^{−½} − 1) dz'/z'. When f, g, h = 1 + O(z^d) this gives
 * z = ρ (1 + f_d ρ^d/(2d) + O(ρ^{d+1})) (the series reverted), so 1/z² = ρ^{−2}(1 − f_d ρ^d/d + …) and
 *   g_(d)tt = −(g_d − f_d/d),  g_(d)xx = −f_d/d,  g_(d)yy = h_d − f_d/d
 *   16πG T_tt = f_d − d g_d,   16πG T_xx = −f_d,   16πG T_yy = d h_d − f_d     (derived here; the brane's
 * (d−1, 1, 1)/zh^d and the wave's T_yy = d/zp^d are the checks). A first nonzero Taylor coefficient at a power
 * p < d makes g_(p) ≠ 0 in FG gauge (the map z(ρ) moves it only at order p itself): the boundary metric is
 * deformed at order p, a source is turned on, and ⟨T_μν⟩ is not the number above (it depends on the source and
 * on the scheme), so we report that instead. Conservation holds trivially (constant in the boundary directions);
 * the trace d(g_d + h_d − f_d)/16πG vanishes only for metrics that solve Einstein's equations near the boundary.
 */
export interface FgDeparture {
	/** lowest power p ≥ 1 at which f, g or h departs from 1, and which of them (Infinity: pure AdS) */
	order: number;
	keys: MetricKey[];
}

export function departureOf(model: MetricModel, upTo = model.d): FgDeparture {
	const t = { f: taylorOf(model, 'f', upTo), g: taylorOf(model, 'g', upTo), h: taylorOf(model, 'h', upTo) };
	for (let p = 1; p <= upTo; p++) {
		const keys = (['f', 'g', 'h'] as const).filter((k) => isNonzero(t[k], p));
		if (keys.length) return { order: p, keys };
	}
	return { order: Infinity, keys: [] };
}

export type FgResult =
	| {
			kind: 'stress';
			order: number;
			stress: (G: number) => Stress;
			trace: (G: number) => number;
			latex?: () => Record<'tt' | 'xx' | 'yy', string>;
	  }
	| { kind: 'deformation'; order: number; keys: MetricKey[]; message: string };

export function fgStress(model: MetricModel): FgResult {
	const { d } = model;
	const dep = departureOf(model);
	if (dep.order < d) {
		const terms = dep.keys.map((k) => `${k} has a z^${dep.order} term`).join(', ');
		return {
			kind: 'deformation',
			order: dep.order,
			keys: dep.keys,
			message: `not a normalisable deformation: ${terms} (below z^${d}), so a source is turned on and ⟨T_μν⟩ is not the z^${d} coefficient`
		};
	}
	const t = { f: taylorOf(model, 'f', d), g: taylorOf(model, 'g', d), h: taylorOf(model, 'h', d) };
	const stress = (G: number): Stress => {
		const [fd, gd, hd] = (['f', 'g', 'h'] as const).map((k) => coefficientValue(model, t[k], d));
		const c = 1 / (16 * Math.PI * G);
		return { tt: c * (fd! - d * gd!), ty: 0, xx: -c * fd!, yy: c * (d * hd! - fd!) };
	};
	const trace = (G: number) => {
		const s = stress(G);
		return -s.tt + (d - 2) * s.xx + s.yy;
	};
	let latex: (() => Record<'tt' | 'xx' | 'yy', string>) | undefined;
	if (t.f.exact && t.g.exact && t.h.exact) {
		const vars = t.f.exact.vars;
		const at = (k: MetricKey): QPoly => t[k].exact!.coeffs[d] ?? constQPoly(vars, makeQ(0n));
		const parts = {
			tt: addQPoly(at('f'), at('g'), makeQ(BigInt(-d))),
			xx: scaleQPoly(at('f'), makeQ(-1n)),
			yy: addQPoly(scaleQPoly(at('h'), makeQ(BigInt(d))), at('f'), makeQ(-1n))
		};
		latex = () => ({
			tt: `16\\pi G\\,T_{tt} = ${latexOf(parts.tt)}`,
			xx: `16\\pi G\\,T_{xx} = ${latexOf(parts.xx)}`,
			yy: `16\\pi G\\,T_{yy} = ${latexOf(parts.yy)}`
		});
	}
	return { kind: 'stress', order: dep.order, stress, trace, latex };
}
