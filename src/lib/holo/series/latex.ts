import { btzCoeff } from './btz';
import { EXACT_ORDER, exactLatex } from './exact-latex';
import type { ExactKind } from './exact';
import { EXACT_CHARGED_ORDER, exactChargedLatex } from './exact-charged';

/**
 * LaTeX of a_k. d = 2: Bernoulli numbers, rational. d ≥ 3: the exact form in π and B(s/m, ½) from
 * exact-latex.ts (brane, wave; boosted as a polynomial in κ = γ²v²) up to EXACT_ORDER; beyond it a 15-digit
 * decimal that says where the exact form stops. For a₁ the exact form agrees with the first-law value
 * a₁(0) = (d−1)/(4π c_d) (Bhattacharya, Nozaki, Takayanagi & Ugajin 2013; checked in the tests).
 */
export function coeffLatex(d: number, kind: ExactKind, k: number, value: number, poly?: number[]): string {
	if (d === 2) {
		const f = btzCoeff(k);
		const neg = f.num < 0n;
		return `${neg ? '-' : ''}\\frac{${neg ? -f.num : f.num}}{${f.den}}`;
	}
	if (Number.isInteger(d) && k <= EXACT_ORDER[kind]) return exactLatex(d, kind, k);
	const note = `\\quad\\text{(exact form computed to order ${EXACT_ORDER[kind]})}`;
	if (kind === 'boosted' && poly) {
		const terms = poly.map((c, r) => (r === 0 ? sci(c) : `${sci(c)}\\,\\kappa${r > 1 ? `^{${r}}` : ''}`));
		return `\\approx ${terms.join(' + ').replace(/\+ -/g, '- ')}${note}`;
	}
	return `\\approx ${sci(value)}${note}`;
}

/**
 * LaTeX of the charged brane's c_K (coefficient of l^{2−d}(l/zh)^K) as a polynomial in q²: the exact form in
 * π and B(s/m, ½) (exact-charged.ts) for K ≤ EXACT_CHARGED_ORDER·d, beyond it 15-digit decimals marked ≈
 * with a note. The value at the bulk's q is the SeriesCoeff's `value`.
 */
export function chargedLatex(d: number, K: number, poly: number[]): { latex: string; exact: boolean } {
	if (K <= EXACT_CHARGED_ORDER * d) return { latex: exactChargedLatex(d, K), exact: true };
	const terms = poly.map((c, r) => (r === 0 ? sci(c) : `${sci(c)}\\,q^{${2 * r}}`)).filter((_, r) => poly[r] !== 0);
	const body = terms.length ? terms.join(' + ').replace(/\+ -/g, '- ') : '0';
	return { latex: `\\approx ${body}\\quad\\text{(exact form computed to order ${EXACT_CHARGED_ORDER})}`, exact: false };
}

function sci(x: number): string {
	const [mant, exp] = x.toExponential(14).split('e');
	const e = Number(exp);
	return e === 0 ? mant : `${mant}\\times 10^{${e}}`;
}
