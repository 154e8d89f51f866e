import { HoloError } from '../errors';
import { betaHalfShift } from '../special/beta';
import type { Ring } from './ring';

/**
 * Small-width series of the strip on any static slice f(z) = Σ f_k z^k, h(z) = Σ h_k z^k (f₀ = h₀ = 1, d ≥ 3):
 *   ΔA = l^{2−d} Σ_{K≥1} c_K l^K,   c_K a polynomial in the Taylor coefficients.
 *
 * The method of the charged brane (series/charged.ts), with every power of z allowed and h ≠ 1 as in the boosted
 * brane (series/coeffs.ts). With u = z/z*, m = 2(d−1), the width and area (strip.ts) are
 *   l/2 = z* √h(z*) ∫₀¹ u^{d−1} f^{−½}(z*u) D^{−½} du,   A/2 = z*^{2−d} ∫₀¹ u^{1−d} h f^{−½}(z*u) D^{−½} du,
 *   D = h(z*u) − h(z*) u^m = (1 − u^m) + δ,   δ = Σ_k h_k z*^k (u^k − u^m),
 * and D^{−½} = Σ_n C(−½, n) δ^n (1 − u^m)^{−½−n}. Every term is ∫₀¹ u^E (1 − u^m)^{−½−n} du = B((E+1)/m, ½−n)/m,
 * analytically continued: the Hadamard finite part, which is additive, equals the convergent integral for the
 * sum (δ vanishes at u = 1), and at u = 0 removes the area-law divergence as A_fin does. A pole of that Beta
 * (E + 1 a non-positive multiple of m) is a log divergence of the area: a source is turned on, and ΔA depends on
 * the cutoff, so it is refused, naming the power. Then, as for the charged brane, with W = l/z*, S = A_fin/(2z*^{2−d}),
 * P = W/W₀, G = P^{d−2} S: c_K = 2 W₀^{d−2−K} (1/K) [ζ^{K−1}] G'(ζ) P(ζ)^{−K} (Lagrange inversion).
 */
function binomHalf(n: number): number {
	let r = 1;
	for (let i = 0; i < n; i++) r = (r * (-0.5 - i)) / (i + 1);
	return r;
}

/** a · num/den: exactly in an exact ring, else one rounding of num/den. */
function scaleQ<T>(R: Ring<T>, a: T, num: number, den: number): T {
	return R.exact ? R.exact.scaleQ(a, num, den) : R.scale(a, num / den);
}

/** a^p for a series with a₀ = 1, p a half-integer or integer (Miller's recurrence, skipping zero coefficients). */
function powSeries<T>(R: Ring<T>, a: T[], p: number, M: number): T[] {
	const nz = a.map((x, k) => (k > 0 && !R.isZero(x) ? k : -1)).filter((k) => k > 0);
	const c: T[] = [R.one];
	for (let n = 1; n <= M; n++) {
		let s = R.zero;
		for (const k of nz) {
			if (k > n) break;
			if (!R.isZero(c[n - k]!)) s = R.add(s, scaleQ(R, R.mul(a[k]!, c[n - k]!), (2 * p + 2) * k - 2 * n, 2 * n));
		}
		c.push(s);
	}
	return c;
}

function mulSeries<T>(R: Ring<T>, a: T[], b: T[], M: number): T[] {
	const c: T[] = Array.from({ length: M + 1 }, () => R.zero);
	for (let i = 0; i <= M; i++) {
		if (R.isZero(a[i]!)) continue;
		for (let j = 0; i + j <= M; j++) if (!R.isZero(b[j]!)) c[i + j] = R.add(c[i + j]!, R.mul(a[i]!, b[j]!));
	}
	return c;
}

