/**
 * Exact rationals over BigInt and polynomials in named parameters with rational coefficients: the ring the
 * metric's exact Taylor coefficients live in (taylor-exact.ts). Small on purpose: add, multiply, scale,
 * evaluate, print in a form nerdamer reads back.
 */
import { gcd } from '../series/btz';

export interface Q {
	n: bigint;
	d: bigint;
}

export function makeQ(n: bigint, d: bigint = 1n): Q {
	if (d === 0n) throw new Error('zero denominator');
	if (d < 0n) [n, d] = [-n, -d];
	const g = gcd(n, d) || 1n;
	return { n: n / g, d: d / g };
}

export const addQ = (a: Q, b: Q): Q => makeQ(a.n * b.d + b.n * a.d, a.d * b.d);
export const mulQ = (a: Q, b: Q): Q => makeQ(a.n * b.n, a.d * b.d);
export const divQ = (a: Q, b: Q): Q => makeQ(a.n * b.d, a.d * b.n);
export const negQ = (a: Q): Q => ({ n: -a.n, d: a.d });
export const valueQ = (a: Q): number => Number(a.n) / Number(a.d);
export const printQ = (a: Q): string => (a.d === 1n ? `${a.n}` : `${a.n}/${a.d}`);

/** The exact rational a decimal literal stands for: '0.1' → 1/10, '2.5e-3' → 1/400 (the text a user typed). */
export function parseDecimal(text: string): Q {
	const m = /^([+-]?)(\d*)(?:\.(\d*))?(?:e([+-]?\d+))?$/i.exec(text.trim());
	if (!m) throw new Error(`not a decimal: ${text}`);
	const [, sign, int, frac = '', exp = '0'] = m;
	let n = BigInt((int || '0') + frac);
	let d = 10n ** BigInt(frac.length);
	const e = Number(exp);
	if (e >= 0) n *= 10n ** BigInt(e);
	else d *= 10n ** BigInt(-e);
	return makeQ(sign === '-' ? -n : n, d);
}

/** The rational nerdamer prints: '-5', '1/7', '(2/3)'. */
export function parseFraction(text: string): Q {
	const t = text.replace(/[()\s]/g, '');
	const [a, b] = t.split('/');
	return makeQ(BigInt(a!), b === undefined ? 1n : BigInt(b));
}

/** A polynomial in the parameters `vars`: monomial (exponents joined by ',') → coefficient. */
export interface QPoly {
	vars: readonly string[];
	terms: Map<string, Q>;
}

export function constQPoly(vars: readonly string[], c: Q): QPoly {
	const terms = new Map<string, Q>();
	if (c.n !== 0n) terms.set(vars.map(() => 0).join(','), c);
	return { vars, terms };
}

export function addQPoly(a: QPoly, b: QPoly, sb: Q = { n: 1n, d: 1n }): QPoly {
	const terms = new Map(a.terms);
	for (const [k, v] of b.terms) {
		const s = addQ(terms.get(k) ?? { n: 0n, d: 1n }, mulQ(v, sb));
		if (s.n === 0n) terms.delete(k);
		else terms.set(k, s);
	}
	return { vars: a.vars, terms };
}

export function mulQPoly(a: QPoly, b: QPoly): QPoly {
	const terms = new Map<string, Q>();
	for (const [ka, va] of a.terms) {
		for (const [kb, vb] of b.terms) {
			const k = addKeys(ka, kb);
			const s = addQ(terms.get(k) ?? { n: 0n, d: 1n }, mulQ(va, vb));
			if (s.n === 0n) terms.delete(k);
			else terms.set(k, s);
		}
	}
	return { vars: a.vars, terms };
}

export function scaleQPoly(a: QPoly, c: Q): QPoly {
	const terms = new Map<string, Q>();
	if (c.n !== 0n) for (const [k, v] of a.terms) terms.set(k, mulQ(v, c));
	return { vars: a.vars, terms };
}

export const isZeroQPoly = (a: QPoly): boolean => a.terms.size === 0;

/** The constant coefficient when the polynomial has no parameter in it, else undefined. */
export function constantOf(a: QPoly): Q | undefined {
	if (a.terms.size === 0) return { n: 0n, d: 1n };
	const zero = a.vars.map(() => 0).join(',');
	return a.terms.size === 1 && a.terms.has(zero) ? a.terms.get(zero) : undefined;
}

export function evaluateQPoly(a: QPoly, values: Readonly<Record<string, number>>): number {
	let s = 0;
	for (const [k, v] of a.terms) {
		let t = valueQ(v);
		if (k !== '')
			k.split(',').forEach((e, i) => {
				if (e !== '0') t *= Math.pow(values[a.vars[i]!]!, Number(e));
			});
		s += t;
	}
	return s;
}

/** Text nerdamer (and a reader) can take: '(1/3)*m^2*q-2'. */
export function printQPoly(a: QPoly, names: readonly string[] = a.vars): string {
	if (a.terms.size === 0) return '0';
	const parts = [...a.terms].map(([k, v]) => {
		const mono = (k === '' ? [] : k.split(','))
			.map((e, i) => (e === '0' ? '' : e === '1' ? names[i]! : `${names[i]}^${e}`))
			.filter(Boolean);
		return [`(${printQ(v)})`, ...mono].join('*');
	});
	return parts.join('+');
}

/** The monomial key of a product: exponents added ('' when there are no parameters). */
export function addKeys(ka: string, kb: string): string {
	if (ka === '') return kb;
	const eb = kb.split(',');
	return ka
		.split(',')
		.map((x, i) => Number(x) + Number(eb[i]))
		.join(',');
}
