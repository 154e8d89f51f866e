/**
 * Gauss–Legendre nodes and weights on [−1, 1].
 * Method: Newton's iteration on P_n from the Tricomi initial guesses, with the three-term recurrence for
 * P_n and P_n' (common practice; Golub–Welsch would give the same to rounding). Nodes are accurate to a
 * few ulps for n ≤ 200. Results are cached per n (the strip calls this with a handful of fixed n).
 * Error of the rule for f analytic inside the Bernstein ellipse E_ρ: O(ρ^{−2n}).
 */
export interface GaussRule {
	x: Float64Array;
	w: Float64Array;
}

const cache = new Map<number, GaussRule>();

/** P_n(z) and P_n'(z) by the three-term recurrence (P_{n−1} falls out of the same loop). */
function legendre(n: number, z: number): { p: number; dp: number } {
	let p0 = 1;
	let p1 = z;
	for (let k = 2; k <= n; k++) {
		const p2 = ((2 * k - 1) * z * p1 - (k - 1) * p0) / k;
		p0 = p1;
		p1 = p2;
	}
	return { p: p1, dp: (n * (z * p1 - p0)) / (z * z - 1) };
}

export function gaussLegendre(n: number): GaussRule {
	const hit = cache.get(n);
	if (hit) return hit;
	const x = new Float64Array(n);
	const w = new Float64Array(n);
	const m = Math.floor((n + 1) / 2);
	for (let i = 0; i < m; i++) {
		let z = Math.cos((Math.PI * (i + 0.75)) / (n + 0.5));
		for (let it = 0; it < 100; it++) {
			const { p, dp } = legendre(n, z);
			const dz = p / dp;
			z -= dz;
			if (Math.abs(dz) < 1e-16) break;
		}
		const { dp } = legendre(n, z);
		x[i] = -z;
		x[n - 1 - i] = z;
		w[i] = w[n - 1 - i] = 2 / ((1 - z * z) * dp * dp);
	}
	const rule = { x, w };
	cache.set(n, rule);
	return rule;
}
