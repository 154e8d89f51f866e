/**
 * Radius of convergence of Σ a_k τ^k from its coefficients: ratio test r_k = |a_k / a_{k+1}| extrapolated in
 * 1/k (Domb–Sykes: r_k = R + c/k + O(1/k²) for an algebraic or logarithmic singularity, so
 * R ≈ k r_k − (k−1) r_{k−1} at the last pair; common practice). Exact for the d = 2 series, where
 * r_k = (2π)²(1 + 1/k) up to ζ(2k) − 1. Returns Infinity when the tail vanishes.
 */
export function radiusFromCoeffs(a: number[]): number {
	const K = a.length;
	if (K < 3) return Infinity;
	const r = (k: number) => Math.abs(a[k - 1] / a[k]); // k is 1-based: a_k / a_{k+1}
	const last = K - 1;
	const R = last * r(last) - (last - 1) * r(last - 1);
	if (!Number.isFinite(R) || R <= 0) return r(last);
	return R;
}
