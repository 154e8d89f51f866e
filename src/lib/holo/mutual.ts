/**
 * Holographic mutual information of two parallel strips of width l separated by a gap s.
 *
 * Definition (Headrick, Phys. Rev. D 82 (2010) 126010): with S(ℓ) = A_fin(ℓ)/(4G),
 *   I(l, s) = 2S(l) − min( S(2l+s) + S(s), 2S(l) ),
 * i.e. the RT surface of the union is either the two separate surfaces (I = 0) or the "connected" pair
 * spanning 2l+s and s. The cutoff terms cancel between the two sides, so any finite part in a fixed scheme
 * will do; every area here is per unit transverse volume.
 *
 * Critical gap: the s at which S(2l+s) + S(s) = 2S(l). g(s) = A(2l+s) + A(s) − 2A(l) → −∞ as s → 0 (A(s)
 * is dominated by its −1/s^{d−2} or 2 ln s finite term), and g grows without bound with s in every bulk
 * here (the areas are extensive or tend to a constant while A(s) increases), so the first sign change
 * is found by expanding a bracket geometrically and refining it by bisection to ~1e-13 relative
 * (bisection because A may switch branch — e.g. the soliton — so g need not be smooth).
 * For d = 2 vacuum, A = 2 ln ℓ gives (2l+s)s = l², s/l = √2 − 1 (Headrick 2010).
 */
import { HoloError } from './errors';

/** A strip area finite part A_fin(ℓ) (L = 1, per unit transverse volume). */
export type StripArea = (width: number) => number;

export interface MutualInformation {
	/** I·4G: mutual information in area units (divide by 4G for entropy units) */
	I: number;
	l: number;
	gap: number;
	/** which surface of the union wins */
	phase: 'connected' | 'disconnected';
	/** critical gap over width, s_c/l (NaN when no transition was found within 1e6·l) */
	gapCrit: number;
}

/** Mutual information (area units) of two strips of width l with gap s. */
export function mutualInformationArea(area: StripArea, l: number, gap: number): { I: number; phase: 'connected' | 'disconnected' } {
	if (!(l > 0)) throw new HoloError('l must be > 0', 'l');
	if (!(gap > 0)) throw new HoloError('gap must be > 0', 'gap');
	const two = 2 * area(l);
	const con = area(2 * l + gap) + area(gap);
	return con < two ? { I: two - con, phase: 'connected' } : { I: 0, phase: 'disconnected' };
}

/** Critical gap s_c (absolute) where the two candidate surfaces of the union have equal area. */
export function criticalGap(area: StripArea, l: number): number {
	if (!(l > 0)) throw new HoloError('l must be > 0', 'l');
	const two = 2 * area(l);
	const g = (s: number) => area(2 * l + s) + area(s) - two;
	let lo = l * 1e-3;
	while (!(g(lo) < 0)) {
		lo /= 8;
		if (lo < l * 1e-12) return NaN;
	}
	let hi = lo * 2;
	while (!(g(hi) > 0)) {
		lo = hi;
		hi *= 2;
		if (hi > l * 1e6) return NaN;
	}
	for (let i = 0; i < 200 && hi - lo > 1e-14 * hi; i++) {
		const mid = 0.5 * (lo + hi);
		if (g(mid) < 0) lo = mid;
		else hi = mid;
	}
	return 0.5 * (lo + hi);
}

/** I (area units), the winning phase and the critical gap ratio s_c/l. */
export function mutualInformation(area: StripArea, l: number, gap: number): MutualInformation {
	const { I, phase } = mutualInformationArea(area, l, gap);
	return { I, l, gap, phase, gapCrit: criticalGap(area, l) / l };
}
