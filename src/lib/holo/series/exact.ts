import { fraction } from './btz';
import {
	addProduct,
	invertMonomial,
	monomial,
	normalize,
	rat,
	ratMul,
	scale,
	terms,
	zero,
	type Fraction,
	type LPoly,
	type Term
} from './laurent';

/**
 * Exact series coefficients a_k(κ) for d ≥ 3: the computation of `coeffs.ts` (same expansion, same Lagrange
 * inversion) carried out in ℚ[κ, π, B₁^{±1}, …, B_{d−2}^{±1}] with B_s = B(s/m, ½), m = 2(d−1).
 *
 * Every integral of the expansion is B(r/m, ½ − n)/m for an integer r. Exact reductions to the atoms:
 *   B(x, ½ − n) = B(x, ½) ∏_{k=1}^{n} (x + ½ − k)/(½ − k)              (Γ(y+1) = yΓ(y))
 *   B(x + 1, ½) = B(x, ½) · x/(x + ½)                                   (same)
 *   B(x, ½) B(x + ½, ½) = π/x,  B(½, ½) = π,  B(1, ½) = 2               (Γ(x)Γ(x+½)… telescopes)
 * so each residue s = r mod m reduces to a rational multiple of B_s (1 ≤ s ≤ d−2), of π/B_{s−d+1}
 * (d ≤ s ≤ 2d−3), of π (s = d−1) or of 1 (s ≡ 0). W₀ = 2π/B₁ is a monomial, so the only divisions are by
 * monomials and by integers (Miller's recurrence), and every a_k is a Laurent polynomial with rational
 * coefficients in these atoms. No further relation between the B_s is used (Gauss's multiplication formula
 * relates some of them through algebraic numbers); the form is canonical for that choice of atoms.
 *
 * Atom order in exponent vectors: 0 = κ, 1 = π, 1 + s = B_s. Arithmetic: laurent.ts (own BigInt code, not
 * nerdamer: see there). Checked in tests/unit/holo/series-latex.test.ts against 60-digit mpmath numerics to
 * 1e−28 (brane and wave to order 14, boosted to order 12, d = 3…10).
 */

export interface ExactSeries {
	d: number;
	m: number;
	/** a_1..a_n as terms; κ is atom 0 (exponent 0 throughout for the static brane). */
	a: Term[][];
}

export function nAtoms(d: number): number {
	return d; // κ, π, B_1..B_{d−2}
}

/** B(r/m, ½) as an exact Laurent monomial. */
function betaHalfAtom(d: number, r: number): LPoly {
	const m = 2 * (d - 1);
	const N = nAtoms(d);
	// s in 1..m with r ≡ s (mod m); x = r/m = s/m + q
	let s = ((r % m) + m) % m;
	if (s === 0) s = m;
	const q = (r - s) / m;
	let c: Fraction = rat(1);
	let base: LPoly;
	if (s === m) base = monomial(N, rat(2));
	else if (s === d - 1) base = monomial(N, rat(1), { 1: 1 });
	else if (s < d - 1) base = monomial(N, rat(1), { [1 + s]: 1 });
	else {
		const sp = s - (d - 1);
		base = monomial(N, rat(m, sp), { 1: 1, [1 + sp]: -1 });
	}
	// up: B(y+1, ½) = B(y, ½)·y/(y+½), y = (s + i m)/m
	for (let i = 0; i < q; i++) c = ratMul(c, rat(2 * (s + i * m), 2 * (s + i * m) + m));
	// down: B(y, ½) = B(y+1, ½)·(y+½)/y, y = (s − i m)/m
	for (let i = 1; i <= -q; i++) {
		const y = s - i * m;
		if (y === 0) throw new Error(`B(x, 1/2) has a pole at x = ${r}/${m}`);
		c = ratMul(c, rat(2 * y + m, 2 * y));
	}
	return scale(base, c);
}

/** B(r/m, ½ − n)/m. */
export function betaShifted(d: number, r: number, n: number): LPoly {
	const m = 2 * (d - 1);
	// ∏ (x + ½ − k)/(½ − k) with x = r/m: (2r + m − 2km)/(m(1 − 2k))
	let c: Fraction = rat(1, m);
	for (let k = 1; k <= n; k++) c = ratMul(c, rat(2 * r + m - 2 * k * m, m * (1 - 2 * k)));
	if (c.num === 0n) return zero(nAtoms(d));
	return scale(betaHalfAtom(d, r), c);
}

/** Binomial coefficient C(a, k) for a rational a = an/ad. */
export function binomRat(an: number, ad: number, k: number): Fraction {
	let r: Fraction = rat(1);
	for (let i = 0; i < k; i++) r = ratMul(r, fraction(BigInt(an - i * ad), BigInt(ad * (i + 1))));
	return r;
}

type Series = LPoly[];

