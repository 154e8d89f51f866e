import { HoloError } from '../errors';
import { chargedFamily, staticFamily } from '../firstlaw-family';
import { chargedBraneSeries, homogeneousSeries } from '../series/capability';
import type { Bulk, PowerTerm, Stress } from '../types';
import { readDimension, readLength, readNumber, rejectUnknownKeys } from './params';

/**
 * Planar Reissner–Nordström–AdS brane: f = 1 − (1+q²)(z/zh)^d + q²(z/zh)^{2(d−1)},
 * T = (d − (d−2)q²)/(4π zh), extremal at q² = d/(d−2) (rejected: non-extremal only).
 * Stress from the z^d coefficient of f (de Haro, Skenderis & Solodukhin 2001): e = (d−1)(1+q²)/(16πG zh^d),
 * p = (1+q²)/(16πG zh^d) (traceless). s = 1/(4G zh^{d−1}). Its small-width series mixes the powers
 * (l/zh)^{da + 2(d−1)b} (series/charged.ts, series/capability.ts).
 *
 * Charge normalisation (ours, stated because μ and ρ are convention-dependent; only μρ is not): action
 * (1/16πG)∫√−g (R + d(d−1) − F_{μν}F^{μν}), A_t = μ(1 − (z/zh)^{d−2}). The Einstein–Maxwell equations then
 * give q = μ zh / g_d with g_d = √((d−1)/(2(d−2))) (derived; checked symbolically for d = 3, 4, 5), and Gauss's
 * law ρ = 4(d−2) μ/(16πG zh^{d−2}) = 2(d−1) q/(16πG g_d zh^{d−1}). Consistency (tested): e + p = T s + μ ρ and
 * de = T ds + μ dρ. d = 2 with q ≠ 0 is refused: there f's two powers coincide, the metric is plain BTZ and the
 * charge would only corrupt e and p (charged BTZ has a log gauge field, not this family).
 */
/** g_d = μ zh / q in the normalisation above (d ≥ 3). */
export function chargeCoupling(d: number): number {
	return Math.sqrt((d - 1) / (2 * (d - 2)));
}

export function makeCharged(params: Record<string, number | string>): Bulk {
	rejectUnknownKeys('charged', params, ['d', 'zh', 'q']);
	const d = readDimension(params);
	const zh = readLength(params, 'zh');
	const q = readNumber(params, 'q', 0);
	const q2 = q * q;
	if (d === 2 && q !== 0) {
		throw new HoloError(
			'charged needs d ≥ 3 for q ≠ 0: at d = 2 this family is plain BTZ (the charge drops out of f)',
			'q',
			'use q=0, or d ≥ 3'
		);
	}
	if (d > 2 && !(q2 < d / (d - 2))) {
		throw new HoloError(`q² must be below d/(d−2) = ${d / (d - 2)} (non-extremal)`, 'q', `got q=${q}`);
	}
	const m = 2 * (d - 1);
	const c = (G: number) => (1 + q2) / (16 * Math.PI * G * Math.pow(zh, d));
	const fTerms: PowerTerm[] = [
		{ c: 1, p: 0 },
		{ c: -(1 + q2), p: d },
		{ c: q2, p: m }
	];
	return {
		name: 'charged',
		d,
		params: { d, zh, q, q2 },
		horizon: zh,
		scale: zh,
		slice: {
			d,
			f: (z) => 1 - (1 + q2) * Math.pow(z / zh, d) + q2 * Math.pow(z / zh, m),
			h: () => 1,
			scale: zh,
			zh,
			fTerms,
			hTerms: []
		},
		// d = 2: f's two powers coincide and q = 0: the BTZ brane
		series: d === 2 ? homogeneousSeries(d, 'brane', { alpha: 1, beta: 0 }) : chargedBraneSeries(d, q2),
		firstLaw: d === 2 ? staticFamily(d, zh) : chargedFamily(d, zh, q, chargeCoupling(d), fTerms),
		stress: (G): Stress => ({ tt: (d - 1) * c(G), ty: 0, xx: c(G), yy: c(G) }),
		thermo: (G) => {
			const t = { T: (d - (d - 2) * q2) / (4 * Math.PI * zh), s: 1 / (4 * G * Math.pow(zh, d - 1)), e: (d - 1) * c(G), p: c(G) };
			if (d === 2) return t;
			const g = chargeCoupling(d);
			return { ...t, mu: (g * q) / zh, rho: (2 * (d - 1) * q) / (16 * Math.PI * G * g * Math.pow(zh, d - 1)) };
		}
	};
}