/** δ^n as K (power of z*) → e (power of u) → coefficient, for n = 0..M. */
function deltaPowers<T>(R: Ring<T>, h: T[], m: number, M: number): Map<number, Map<number, T>>[] {
	const delta = new Map<number, Map<number, T>>();
	for (let k = 1; k <= M; k++) {
		if (R.isZero(h[k]!) || k === m) continue;
		delta.set(
			k,
			new Map([
				[k, h[k]!],
				[m, R.scale(h[k]!, -1)]
			])
		);
	}
	const out = [new Map([[0, new Map([[0, R.one]])]])];
	if (delta.size === 0) return out;
	for (let n = 1; n <= M; n++) {
		const prev = out[n - 1]!;
		const next = new Map<number, Map<number, T>>();
		for (const [K1, e1] of prev) {
			for (const [K2, e2] of delta) {
				if (K1 + K2 > M) continue;
				const row = next.get(K1 + K2) ?? new Map<number, T>();
				for (const [a, x] of e1) for (const [b, y] of e2) row.set(a + b, R.add(row.get(a + b) ?? R.zero, R.mul(x, y)));
				next.set(K1 + K2, row);
			}
		}
		if (next.size === 0) break;
		out.push(next);
	}
	return out;
}

export interface MetricSeries<T> {
	/** c_K for K = 1..M (index K − 1): ΔA = l^{2−d} Σ c_K l^K */
	c: T[];
}

/**
 * c_1..c_M from the Taylor coefficients f[0..M], h[0..M] (f[0] = h[0] = 1) over ring R. Throws HoloError at a
 * log divergence of the area (a source) and for d = 2 (the vacuum's own log needs the BTZ form).
 */
export function metricSeries<T>(R: Ring<T>, d: number, f: T[], h: T[], M: number): MetricSeries<T> {
	if (d < 3) throw new HoloError('the series of a custom metric needs d ≥ 3', 'd', 'use o=exact');
	const m = 2 * (d - 1);
	const phi = powSeries(R, f, -0.5, M); // f^{−½}
	const psi = mulSeries(R, h, phi, M); // h f^{−½}
	const sigma = powSeries(R, h, 0.5, M); // √h
	const dn = deltaPowers(R, h, m, M);
	const IW: T[] = Array.from({ length: M + 1 }, () => R.zero);
	const IA: T[] = Array.from({ length: M + 1 }, () => R.zero);
	dn.forEach((byK, n) => {
		const cn = binomHalf(n);
		for (const [K2, row] of byK) {
			for (let K1 = 0; K1 + K2 <= M; K1++) {
				const a = phi[K1]!;
				const b = psi[K1]!;
				if (R.isZero(a) && R.isZero(b)) continue;
				for (const [e, x] of row) {
					if (R.isZero(x)) continue;
					const K = K1 + K2;
					if (!R.isZero(a))
						IW[K] = R.add(
							IW[K]!,
							R.exact ? R.exact.scaleBeta(R.mul(a, x), d + K1 + e, n) : R.scale(R.mul(a, x), (cn * betaHalfShift((d + K1 + e) / m, n)) / m)
						);
					if (!R.isZero(b)) {
						const s = (2 - d + K1 + e) / m;
						if (s <= 0 && Number.isInteger(s)) {
							throw new HoloError(
								`the area has a log divergence from the z^${K} terms of f, h: not a normalisable deformation (a source is turned on)`,
								'f',
								'ΔA then depends on the cutoff; use a metric whose departure from AdS starts at z^d or later'
							);
						}
						IA[K] = R.add(
							IA[K]!,
							R.exact ? R.exact.scaleBeta(R.mul(b, x), 2 - d + K1 + e, n) : R.scale(R.mul(b, x), (cn * betaHalfShift(s, n)) / m)
						);
					}
				}
			}
		}
	});
	const W0 = (2 * betaHalfShift(d / m, 0)) / m;
	const W = mulSeries(R, sigma, IW, M).map((x) => (R.exact ? R.exact.divW0(R.scale(x, 2)) : R.scale(x, 2 / W0))); // P = W/W₀
	const G = mulSeries(R, powSeries(R, W, d - 2, M), IA, M);
	const c: T[] = [];
	for (let K = 1; K <= M; K++) {
		const PK = powSeries(R, W, -K, K - 1);
		let s = R.zero;
		for (let i = 0; i < K; i++) if (!R.isZero(G[i + 1]!)) s = R.add(s, R.scale(R.mul(G[i + 1]!, PK[K - 1 - i]!), i + 1));
		c.push(R.exact ? R.exact.finish(s, K) : R.scale(s, (2 * Math.pow(W0, d - 2 - K)) / K));
	}
	return { c };
}
