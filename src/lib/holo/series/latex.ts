import type { Bulk } from '../types';
import { btzCoeff } from './btz';

/**
 * LaTeX of a_k. Exact where a closed form is at hand: d = 2 (Bernoulli numbers, rational), and a₁ for
 * d ≥ 3, a₁(κ) = a₁(0)(1 + (d+1)κ/(d−1)) with
 *   a₁(0) = (d−1)/(4π c_d) = √π Γ(1/m)² Γ(1/(d−1)) / (8π (d+1) Γ(d/m)² Γ((d+1)/m)),  m = 2(d−1)
 * (from ΔS = ΔE/T_ent, Bhattacharya, Nozaki, Takayanagi & Ugajin 2013). Higher a_k for d ≥ 3 are shown
 * as 15-digit decimals (their exact form is a polynomial in Beta values B(r/m, ½), not printed).
 */
export function coeffLatex(bulk: Bulk, k: number, value: number, poly?: number[]): string {
	const d = bulk.d;
	if (d === 2) {
		const f = btzCoeff(k);
		const neg = f.num < 0n;
		return `${neg ? '-' : ''}\\frac{${neg ? -f.num : f.num}}{${f.den}}`;
	}
	const m = 2 * (d - 1);
	if (k === 1) {
		const a1 = `\\frac{\\sqrt{\\pi}\\,\\Gamma(\\tfrac{1}{${m}})^2\\,\\Gamma(\\tfrac{1}{${d - 1}})}{${8 * (d + 1)}\\pi\\,\\Gamma(\\tfrac{${d}}{${m}})^2\\,\\Gamma(\\tfrac{${d + 1}}{${m}})}`;
		if (bulk.name === 'boosted') return `${a1}\\left(1 + \\tfrac{${d + 1}}{${d - 1}}\\kappa\\right)`;
		if (bulk.name === 'wave') return `\\tfrac{${d + 1}}{${d - 1}}${a1}`;
		return a1;
	}
	if (bulk.name === 'boosted' && poly) {
		const terms = poly.map((c, r) => (r === 0 ? sci(c) : `${sci(c)}\\,\\kappa${r > 1 ? `^{${r}}` : ''}`));
		return `\\approx ${terms.join(' + ').replace(/\+ -/g, '- ')}`;
	}
	return `\\approx ${sci(value)}`;
}

function sci(x: number): string {
	const [mant, exp] = x.toExponential(14).split('e');
	const e = Number(exp);
	return e === 0 ? mant : `${mant}\\times 10^{${e}}`;
}
