import { beta } from '../special/beta';
import { addMul } from './coeffs';

/**
 * Small-width series of the charged brane (planar Reissner–Nordström–AdS, d ≥ 3):
 *   f = 1 − (1+q²) ζ^d u^d + q² ζ^m u^m,  ζ = z* / zh,  u = z/z*,  m = 2(d−1),  h = 1,
 *   ΔA = l^{2−d} Σ_K c_K(q²) (l/zh)^K,   K ∈ {d a + m b : a, b ≥ 0, a + b ≥ 1}.
 *
 * Method: the one of coeffs.ts (brane), written in the single real variable ζ instead of t = ζ^d, so that both
 * powers of f are plain integer exponents. 1/√f = Σ_j C(−½, j)(−g)^j with g = (1+q²)ζ^d u^d − q² ζ^m u^m, and
 * g^j expands binomially into ζ^{da+mb} u^{da+mb} (1+q²)^a (−q²)^b, a + b = j. Every such term of the width
 * and area integrals is ∫₀¹ u^e (1 − u^m)^{−1/2} du = B((e+1)/m, ½)/m, which depends on K = da + mb only:
 *   W(ζ) = 2 Σ_K B((d+K)/m, ½)/m · p_K(q²) ζ^K,   S(ζ) = Σ_K B((2−d+K)/m, ½)/m · p_K(q²) ζ^K
 * (the area's Beta at negative argument is the analytic continuation, i.e. the Hadamard finite part that the
 * subtraction of 2/((d−2)ε^{d−2}) leaves), p_K = Σ_{da+mb=K} C(−½, a+b)(−1)^{a+b} C(a+b, b)(1+q²)^a(−q²)^b.
 * Then l = z* W, A_fin = 2 z*^{2−d} S; with P = W/W₀ and T = (l/zh)/W₀ = ζ P(ζ), Lagrange inversion gives
 *   [T^K] G(ζ(T)) = (1/K) [ζ^{K−1}] G'(ζ) P(ζ)^{−K},  G = P^{d−2} S,   c_K = 2 W₀^{d−2−K} [T^K] G,
 * every c_K a polynomial in q² of degree ≤ K/d. At q = 0 only K = kd survive and c_{kd} is the brane's a_k.
 * Powers of P by J. C. P. Miller's recurrence, skipping the zero entries of P.
 *
 * "Order n" keeps every K ≤ n d: the same cut in (l/zh) as the other bulks (the brane's order n is K = d…nd),
 * so the q² term ζ^m first enters at order 2 (m ≤ 2d). d = 2 needs none of this: m = d and the charge drops
 * out of f (f = 1 − (z/zh)²), so the charged brane is the BTZ brane there (series/index.ts delegates).
 *
 * LaTeX: exact-charged.ts (the same computation over ℚ in q², π and B(s/m, ½)), exact to order 6.
 * Accuracy in doubles: q = 0 reproduces the brane's a_k to ≤ 1e−12 and q = 0.5, d = 4 the 40-digit mpmath
 * expansion (tests/fixtures/holo/charged_runner.py) to ≤ 1e−12 (measured in series-charged.test.ts).
 */

type Poly = Float64Array; // coefficients of (q²)^0..(q²)^N

export interface ChargedSeries {
	/** exponents K of l/zh, ascending */
	powers: number[];
	/** c_K as coefficients of (q²)^0, (q²)^1, … */
	polys: number[][];
}

/** The exponents {da + mb} ≤ top, ascending (a + b ≥ 1). */
export function chargedPowers(d: number, top: number): number[] {
	const m = 2 * (d - 1);
	const set = new Set<number>();
	for (let a = 0; a * d <= top; a++) for (let b = 0; a * d + b * m <= top; b++) if (a + b > 0) set.add(a * d + b * m);
	return [...set].sort((x, y) => x - y);
}

function binom(a: number, k: number): number {
	let r = 1;
	for (let i = 0; i < k; i++) r = (r * (a - i)) / (i + 1);
	return r;
}

const isZero = (p: Poly) => p.every((x) => x === 0);

