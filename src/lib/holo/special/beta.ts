import { gamma, lgamma, rgamma } from './gamma';

/**
 * Euler's Beta function B(x, y) = Γ(x)Γ(y)/Γ(x+y), analytically continued to negative non-integer
 * arguments (the continuation the strip series relies on: it equals the Hadamard finite part of
 * ∫₀¹ t^{x−1}(1−t)^{y−1} dt). Method: the Γ ratio directly while the arguments are moderate (relative
 * error ≈ 3× that of Γ, ≲ 1e−14), log-Γ for large ones. Returns 0 when x + y is a pole and x, y are not.
 */
export function beta(x: number, y: number): number {
	if (Number.isNaN(x) || Number.isNaN(y)) return NaN;
	const s = x + y;
	if (x > 0 && y > 0 && (x > 150 || y > 150 || s > 150)) {
		return Math.exp(lgamma(x) + lgamma(y) - lgamma(s));
	}
	return gamma(x) * gamma(y) * rgamma(s);
}

/**
 * B(x, ½ − n) for integer n ≥ 0, written as B(x, ½)·∏_{k=1}^{n} (x + ½ − k)/(½ − k): the product keeps the
 * zeros at x + ½ − n ∈ {0, −1, …} exact and needs only one Beta value.
 */
export function betaHalfShift(x: number, n: number): number {
	let r = 1;
	for (let k = 1; k <= n; k++) r *= (x + 0.5 - k) / (0.5 - k);
	return r === 0 ? 0 : r * beta(x, 0.5);
}