function zeros(M: number, N: number): Series {
	return Array.from({ length: M + 1 }, () => zero(N));
}

/** Each coefficient of a series divided by the leading one (a monomial), so the series starts at 1. */
export function divideByLeading(W: Series, N: number): Series {
	const inv = invertMonomial(W[0]);
	return W.map((p) => {
		const o = zero(N);
		addProduct(o, p, inv);
		return normalize(o);
	});
}

export function mulSeries(A: Series, B: Series, M: number): Series {
	const out = zeros(M, A[0].n);
	for (let i = 0; i <= M; i++) for (let j = 0; i + j <= M; j++) addProduct(out[i + j], A[i], B[j]);
	return out.map(normalize);
}

/** P^α, P₀ = 1, integer α (Miller's recurrence, as in coeffs.ts). */
export function powSeries(P: Series, alpha: number, M: number, N: number): Series {
	const Q = zeros(M, N);
	Q[0] = monomial(N, rat(1));
	for (let n = 1; n <= M; n++) {
		for (let k = 1; k <= n; k++) addProduct(Q[n], P[k], Q[n - k], rat((alpha + 1) * k - n, n));
		normalize(Q[n]);
	}
	return Q;
}

export function derivative(A: Series): Series {
	const out = A.slice(1).map((p, k) => scale(p, rat(k + 1)));
	out.push(zero(A[0].n));
	return out;
}

/**
 * Which part of the double expansion to carry: the static brane (no h expansion: κ = 0), the wave (no f
 * expansion, κ = 1: its a_k is the κ^k coefficient of the boosted one) or the whole boosted brane with κ
 * as an atom. The first two are an order of magnitude cheaper than the third.
 */
export type ExactKind = 'brane' | 'wave' | 'boosted';

/** a_1..a_n exactly (d ≥ 3). */
export function exactSeries(d: number, n: number, kind: ExactKind): ExactSeries {
	const withKappa = kind !== 'brane';
	const withF = kind !== 'wave';
	const kapE = kind === 'boosted' ? 1 : 0;
	const m = 2 * (d - 1);
	const N = nAtoms(d);
	const M = n + 1;
	const W = zeros(M, N);
	const S = zeros(M, N);
	const mhalf = binomRat.bind(null, -1, 2);
	for (let j = 0; j <= M; j++) {
		if (!withF && j > 0) break;
		for (let nn = 0; j + nn <= M; nn++) {
			if (!withKappa && nn > 0) break;
			const c = ratMul(ratMul(mhalf(j), rat(j % 2 ? -1 : 1)), mhalf(nn));
			const kap = monomial(N, rat(1), { 0: nn * kapE });
			for (let i = 0; i <= nn; i++) {
				const ci = ratMul(c, ratMul(binomRat(nn, 1, i), rat(i % 2 ? -1 : 1)));
				if (ci.num === 0n) continue;
				const e = d - 1 + nn * d + i * (d - 2) + j * d;
				addProduct(W[j + nn], betaShifted(d, e + 1, nn), kap, ci);
				const ea = 1 - d + nn * d + i * (d - 2) + j * d;
				addProduct(S[j + nn], betaShifted(d, ea + 1, nn), kap, ci);
				if (j + nn + 1 <= M && withKappa) {
					addProduct(S[j + nn + 1], betaShifted(d, ea + d + 1, nn), monomial(N, rat(1), { 0: (nn + 1) * kapE }), ci);
				}
			}
		}
	}
	W.forEach(normalize);
	S.forEach(normalize);
	const sq = zeros(M, N);
	for (let r = 0; r <= M && (withKappa || r === 0); r++) sq[r] = monomial(N, ratMul(rat(2), binomRat(1, 2, r)), { 0: r * kapE });
	const Wt = mulSeries(W, sq, M);
	const W0 = Wt[0];
	const P = divideByLeading(Wt, N);
	const G = mulSeries(powSeries(P, d - 2, M, N), S, M);
	const dG = derivative(G);
	// W₀ = c₀·∏ atom^{e₀}: its power is applied to the decoded terms (the exponents grow like d·k)
	const [w0] = terms(W0);
	const a: Term[][] = [];
	for (let k = 1; k <= n; k++) {
		const Pk = powSeries(P, -d * k, k - 1, N);
		const c = zero(N);
		for (let i = 0; i < k; i++) addProduct(c, dG[i], Pk[k - 1 - i]);
		normalize(c);
		const p = d - 2 - d * k;
		const cw = p >= 0 ? fraction(w0.c.num ** BigInt(p), w0.c.den ** BigInt(p)) : fraction(w0.c.den ** BigInt(-p), w0.c.num ** BigInt(-p));
		a.push(
			terms(
				c,
				ratMul(cw, rat(2, k)),
				w0.e.map((x) => x * p)
			)
		);
	}
	return { d, m, a };
}
