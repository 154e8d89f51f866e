/**
 * d = 2 (BTZ) coefficients in closed form: ΔA = 2 ln(sinh x / x), x = l/(2zh), and
 * ln(sinh x / x) = Σ_{k≥1} 2^{2k} B_{2k} x^{2k} / (2k (2k)!)  (Bernoulli numbers; common practice), so
 * a_k = B_{2k} / (k (2k)!) for τ = (l/zh)². Bernoulli numbers exactly, as BigInt fractions, from the
 * recurrence Σ_{j=0}^{n} C(n+1, j) B_j = 0. Nearest singularity: x = ±iπ, i.e. |l| = 2π zh.
 */
export interface Fraction {
	num: bigint;
	den: bigint;
}

/** Greatest common divisor of two BigInts (the one used by every exact-rational module here). */
export function gcd(a: bigint, b: bigint): bigint {
	a = a < 0n ? -a : a;
	b = b < 0n ? -b : b;
	while (b) [a, b] = [b, a % b];
	return a;
}

export function fraction(num: bigint, den: bigint): Fraction {
	if (den < 0n) [num, den] = [-num, -den];
	const g = gcd(num, den) || 1n;
	return { num: num / g, den: den / g };
}

function add(a: Fraction, b: Fraction): Fraction {
	return fraction(a.num * b.den + b.num * a.den, a.den * b.den);
}

const bern: Fraction[] = [{ num: 1n, den: 1n }];

/** B_n (B₁ = −½ convention). */
export function bernoulli(n: number): Fraction {
	while (bern.length <= n) {
		const k = bern.length; // Σ_{j<k} C(k+1, j) B_j + (k+1) B_k = 0
		let s: Fraction = { num: 0n, den: 1n };
		let c = 1n; // C(k+1, j)
		for (let j = 0; j < k; j++) {
			s = add(s, fraction(c * bern[j].num, bern[j].den));
			c = (c * BigInt(k + 1 - j)) / BigInt(j + 1);
		}
		bern.push(fraction(-s.num, s.den * BigInt(k + 1)));
	}
	return bern[n];
}

/** a_k = B_{2k}/(k (2k)!) as an exact fraction. */
export function btzCoeff(k: number): Fraction {
	let f = 1n;
	for (let i = 2n; i <= BigInt(2 * k); i++) f *= i;
	const b = bernoulli(2 * k);
	return fraction(b.num, b.den * BigInt(k) * f);
}

/** Double value of a fraction with BigInt parts of any size (truncation error ≤ 2^−63 relative). */
export function fractionValue(x: Fraction): number {
	const neg = x.num < 0n;
	const a = neg ? -x.num : x.num;
	const sa = Math.max(0, a.toString(2).length - 64);
	const sd = Math.max(0, x.den.toString(2).length - 64);
	const v = (Number(a >> BigInt(sa)) / Number(x.den >> BigInt(sd))) * Math.pow(2, sa - sd);
	return neg ? -v : v;
}
