import { HoloError } from './errors';
import { gamma } from './special/gamma';

export type Units = { system: 'geo'; G: number } | { system: 'cft'; c: number } | { system: 'sym'; N: number };

/**
 * Newton's constant (L = 1) from the pad's units:
 *   geo: G as given;
 *   cft (d = 2 only): c = 3/(2G) (Brown & Henneaux, Commun. Math. Phys. 104 (1986) 207) → G = 3/(2c);
 *   sym (d = 4 only): L³/G₅ = 2N²/π for N = 4 SYM (Gubser, Klebanov & Peet 1996) → G = π/(2N²).
 */
export function newtonG(units: Units, d: number): number {
	switch (units?.system) {
		case 'geo':
			if (!(units.G > 0) || !Number.isFinite(units.G)) throw new HoloError('G must be positive', 'G');
			return units.G;
		case 'cft':
			if (d !== 2)
				throw new HoloError(
					'units cft needs d = 2',
					'd',
					`c = 3/(2G) is the d = 2 (BTZ) relation; for this bulk: units geo G=${3 / (2 * units.c)}`
				);
			if (!(units.c > 0) || !Number.isFinite(units.c)) throw new HoloError('c must be positive', 'c');
			return 3 / (2 * units.c);
		case 'sym':
			if (d !== 4)
				throw new HoloError(
					'units sym needs d = 4',
					'd',
					`L³/G₅ = 2N²/π is for N = 4 SYM (d = 4); for this bulk: units geo G=${Math.PI / (2 * units.N * units.N)}`
				);
			if (!(units.N > 0) || !Number.isFinite(units.N)) throw new HoloError('N must be positive', 'N');
			return Math.PI / (2 * units.N * units.N);
		default:
			throw new HoloError('units must be geo, cft or sym', 'units');
	}
}

/** S = A/(4G) (Ryu & Takayanagi 2006). */
export function entropy(area: number, G: number): number {
	if (!(G > 0) || !Number.isFinite(G)) throw new HoloError('G must be positive', 'G');
	return area / (4 * G);
}

/**
 * First-law constant of the strip, T_ent = c_d / l:
 * c_d = 2(d²−1) Γ(d/(2(d−1)))² Γ((d+1)/(2(d−1))) / (√π Γ(1/(2(d−1)))² Γ(1/(d−1)))
 * (Bhattacharya, Nozaki, Takayanagi & Ugajin, PRL 110 (2013) 091602); c₂ = 3/π.
 */
export function cd(d: number): number {
	if (!Number.isInteger(d) || d < 2 || d > 10) throw new HoloError('d must be an integer in 2..10', 'd');
	const m = 2 * (d - 1);
	const g1 = gamma(d / m);
	const g2 = gamma(1 / m);
	return (2 * (d * d - 1) * g1 * g1 * gamma((d + 1) / m)) / (Math.sqrt(Math.PI) * g2 * g2 * gamma(1 / (d - 1)));
}
