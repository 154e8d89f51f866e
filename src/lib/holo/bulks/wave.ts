import { waveFamily } from '../firstlaw-family';
import { homogeneousSeries } from '../series/capability';
import type { Bulk, Stress } from '../types';
import { readDimension, readLength, rejectUnknownKeys } from './params';

/**
 * AdS plane wave: the v → 1, zh → ∞ limit of the boosted brane with γ²v²/zh^d = zp^{−d} fixed:
 * f = 1, g_yy = (1 + (z/zp)^d)/z². Zero temperature. The boosted stress tensor in that limit gives
 * T_tt = T_yy = −T_ty = d/(16πG zp^d) (lower indices), T_xx = 0: a null momentum flux.
 */
export function makeWave(params: Record<string, number | string>): Bulk {
	rejectUnknownKeys('wave', params, ['d', 'zp']);
	const d = readDimension(params);
	const zp = readLength(params, 'zp');
	const e = (G: number) => d / (16 * Math.PI * G * Math.pow(zp, d));
	return {
		name: 'wave',
		d,
		params: { d, zp },
		scale: zp,
		slice: {
			d,
			f: () => 1,
			h: (z) => 1 + Math.pow(z / zp, d),
			scale: zp,
			fTerms: [{ c: 1, p: 0 }],
			hTerms: [
				{ c: 1, p: 0 },
				{ c: 1, p: d }
			]
		},
		series: homogeneousSeries(d, 'wave', { alpha: 0, beta: 1 }),
		firstLaw: waveFamily(d, zp),
		stress: (G): Stress => ({ tt: e(G), ty: -e(G), xx: 0, yy: e(G) }),
		thermo: (G) => ({ T: 0, s: 0, e: e(G), p: 0, py: e(G) })
	};
}
