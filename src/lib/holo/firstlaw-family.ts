/**
 * The first-law families of the named bulks (Bulk.firstLaw): their parameters as (w, q) with w = scale^{−d},
 * how ê = 16πG ΔE/l and p̂ = 16πG ΔX/l move with them, and how the slice's f and h move (for the exact
 * gradient by extremality). The algebra is the module comment of firstlaw.ts; the bulks call these builders.
 */
import type { FirstLawFamily, PowerTerm, SliceVariation } from './types';

/** f = 1 − w z^d, h = 1 + q z^d in units of the scale: δw moves f's z^d term, δq h's. */
function homogeneousVariations(d: number, scale: number): { w: SliceVariation; q: SliceVariation } {
	const zd = Math.pow(scale, d);
	return { w: { df: [{ c: -zd, p: d }], dh: [] }, q: { df: [], dh: [{ c: zd, p: d }] } };
}

/** ê = l[(d−1)w + d q], p̂ = l d √(q(q+w)) (T_tt = (dγ²−1)/(16πG zh^d), T^{ty} = dγ²v/(16πG zh^d)). */
function boostSlopes(d: number, w: number, q: number): FirstLawFamily['slopes'] {
	const root = Math.sqrt(q * (q + w));
	return { E1: d - 1, E2: d, P1: root > 0 ? (d * q) / (2 * root) : 0, P2: root > 0 ? (d * (2 * q + w)) / (2 * root) : Infinity };
}

/** The static brane (one parameter): ΔS = α ΔE. */
export function staticFamily(d: number, zh: number): FirstLawFamily {
	const w = Math.pow(zh, -d);
	return { kind: 'static', w, q: 0, sign: 1, scale: zh, slopes: boostSlopes(d, w, 0), variations: homogeneousVariations(d, zh) };
}

/** The boosted brane, κ = γ²v²: q = κ w; at v = 0 the static family. */
export function boostedFamily(d: number, zh: number, v: number, kappa: number): FirstLawFamily {
	if (v === 0) return staticFamily(d, zh);
	const w = Math.pow(zh, -d);
	const q = kappa * w;
	return { kind: 'boosted', w, q, sign: Math.sign(v), scale: zh, slopes: boostSlopes(d, w, q), variations: homogeneousVariations(d, zh) };
}

/** The plane wave, the v → 1 limit at fixed zp: w = 0, q = zp^{−d}; the w direction switches on a temperature. */
export function waveFamily(d: number, zp: number): FirstLawFamily {
	return {
		kind: 'wave',
		w: 0,
		q: Math.pow(zp, -d),
		sign: 1,
		scale: zp,
		slopes: { E1: d - 1, E2: d, P1: d / 2, P2: d },
		variations: homogeneousVariations(d, zp)
	};
}

/**
 * The charged brane (d ≥ 3) in (w, q) with q the charge parameter: ê = (d−1)(1+q²) w, p̂ = 2(d−1) q w^{(d−1)/d}/g
 * (g = μ zh/q, bulks/charged.ts). δw moves every term of f by ∂_w = −(zh^{d+1}/d) ∂_zh; δq at fixed zh moves
 * f by −2q (z/zh)^d + 2q (z/zh)^{2(d−1)}.
 */
export function chargedFamily(d: number, zh: number, q: number, g: number, fTerms: PowerTerm[]): FirstLawFamily {
	const w = Math.pow(zh, -d);
	const wr = Math.pow(w, (d - 1) / d);
	const zd = Math.pow(zh, d);
	return {
		kind: 'charged',
		w,
		q: 0,
		sign: 1,
		scale: zh,
		charge: q,
		slopes: {
			E1: (d - 1) * (1 + q * q),
			E2: 2 * (d - 1) * q * w,
			P1: (2 * (d - 1) * q * (d - 1) * wr) / (d * g * w),
			P2: (2 * (d - 1) * wr) / g
		},
		variations: {
			w: { df: fTerms.filter((t) => t.p !== 0).map((t) => ({ c: (t.c * t.p * zd) / d, p: t.p })), dh: [] },
			q: {
				df:
					q === 0
						? []
						: [
								{ c: -2 * q, p: d },
								{ c: 2 * q, p: 2 * (d - 1) }
							],
				dh: []
			}
		}
	};
}
