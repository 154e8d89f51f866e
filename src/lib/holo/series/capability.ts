/**
 * The small-width series a bulk carries (Bulk.series): which powers of l/scale its ΔA expansion has, their
 * coefficients, and the coefficients with LaTeX. The named bulks use the two families built here; a bulk
 * with a series of its own (a custom metric, say) implements SeriesCapability itself and every series verb,
 * validity, the radius estimate and the first law's order-n solve then work on it.
 */
import { HoloError } from '../errors';
import type { SeriesCapability, SeriesCoeff, SeriesShape } from '../types';
import { btzCoeff, fractionValue } from './btz';
import { chargedSeries, evalQ2 } from './charged';
import { kappaCoeffs } from './coeffs';
import type { ExactKind } from './exact';
import { chargedLatex, coeffLatex } from './latex';

/**
 * f = 1 − α (z/scale)^d, h = 1 + β (z/scale)^d (brane α=1,β=0; boosted α=1,β=κ; wave α=0,β=1): one power per
 * order, k d, with a_k(κ) polynomials from coeffs.ts (d ≥ 3) or the BTZ closed form (d = 2, static only).
 */
export function homogeneousSeries(d: number, kind: ExactKind, shape: SeriesShape): SeriesCapability {
	const values = (n: number): number[] => {
		if (d === 2) {
			if (shape.beta !== 0 || shape.alpha !== 1) throw new HoloError(`no series for ${kind} at d = 2`, 'd');
			return Array.from({ length: n }, (_, i) => fractionValue(btzCoeff(i + 1)));
		}
		const { alpha, beta } = shape;
		return kappaCoeffs(d, n).map((p, i) => {
			if (alpha === 0) return p[i + 1] * Math.pow(beta, i + 1);
			let s = 0;
			for (let r = p.length - 1; r >= 0; r--) s = s * beta + p[r];
			return s;
		});
	};
	return {
		powers: (n) => Array.from({ length: n }, (_, i) => (i + 1) * d),
		values,
		coeffs: (n) => {
			const polys = d >= 3 ? kappaCoeffs(d, n) : undefined;
			return values(n).map((value, i) => {
				const k = i + 1;
				const latex = coeffLatex(d, kind, k, value, polys?.[i]);
				const c: SeriesCoeff = { k, power: k * d, value, latex, exact: !latex.startsWith('\\approx') };
				if (kind === 'boosted' && polys) c.poly = polys[i].slice();
				return c;
			});
		}
	};
}

/**
 * The charged brane (d ≥ 3) mixes the powers (l/zh)^{da + 2(d−1)b} (series/charged.ts): its "order n" is every
 * power K ≤ n d, the same cut in l/zh as the other bulks; coefficients are polynomials in q².
 */
export function chargedBraneSeries(d: number, q2: number): SeriesCapability {
	return {
		mixedPowers: true,
		powers: (n) => chargedSeries(d, n).powers,
		values: (n) => chargedSeries(d, n).polys.map((p) => evalQ2(p, q2)),
		coeffs: (n) => {
			const { powers, polys } = chargedSeries(d, n);
			return polys.map((poly, i) => {
				const { latex, exact } = chargedLatex(d, powers[i], poly);
				return { k: i + 1, power: powers[i], value: evalQ2(poly, q2), latex, exact, poly: poly.slice() };
			});
		}
	};
}
