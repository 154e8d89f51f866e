import { exactSeries, type ExactKind } from './exact';
import { evaluateTerms, type Fraction, type Term } from './laurent';
import { beta } from '../special/beta';
import { gcd } from './btz';
import { boostedLatex } from './boosted-latex';

/**
 * Exact a_k as KaTeX: a rational content and a common monomial in front, then the primitive part with
 * integer coefficients, e.g. for d = 4
 *   \frac{\mathrm{B}(\tfrac{1}{6},\tfrac{1}{2})^{6}}{6912\pi^{7}}\left(9\pi - \mathrm{B}(\tfrac{1}{6},\tfrac{1}{2})\mathrm{B}(\tfrac{1}{3},\tfrac{1}{2})^{2}\right)
 * (the wave's a₂ at d = 4); boosted ones grouped by powers of κ = γ²v². Atoms: π and B(s/m, ½),
 * 1 ≤ s ≤ d − 2, m = 2(d − 1) (exact.ts says why these suffice and why the form is canonical).
 * Thin spaces and \left/\right around the Beta arguments are left out on purpose: KaTeX counts every macro
 * expansion (limit 1000) and a boosted a₈ has a few hundred atoms.
 *
 * Cost of the exact algebra, cold in a fresh process on the 2-core build machine (under a load of ~6):
 * brane and wave to order 14 ≲ 0.1 s for any d; the boosted brane carries κ as well and grows like n⁴ —
 * order 8 ≈ 0.2–0.5 s, order 12 ≈ 0.3–0.7 s (d = 3…10), order 14 above 1 s — so the boosted LaTeX is exact
 * up to order 12 and printed as decimals (with a note) for 13 and 14; its strings to order 12 are precomputed
 * in boosted-latex.json (scripts/gen-series-latex.ts; packed and unpacked per d on first use, boosted-latex.ts), so a
 * cold request costs a table lookup.
 */
export const EXACT_ORDER: Record<ExactKind, number> = { brane: 14, wave: 14, boosted: 12 };

interface Entry {
	n: number;
	a: Term[][];
	latex: string[];
}

const cache = new Map<string, Entry>();

/** Exact terms of a_1..a_n (cached per (d, kind); a larger n recomputes once). */
export function exactTerms(d: number, kind: ExactKind, n: number): Term[][] {
	if (n > EXACT_ORDER[kind]) throw new Error(`exact ${kind} coefficients only to order ${EXACT_ORDER[kind]}`);
	const key = `${d}:${kind}`;
	let e = cache.get(key);
	if (!e || e.n < n) {
		const N = Math.max(n, e?.n ?? 0);
		e = { n: N, a: exactSeries(d, N, kind).a, latex: [] };
		cache.set(key, e);
	}
	return e.a.slice(0, n);
}

/**
 * LaTeX of the exact a_k: the boosted brane's from the table scripts/gen-series-latex.ts wrote (d = 3…10, k ≤ 12;
 * cold it would cost 0.1–0.5 s of BigInt algebra per d), everything else computed once and cached per (d, kind, k).
 */
export function exactLatex(d: number, kind: ExactKind, k: number): string {
	return (kind === 'boosted' ? boostedLatex(d, k) : undefined) ?? computeExactLatex(d, kind, k);
}

/** LaTeX of the exact a_k from the algebra (cached per (d, kind, k)); the table's source. */
export function computeExactLatex(d: number, kind: ExactKind, k: number): string {
	exactTerms(d, kind, k);
	const e = cache.get(`${d}:${kind}`)!;
	return (e.latex[k - 1] ??= formatTerms(e.a[k - 1], d, kind === 'boosted'));
}

/** Atom values for numeric evaluation: [κ, π, B(1/m, ½), …, B((d−2)/m, ½)] from special/beta. */
export function atomValues(d: number, kappa: number): number[] {
	const m = 2 * (d - 1);
	const out = [kappa, Math.PI];
	for (let s = 1; s <= d - 2; s++) out.push(beta(s / m, 0.5));
	return out;
}

/** The exact a_k evaluated in doubles (κ ignored unless kind is boosted). */
export function exactValue(d: number, kind: ExactKind, k: number, kappa = 0): number {
	return evaluateTerms(exactTerms(d, kind, k)[k - 1], atomValues(d, kappa));
}

/** Clears the cache (benchmarks time the cold computation). */
export function clearExactCache(): void {
	cache.clear();
}

// ---------- formatting ----------

