import { betaHalfShift } from '../special/beta';

/**
 * Closed-form series coefficients of the strip on f = 1 − α(z/zh)^d, h = 1 + β(z/zh)^d, α = 1:
 *   ΔA = l^{2−d} Σ_k a_k(κ) (l/zh)^{kd},  a_k(κ) = Σ_r c_{k,r} κ^r   (β = κ = γ²v²; the wave is c_{k,k}).
 *
 * Method (derivation in the test file and in tests/fixtures/holo/runner.py, which repeats it at 40 digits):
 * with t = (z* / zh)^d, m = 2(d−1), expand 1/√f and 1/√(ρ − 1) binomially; every term of the width and
 * area integrals is ∫₀¹ u^e (1 − u^m)^{−1/2−n} du = B((e+1)/m, ½ − n)/m, analytically continued (the
 * continuation is the Hadamard finite part, which is what subtracting the 1/ε^{d−2} divergence does). This
 * gives l = z* W(t) and A_fin = 2 z*^{2−d} S(t); with P = W/W₀ and T = τ/W₀^d, Lagrange inversion of
 * T = t P(t)^d gives [T^k] G(t(T)) = (1/k) [t^{k−1}] G'(t) P(t)^{−dk} for G = P^{d−2} S, and
 * a_k = 2 W₀^{d−2} [T^k]G / W₀^{dk}. Powers of P by J. C. P. Miller's recurrence.
 * Accuracy in doubles (against the 60-digit fixtures): ≤ 1e−12 relative for d = 4…10, k ≤ 14; d = 3 reaches
 * 2e−12 at k = 12 and 1.4e−11 at k = 14 (cancellation in the inversion). d = 2 loses
 * ~(2π)^{2k} to cancellation, so d = 2 uses the closed form (`btzCoeffs`).
 */

type Poly = Float64Array; // coefficients of κ^0..κ^N
type Series = Poly[]; // coefficients of t^0..t^M

function zeros(M: number, N: number): Series {
	return Array.from({ length: M + 1 }, () => new Float64Array(N + 1));
}

/** out += c·a·b, truncated at out's length (polynomials in one parameter, lowest power first). */
export function addMul(out: Float64Array, a: Float64Array, b: Float64Array, c: number): void {
	const N = out.length - 1;
	for (let i = 0; i < a.length; i++) {
		const x = a[i];
		if (x === 0) continue;
		for (let j = 0; j + i <= N && j < b.length; j++) out[i + j] += c * x * b[j];
	}
}

function mulSeries(A: Series, B: Series, M: number): Series {
	const out = zeros(M, A[0].length - 1);
	for (let i = 0; i <= M; i++) for (let j = 0; i + j <= M; j++) addMul(out[i + j], A[i], B[j], 1);
	return out;
}

/** P^α for P with P₀ = 1 (Miller: Q_n = (1/n) Σ_{k=1}^n ((α+1)k − n) P_k Q_{n−k}). */
function powSeries(P: Series, alpha: number, M: number): Series {
	const Q = zeros(M, P[0].length - 1);
	Q[0][0] = 1;
	for (let n = 1; n <= M; n++) {
		for (let k = 1; k <= n; k++) addMul(Q[n], P[k], Q[n - k], ((alpha + 1) * k - n) / n);
	}
	return Q;
}

function derivative(A: Series): Series {
	const out = A.slice(1).map((p, k) => p.map((x) => (k + 1) * x));
	out.push(new Float64Array(A[0].length));
	return out;
}

function binom(a: number, k: number): number {
	let r = 1;
	for (let i = 0; i < k; i++) r = (r * (a - i)) / (i + 1);
	return r;
}

/** Width W(t) and area S(t) series (coefficients polynomials in κ), to order M in t. */
export function stripSeries(d: number, M: number): { W: Series; S: Series } {
	const m = 2 * (d - 1);
	const W = zeros(M, M);
	const S = zeros(M, M);
	for (let j = 0; j <= M; j++) {
		for (let n = 0; j + n <= M; n++) {
			const c = binom(-0.5, j) * (j % 2 ? -1 : 1) * binom(-0.5, n);
			for (let i = 0; i <= n; i++) {
				const ci = c * binom(n, i) * (i % 2 ? -1 : 1);
				if (ci === 0) continue;
				const e = d - 1 + n * d + i * (d - 2) + j * d;
				W[j + n][n] += (ci * betaHalfShift((e + 1) / m, n)) / m;
				const ea = 1 - d + n * d + i * (d - 2) + j * d;
				if (!(d === 2 && ea === -1)) S[j + n][n] += (ci * betaHalfShift((ea + 1) / m, n)) / m;
				if (j + n + 1 <= M) S[j + n + 1][n + 1] += (ci * betaHalfShift((ea + d + 1) / m, n)) / m;
			}
		}
	}
	const sq = zeros(M, M);
	for (let r = 0; r <= M; r++) sq[r][r] = 2 * binom(0.5, r);
	return { W: mulSeries(W, sq, M), S };
}

const cache = new Map<string, number[][]>();

/** a_k(κ) for k = 1..n as coefficient arrays (κ^0..κ^k), d ≥ 3. Cached per (d, n). */
export function kappaCoeffs(d: number, n: number): number[][] {
	const key = `${d}:${n}`;
	const hit = cache.get(key);
	if (hit) return hit;
	const M = n + 1;
	const { W, S } = stripSeries(d, M);
	const W0 = W[0][0];
	const P = W.map((p) => p.map((x) => x / W0));
	const G = d === 2 ? S : mulSeries(powSeries(P, d - 2, M), S, M);
	let dG = derivative(G);
	if (d === 2) {
		const t1 = mulSeries(derivative(P), powSeries(P, -1, M), M);
		dG = dG.map((p, k) => p.map((x, r) => x - t1[k][r]));
	}
	const out: number[][] = [];
	for (let k = 1; k <= n; k++) {
		const Pk = powSeries(P, -d * k, k - 1);
		const c = new Float64Array(M + 1);
		for (let i = 0; i < k; i++) addMul(c, dG[i], Pk[k - 1 - i], 1);
		const scale = (2 * Math.pow(W0, d - 2)) / k / Math.pow(W0, d * k);
		out.push(Array.from(c.slice(0, k + 1), (x) => x * scale));
	}
	cache.set(key, out);
	return out;
}

/** Empties the coefficient cache (benchmarks time the cold computation with it). */
export function clearCoeffCache(): void {
	cache.clear();
}
