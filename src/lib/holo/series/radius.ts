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

/**
 * Radius of convergence in x of Σ c_K x^K over a sparse, irregular exponent set (the charged brane's
 * K ∈ {da + m b}), where a ratio of neighbours means nothing: the coefficients' growth is fitted instead.
 * Cauchy–Hadamard with the algebraic prefactor of a branch point, ln|c_K| ≈ A − K ln R + γ ln K, is fitted by
 * least squares to the envelope — in each block K ∈ ((j−1)w, jw] the largest ln|c_K| + K ln R of the
 * current estimate — over the upper half of the blocks, twice (common practice for lacunary series). On a
 * one-term-per-block series (the brane, w = d) this is the three-parameter fit of its a_k, close to the
 * Domb–Sykes value of `radiusFromCoeffs` but not identical: an estimate, good to a few per cent.
 */
export function radiusFromGrowth(powers: number[], c: number[], w: number): number {
	const pts = powers.map((K, i) => ({ K, y: Math.log(Math.abs(c[i])) })).filter((p) => Number.isFinite(p.y));
	if (pts.length < 4) return Infinity;
	const top = Math.ceil(pts[pts.length - 1].K / w);
	let lnR = 0;
	for (let pass = 0; pass < 3; pass++) {
		const env: { K: number; y: number }[] = [];
		for (let j = Math.ceil(top / 2); j <= top; j++) {
			let best: { K: number; y: number } | undefined;
			for (const p of pts) if (p.K > (j - 1) * w && p.K <= j * w && (!best || p.y + p.K * lnR > best.y + best.K * lnR)) best = p;
			if (best) env.push(best);
		}
		if (env.length < 3) return Infinity;
		const fit = leastSquares(env.map((p) => [1, p.K, Math.log(p.K)]), env.map((p) => p.y));
		if (!fit) return Infinity;
		lnR = -fit[1];
	}
	return Math.exp(lnR);
}

/** Least squares by the normal equations (3 unknowns, well-separated columns). */
function leastSquares(X: number[][], y: number[]): number[] | undefined {
	const n = X[0].length;
	const A = Array.from({ length: n }, (_, i) => Array.from({ length: n + 1 }, (_, j) => (j < n ? X.reduce((s, r) => s + r[i] * r[j], 0) : X.reduce((s, r, k) => s + r[i] * y[k], 0))));
	for (let i = 0; i < n; i++) {
		let piv = i;
		for (let r = i + 1; r < n; r++) if (Math.abs(A[r][i]) > Math.abs(A[piv][i])) piv = r;
		[A[i], A[piv]] = [A[piv], A[i]];
		if (A[i][i] === 0) return undefined;
		for (let r = 0; r < n; r++) {
			if (r === i) continue;
			const f = A[r][i] / A[i][i];
			for (let j = i; j <= n; j++) A[r][j] -= f * A[i][j];
		}
	}
	return A.map((row, i) => row[n] / row[i]);
}