function atomLatex(d: number, i: number): string {
	if (i === 1) return '\\pi';
	const m = 2 * (d - 1);
	const s = i - 1;
	const g = Number(gcd(BigInt(s), BigInt(m)));
	return `\\mathrm{B}(\\tfrac{${s / g}}{${m / g}},\\tfrac{1}{2})`;
}

function power(base: string, e: number): string {
	return e === 1 ? base : `${base}^{${e}}`;
}

/** ∏ atoms^{e} over the non-κ atoms with positive exponents (sign picks which side). */
function monoLatex(d: number, e: number[], sign: 1 | -1): string {
	const parts: string[] = [];
	for (let i = 1; i < e.length; i++) if (e[i] * sign > 0) parts.push(power(atomLatex(d, i), e[i] * sign));
	return parts.join('');
}

function fracLatex(num: string, den: string): string {
	return den ? `\\frac{${num || '1'}}{${den}}` : num || '1';
}

/** Primitive integer polynomial Σ c_j ∏ atoms^{e_j} (non-negative exponents) as a signed sum. */
function sumLatex(d: number, ts: { c: bigint; e: number[] }[]): string {
	return ts
		.map((t, j) => {
			const neg = t.c < 0n;
			const a = neg ? -t.c : t.c;
			const mono = monoLatex(d, t.e, 1);
			const body = mono ? (a === 1n ? mono : `${a}${mono}`) : `${a}`;
			return j === 0 ? (neg ? `-${body}` : body) : neg ? ` - ${body}` : ` + ${body}`;
		})
		.join('');
}

function cmpExp(a: number[], b: number[]): number {
	for (let i = 1; i < a.length; i++) if (a[i] !== b[i]) return b[i] - a[i];
	return 0;
}

function kappaPower(r: number): string {
	return r === 1 ? '\\kappa' : `\\kappa^{${r}}`;
}

/**
 * Canonical form: content C = ±gcd(numerators)/lcm(denominators) with the sign of the first term,
 * common monomial = componentwise minimum of the exponents, terms sorted by κ power then by exponent
 * vectors (π first, then B(1/m, ½), …) in descending order.
 */
export function formatTerms(ts: Term[], d: number, kappa: boolean, atom0: (r: number) => string = kappaPower): string {
	if (ts.length === 0) return '0';
	const n = ts[0].e.length;
	const lo = new Array<number>(n).fill(Infinity);
	for (const t of ts) for (let i = 1; i < n; i++) lo[i] = Math.min(lo[i], t.e[i]);
	lo[0] = 0;
	let L = 1n;
	for (const t of ts) L = (L / gcd(L, t.c.den)) * t.c.den;
	const ints = ts.map((t) => ({ c: (t.c.num * L) / t.c.den, e: t.e.map((x, i) => x - lo[i]), k: t.e[0] }));
	ints.sort((a, b) => a.k - b.k || cmpExp(a.e, b.e));
	let G = 0n;
	for (const t of ints) G = gcd(G, t.c);
	if (ints[0].c < 0n) G = -G;
	for (const t of ints) t.c /= G;
	const g2 = gcd(G, L);
	const C: Fraction = { num: G / g2, den: L / g2 };
	const neg = C.num < 0n;
	const cn = neg ? -C.num : C.num;
	const num = [cn === 1n ? '' : `${cn}`, monoLatex(d, lo, 1)].filter(Boolean).join('');
	const den = [C.den === 1n ? '' : `${C.den}`, monoLatex(d, lo, -1)].filter(Boolean).join('');
	const front = `${neg ? '-' : ''}${fracLatex(num, den)}`;
	const groups = new Map<number, { c: bigint; e: number[] }[]>();
	for (const t of ints) {
		const g = groups.get(t.k) ?? [];
		g.push(t);
		groups.set(t.k, g);
	}
	const single = ints.length === 1 && ints[0].k === 0;
	if (single) return front === '1' ? '1' : front === '-1' ? '-1' : front;
	const kap = (r: number) => (r === 0 ? '' : atom0(r));
	const body = [...groups.entries()]
		.map(([r, g], j) => {
			const s = sumLatex(d, g);
			const inner = g.length > 1 || r === 0 ? (g.length > 1 && kappa && groups.size > 1 ? `\\left(${s}\\right)` : s) : s;
			const txt = r > 0 && (inner === '1' || inner === '-1') ? `${inner.slice(0, -1)}${kap(r)}` : `${inner}${kap(r)}`;
			return j === 0 || txt.startsWith('-') ? (j === 0 ? txt : ` ${txt.replace(/^-/, '- ')}`) : ` + ${txt}`;
		})
		.join('');
	const lead = front === '1' ? '' : front === '-1' ? '-' : front;
	return `${lead}\\left(${body}\\right)`;
}
