/**
 * Exact Laurent polynomials over ℚ in at most 10 atoms (κ, π and Beta values), for the series reversion.
 *
 * Representation: integer (BigInt) numerators over one common denominator per polynomial, so a product
 * costs BigInt multiplications only and fractions are reduced once per finished polynomial, not per term;
 * a monomial is one Number key Σ (e_i + OFF)·BASE^i, so the key of a product is ka + kb − K0 (no exponent
 * vectors are built in the inner loop). Exponents must stay in [−OFF, BASE − OFF) during the algebra (the
 * reversion to order 14 uses |e| ≤ 15; larger monomial factors are applied at the end, on `Term`s).
 *
 * Why not nerdamer (1.1.13, which STACK.md recommends for this kind of algebra): measured here, one
 * `expand` of a product of two 30-term polynomials in four symbols takes ~18 s (10 terms: 0.75 s; 60 terms:
 * 140 s); the reversion to order 12 needs thousands of such products. This file does the same ring
 * arithmetic (sums, products, rational scaling, inverse of a monomial — no simplification rules) exactly.
 */
import { fraction, fractionValue, gcd, type Fraction } from './btz';

export type { Fraction };

const BASE = 36;
const OFF = 18;
const MAX_ATOMS = 10; // 36^10 ≈ 3.7e15: keys and their pairwise sums stay exact doubles

export interface LPoly {
	/** number of atoms */
	n: number;
	den: bigint;
	t: Map<number, bigint>;
}

/** A decoded monomial: exponent vector and reduced coefficient. */
export interface Term {
	e: number[];
	c: Fraction;
}

const K0cache = new Map<number, number>();
function k0(n: number): number {
	let k = K0cache.get(n);
	if (k === undefined) {
		k = 0;
		for (let i = n - 1; i >= 0; i--) k = k * BASE + OFF;
		K0cache.set(n, k);
	}
	return k;
}

function encode(e: number[]): number {
	let k = 0;
	for (let i = e.length - 1; i >= 0; i--) {
		if (!(e[i] >= -OFF && e[i] < BASE - OFF)) throw new Error(`exponent ${e[i]} out of range`);
		k = k * BASE + e[i] + OFF;
	}
	return k;
}

function decode(k: number, n: number): number[] {
	const e: number[] = [];
	for (let i = 0; i < n; i++) {
		const r = k % BASE;
		e.push(r - OFF);
		k = (k - r) / BASE;
	}
	return e;
}

export function rat(num: number | bigint, den: number | bigint = 1): Fraction {
	return fraction(BigInt(num), BigInt(den));
}

export function ratMul(a: Fraction, b: Fraction): Fraction {
	return fraction(a.num * b.num, a.den * b.den);
}

export function zero(n: number): LPoly {
	if (n > MAX_ATOMS) throw new Error('too many atoms');
	return { n, den: 1n, t: new Map() };
}

export function monomial(n: number, c: Fraction, exps: Record<number, number> = {}): LPoly {
	const p = zero(n);
	const e = new Array<number>(n).fill(0);
	for (const [i, x] of Object.entries(exps)) e[Number(i)] = x;
	if (c.num !== 0n) p.t.set(encode(e), c.num);
	p.den = c.den;
	return p;
}

/** Brings out to denominator L (a multiple of out.den). */
function rescale(out: LPoly, L: bigint): void {
	if (L === out.den) return;
	const f = L / out.den;
	for (const [k, v] of out.t) out.t.set(k, v * f);
	out.den = L;
}

/** Common denominator for adding something over `cd` into out; returns the factor for the addend. */
function merge(out: LPoly, cd: bigint): bigint {
	if (out.t.size === 0) {
		out.den = cd;
		return 1n;
	}
	const g = gcd(out.den, cd);
	const L = (out.den / g) * cd;
	rescale(out, L);
	return L / cd;
}

