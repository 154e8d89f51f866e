import { staticFamily } from '../firstlaw-family';
import { homogeneousSeries } from '../series/capability';
import type { Bulk, Stress } from '../types';
import { readDimension, readLength, rejectUnknownKeys } from './params';

/**
 * Planar AdS black brane: f = 1 − (z/zh)^d, T = d/(4π zh), s = 1/(4G zh^{d−1}).
 * Stress tensor (de Haro, Skenderis & Solodukhin 2001): T_μν = (η_μν + d u_μ u_ν)/(16πG zh^d), u = (1, 0).
 */
export function makeBrane(params: Record<string, number | string>): Bulk {
	rejectUnknownKeys('brane', params, ['d', 'zh']);
	const d = readDimension(params);
	const zh = readLength(params, 'zh');
	const c = (G: number) => 1 / (16 * Math.PI * G * Math.pow(zh, d));
	return {
		name: 'brane',
		d,
		params: { d, zh },
		horizon: zh,
		scale: zh,
		slice: {
			d,
			f: (z) => 1 - Math.pow(z / zh, d),
			h: () => 1,
			scale: zh,
			zh,
			fTerms: [
				{ c: 1, p: 0 },
				{ c: -1, p: d }
			],
			hTerms: []
		},
		series: homogeneousSeries(d, 'brane', { alpha: 1, beta: 0 }),
		firstLaw: staticFamily(d, zh),
		stress: (G): Stress => ({ tt: (d - 1) * c(G), ty: 0, xx: c(G), yy: c(G) }),
		thermo: (G) => ({
			T: d / (4 * Math.PI * zh),
			s: 1 / (4 * G * Math.pow(zh, d - 1)),
			e: (d - 1) * c(G),
			p: c(G)
		})
	};
}