/** p_K(q²) for K = 0…M (index K), degree ≤ N. */
function expansionPolys(d: number, M: number, N: number): Poly[] {
	const m = 2 * (d - 1);
	const p = Array.from({ length: M + 1 }, () => new Float64Array(N + 1));
	for (let a = 0; a * d <= M; a++) {
		for (let b = 0; a * d + b * m <= M; b++) {
			const j = a + b;
			const c = binom(-0.5, j) * (j % 2 ? -1 : 1) * binom(j, b) * (b % 2 ? -1 : 1);
			// (1+q²)^a (q²)^b
			for (let r = 0; r <= a && r + b <= N; r++) p[a * d + b * m][r + b] += c * binom(a, r);
		}
	}
	return p;
}

/** Q = P^α to degree M for P with P₀ = 1, skipping the zero entries of P (Miller's recurrence). */
function powSeries(P: Poly[], nz: number[], alpha: number, M: number, N: number): Poly[] {
	const Q = Array.from({ length: M + 1 }, () => new Float64Array(N + 1));
	Q[0][0] = 1;
	for (let n = 1; n <= M; n++) {
		for (const k of nz) {
			if (k > n) break;
			addMul(Q[n], P[k], Q[n - k], ((alpha + 1) * k - n) / n);
		}
	}
	return Q;
}

function mulSeries(A: Poly[], B: Poly[], M: number, N: number): Poly[] {
	const out = Array.from({ length: M + 1 }, () => new Float64Array(N + 1));
	for (let i = 0; i <= M; i++) {
		if (isZero(A[i])) continue;
		for (let j = 0; i + j <= M; j++) addMul(out[i + j], A[i], B[j], 1);
	}
	return out;
}

const cache = new Map<number, { n: number; s: ChargedSeries }>();

/** c_K(q²) for every K ≤ n d (d ≥ 3), cached per d (a larger n recomputes once). */
export function chargedSeries(d: number, n: number): ChargedSeries {
	const hit = cache.get(d);
	if (hit && hit.n >= n) {
		const top = n * d;
		const cnt = hit.s.powers.filter((K) => K <= top).length;
		return { powers: hit.s.powers.slice(0, cnt), polys: hit.s.polys.slice(0, cnt) };
	}
	const m = 2 * (d - 1);
	const M = n * d;
	const N = n + 1;
	const p = expansionPolys(d, M, N);
	// only K in the exponent set carry a Beta value (elsewhere, e.g. K = d − 2, B would have a pole)
	const W = p.map((x, K) => (isZero(x) ? x : x.map((v) => (2 * v * beta((d + K) / m, 0.5)) / m)));
	const S = p.map((x, K) => (isZero(x) ? x : x.map((v) => (v * beta((2 - d + K) / m, 0.5)) / m)));
	const W0 = W[0][0];
	const P = W.map((x) => x.map((v) => v / W0));
	const nz = P.map((x, K) => (K > 0 && !isZero(x) ? K : -1)).filter((K) => K > 0);
	const G = mulSeries(powSeries(P, nz, d - 2, M, N), S, M, N);
	const powers = chargedPowers(d, M);
	const polys = powers.map((K) => {
		const PK = powSeries(P, nz, -K, K - 1, N);
		const c = new Float64Array(N + 1);
		// [ζ^{K−1}] G' P^{−K}: G' has (i+1) G_{i+1} at ζ^i
		for (let i = 0; i < K; i++) if (!isZero(G[i + 1])) addMul(c, G[i + 1], PK[K - 1 - i], i + 1);
		const scale = (2 * Math.pow(W0, d - 2 - K)) / K;
		const deg = Math.floor(K / d);
		return Array.from(c.slice(0, deg + 1), (x) => x * scale);
	});
	const s = { powers, polys };
	cache.set(d, { n, s });
	return s;
}

/** c_K at a given q² by Horner. */
export function evalQ2(poly: number[], q2: number): number {
	let s = 0;
	for (let r = poly.length - 1; r >= 0; r--) s = s * q2 + poly[r];
	return s;
}

/** Empties the cache (benchmarks). */
export function clearChargedCache(): void {
	cache.clear();
}