/** out += c · a · b (in place). */
export function addProduct(out: LPoly, a: LPoly, b: LPoly, c: Fraction = { num: 1n, den: 1n }): void {
	if (c.num === 0n || a.t.size === 0 || b.t.size === 0) return;
	const f = merge(out, a.den * b.den * c.den) * c.num;
	const K = k0(out.n);
	const T = out.t;
	for (const [ka, va] of a.t) {
		const vaf = va * f;
		for (const [kb, vb] of b.t) {
			const k = ka + kb - K;
			const v = (T.get(k) ?? 0n) + vaf * vb;
			if (v === 0n) T.delete(k);
			else T.set(k, v);
		}
	}
}

/** out += c · a (in place). */
export function addTo(out: LPoly, a: LPoly, c: Fraction = { num: 1n, den: 1n }): void {
	if (c.num === 0n || a.t.size === 0) return;
	const f = merge(out, a.den * c.den) * c.num;
	for (const [k, va] of a.t) {
		const v = (out.t.get(k) ?? 0n) + va * f;
		if (v === 0n) out.t.delete(k);
		else out.t.set(k, v);
	}
}

export function scale(a: LPoly, c: Fraction): LPoly {
	const out = zero(a.n);
	addTo(out, a, c);
	return normalize(out);
}

/** Divides numerators and denominator by their gcd (in place). */
export function normalize(p: LPoly): LPoly {
	if (p.t.size === 0) {
		p.den = 1n;
		return p;
	}
	let g = p.den;
	for (const v of p.t.values()) {
		if (g === 1n) break;
		g = gcd(g, v);
	}
	if (g !== 1n) {
		for (const [k, v] of p.t) p.t.set(k, v / g);
		p.den /= g;
	}
	return p;
}

/** The inverse of a one-term polynomial (the only division the reversion needs). */
export function invertMonomial(a: LPoly): LPoly {
	if (a.t.size !== 1) throw new Error('invertMonomial: not a monomial');
	const [k, v] = a.t.entries().next().value!;
	const e = decode(k, a.n).map((x) => -x);
	return monomial(a.n, fraction(a.den, v), Object.fromEntries(e.map((x, i) => [i, x])));
}

/** Decoded terms, each multiplied by the monomial c·∏ atom_i^{shift_i} (exponents may be large here). */
export function terms(p: LPoly, c: Fraction = { num: 1n, den: 1n }, shift?: number[]): Term[] {
	const out: Term[] = [];
	for (const [k, v] of p.t) {
		const e = decode(k, p.n);
		if (shift) for (let i = 0; i < e.length; i++) e[i] += shift[i];
		out.push({ e, c: fraction(v * c.num, p.den * c.den) });
	}
	return out;
}

/** Numeric value of Σ terms at the given atom values (Neumaier summation, smallest terms first). */
export function evaluateTerms(ts: Term[], atoms: number[]): number {
	const vals = ts.map((t) => {
		let lv = 0;
		let sign = 1;
		for (let i = 0; i < t.e.length; i++) {
			if (!t.e[i]) continue;
			if (atoms[i] === 0) return 0;
			lv += t.e[i] * Math.log(Math.abs(atoms[i]));
			if (atoms[i] < 0 && t.e[i] % 2) sign = -sign;
		}
		// the monomial by exp(Σ e ln x) would lose ~|Σ e ln x|·1e−16; multiply directly while it cannot overflow
		let v = fractionValue(t.c);
		if (Math.abs(lv) < 600) {
			for (let i = 0; i < t.e.length; i++) if (t.e[i]) v *= Math.pow(atoms[i], t.e[i]);
			return v;
		}
		return sign * v * Math.exp(lv);
	});
	vals.sort((x, y) => Math.abs(x) - Math.abs(y));
	let s = 0;
	let comp = 0;
	for (const v of vals) {
		const t = s + v;
		comp += Math.abs(s) >= Math.abs(v) ? s - t + v : v - t + s;
		s = t;
	}
	return s + comp;
}
