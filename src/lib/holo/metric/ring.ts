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
