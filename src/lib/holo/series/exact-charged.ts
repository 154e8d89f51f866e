import { fraction } from './btz';
import { betaShifted, binomRat, derivative, divideByLeading, mulSeries, nAtoms, powSeries } from './exact';
import { formatTerms } from './exact-latex';
import { addProduct, addTo, monomial, normalize, rat, ratMul, terms, zero, type LPoly, type Term } from './laurent';
import { chargedPowers } from './charged';

/**
 * Exact c_K(q²) of the charged brane (d ≥ 3): the computation of charged.ts (expansion in ζ = z* / zh, Lagrange
 * inversion in ζ) carried out in ℚ[q², π, B₁^{±1}, …, B_{d−2}^{±1}] — exact.ts's atoms with q² in the slot
 * that holds κ for the boosted brane. Every Beta value is B((d+K)/m, ½) or B((2−d+K)/m, ½), reduced to the
 * atoms by exact.ts's `betaShifted`. Checked against the double-precision c_K in series-charged.test.ts.
 *
 * Cost: the ζ-series is d times longer than the brane's t-series (mostly empty entries), and each c_K is a
 * polynomial in q²; cold, order 10 takes < 0.1 s for d ≤ 10 (order 14 ≲ 0.5 s), but the strings grow past
 * 10⁵ characters by order 10 at d ≥ 5, so the LaTeX is exact to EXACT_CHARGED_ORDER and decimal beyond
 * (series/latex.ts).
 */
export const EXACT_CHARGED_ORDER = 6;

function exactCharged(d: number, n: number): Map<number, Term[]> {
	const m = 2 * (d - 1);
	const N = nAtoms(d);
	const M = n * d;
	const W: LPoly[] = Array.from({ length: M + 1 }, () => zero(N));
	const S: LPoly[] = Array.from({ length: M + 1 }, () => zero(N));
	const mhalf = binomRat.bind(null, -1, 2);
	for (let a = 0; a * d <= M; a++) {
		for (let b = 0; a * d + b * m <= M; b++) {
			const j = a + b;
			const K = a * d + b * m;
			const c = ratMul(ratMul(mhalf(j), rat(j % 2 ? -1 : 1)), ratMul(binomRat(j, 1, b), rat(b % 2 ? -1 : 1)));
			// (1+q²)^a (q²)^b
			const poly = zero(N);
			for (let r = 0; r <= a; r++) addTo(poly, monomial(N, binomRat(a, 1, r), { 0: r + b }));
			addProduct(W[K], betaShifted(d, d + K, 0), poly, ratMul(c, rat(2)));
			addProduct(S[K], betaShifted(d, 2 - d + K, 0), poly, c);
		}
	}
	W.forEach(normalize);
	S.forEach(normalize);
	const W0 = W[0];
	const P = divideByLeading(W, N);
	const dG = derivative(mulSeries(powSeries(P, d - 2, M, N), S, M));
	const [w0] = terms(W0);
	const out = new Map<number, Term[]>();
	for (const K of chargedPowers(d, M)) {
		const PK = powSeries(P, -K, K - 1, N);
		const c = zero(N);
		for (let i = 0; i < K; i++) addProduct(c, dG[i], PK[K - 1 - i]);
		normalize(c);
		const p = d - 2 - K;
		const cw = p >= 0 ? fraction(w0.c.num ** BigInt(p), w0.c.den ** BigInt(p)) : fraction(w0.c.den ** BigInt(-p), w0.c.num ** BigInt(-p));
		out.set(
			K,
			terms(
				c,
				ratMul(cw, rat(2, K)),
				w0.e.map((x) => x * p)
			)
		);
	}
	return out;
}

const cache = new Map<number, { n: number; a: Map<number, Term[]>; latex: Map<number, string> }>();

/** Exact terms of c_K (K ≤ n d), cached per d. */
export function exactChargedTerms(d: number, n: number): Map<number, Term[]> {
	if (n > EXACT_CHARGED_ORDER) throw new Error(`exact charged coefficients only to order ${EXACT_CHARGED_ORDER}`);
	let e = cache.get(d);
	if (!e || e.n < n) {
		e = { n, a: exactCharged(d, n), latex: new Map() };
		cache.set(d, e);
	}
	return e.a;
}

/** LaTeX of the exact c_K as a polynomial in q² (grouped by powers of q). */
export function exactChargedLatex(d: number, K: number): string {
	const e = cache.get(d);
	const a = e && e.a.has(K) ? e.a : exactChargedTerms(d, Math.ceil(K / d));
	const ent = cache.get(d)!;
	let s = ent.latex.get(K);
	if (s === undefined) {
		const ts = a.get(K)!;
		const q = (r: number) => `q^{${2 * r}}`;
		// one monomial (e.g. the pure q² terms): the number, then the power of q, without a bracket
		if (ts.length === 1 && ts[0].e[0] > 0) {
			const head = formatTerms([{ c: ts[0].c, e: [0, ...ts[0].e.slice(1)] }], d, true);
			s = `${head === '1' ? '' : head === '-1' ? '-' : head}\\,${q(ts[0].e[0])}`;
		} else s = formatTerms(ts, d, true, q);
		ent.latex.set(K, s);
	}
	return s;
}
