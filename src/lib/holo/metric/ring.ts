/**
 * The two coefficient rings the metric series runs over (series.ts): plain doubles (numeric parameters) and
 * polynomials in the symbolic parameters with double coefficients (each monomial's coefficient is a sum of
 * Beta values, so it is a number; the polynomial structure in m, q, … is exact).
 */
import { addKeys } from './rational';

export interface Ring<T> {
	zero: T;
	one: T;
	add(a: T, b: T): T;
	mul(a: T, b: T): T;
	scale(a: T, c: number): T;
	isZero(a: T): boolean;
	/**
	 * Exact constants (exact-series.ts): the series' rational factors, Beta values and powers of W₀ applied as
	 * ring operations instead of doubles. Absent for the numeric rings, which use `scale`.
	 */
	exact?: {
		/** a · num/den */
		scaleQ(a: T, num: number, den: number): T;
		/** a · C(−½, n) B(r/m, ½ − n)/m */
		scaleBeta(a: T, r: number, n: number): T;
		/** a · W₀^{−1} */
		divW0(a: T): T;
		/** a · 2/K: the last factor of c_K but W₀^{d−2−K}, which the caller applies on the finished terms */
		finish(a: T, K: number): T;
	};
}

export const NUMBERS: Ring<number> = {
	zero: 0,
	one: 1,
	add: (a, b) => a + b,
	mul: (a, b) => a * b,
	scale: (a, c) => a * c,
	isZero: (a) => a === 0
};

/** monomial key (exponents joined by ',') → coefficient */
export type DPoly = Map<string, number>;

export function polyRing(vars: readonly string[]): Ring<DPoly> {
	const zeroKey = vars.map(() => 0).join(',');
	const addInto = (out: DPoly, k: string, v: number) => {
		const s = (out.get(k) ?? 0) + v;
		if (s === 0) out.delete(k);
		else out.set(k, s);
	};
	return {
		zero: new Map(),
		one: new Map([[zeroKey, 1]]),
		add(a, b) {
			if (a.size === 0) return b;
			if (b.size === 0) return a;
			const out = new Map(a);
			for (const [k, v] of b) addInto(out, k, v);
			return out;
		},
		mul(a, b) {
			const out: DPoly = new Map();
			if (a.size === 0 || b.size === 0) return out;
			for (const [ka, va] of a) {
				for (const [kb, vb] of b) {
					const k = addKeys(ka, kb);
					addInto(out, k, va * vb);
				}
			}
			return out;
		},
		scale(a, c) {
			const out: DPoly = new Map();
			if (c !== 0) for (const [k, v] of a) out.set(k, v * c);
			return out;
		},
		isZero: (a) => a.size === 0
	};
}

export function evaluateDPoly(p: DPoly, vars: readonly string[], values: Readonly<Record<string, number>>): number {
	let s = 0;
	for (const [k, v] of p) {
		let t = v;
		k.split(',').forEach((e, i) => {
			if (e !== '0') t *= Math.pow(values[vars[i]!]!, Number(e));
		});
		s += t;
	}
	return s;
}

/**
 * First-order dual numbers in k directions, [value, ∂₁, …, ∂_k]: running the series (series.ts) over them
 * differentiates every coefficient exactly in the parameters (forward-mode; no differencing step). A number is
 * zero only when its value and every derivative are, so the series code's structural-zero skips stay exact.
 */
export type Dual = Float64Array;

export function dualRing(k: number): Ring<Dual> {
	const zero = new Float64Array(k + 1);
	const one = new Float64Array(k + 1);
	one[0] = 1;
	return {
		zero,
		one,
		add: (a, b) => a.map((x, i) => x + b[i]!),
		mul(a, b) {
			const out = new Float64Array(k + 1);
			out[0] = a[0]! * b[0]!;
			for (let i = 1; i <= k; i++) out[i] = a[0]! * b[i]! + a[i]! * b[0]!;
			return out;
		},
		scale: (a, c) => a.map((x) => x * c),
		isZero: (a) => a.every((x) => x === 0)
	};
}
