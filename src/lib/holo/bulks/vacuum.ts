import type { Bulk } from '../types';
import { readDimension, rejectUnknownKeys } from './params';

/** Pure AdS_{d+1} in Poincaré coordinates: f = h = 1, zero stress tensor. */
export function makeVacuum(params: Record<string, number | string>): Bulk {
	rejectUnknownKeys('vacuum', params, ['d']);
	const d = readDimension(params);
	return {
		name: 'vacuum',
		d,
		params: { d },
		slice: { d, f: () => 1, h: () => 1, fTerms: [], hTerms: [] },
		stress: () => ({ tt: 0, ty: 0, xx: 0, yy: 0 }),
		thermo: () => ({ T: 0, s: 0, e: 0, p: 0 })
	};
}
