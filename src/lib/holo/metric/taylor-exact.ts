import nerdamer from 'nerdamer';
import 'nerdamer/Algebra.js';
import { HoloError } from '../errors';
import type { FormulaTree } from '../formula';
import {
	addQPoly,
	constantOf,
	constQPoly,
	divQ,
	isZeroQPoly,
	makeQ,
	mulQPoly,
	parseDecimal,
	parseFraction,
	printQ,
	printQPoly,
	scaleQPoly,
	type QPoly
} from './rational';

/**
 * Exact Taylor coefficients at z = 0 of a formula that is a rational function of z with rational or symbolic
 * coefficients (numbers, parameters, + − × ÷ and integer powers; no function calls, no pi or e).
 *
 * nerdamer does only what STACK.md trusts it with: `expand` of the numerator and denominator (written out
 * from the tree, each literal as the exact rational the user typed, not nerdamer's float-to-fraction guess)
 * and `coeffs` in z and then in each parameter. The series division N/D is ours, in Q[parameters]; it needs
 * D(0) to be a nonzero number. Returns undefined when the formula is not of this kind (the caller then uses
 * taylorNumeric), and the caller cross-checks these coefficients against taylorNumeric at numbers.
 */
/**
 * Parameters reach nerdamer under internal names (bkp0, bkp1, …): a user's `i` or `E` would otherwise be
 * nerdamer's imaginary unit or constant.
 */
const internal = (i: number) => `bkp${i}`;
const internalNames = (vars: readonly string[]) => vars.map((_, i) => internal(i));
const restore = (text: string, vars: readonly string[]) => text.replace(/bkp(\d+)/g, (_, i) => vars[Number(i)]!);
/** A parameter's name in LaTeX: upright when longer than a letter (zh, not z·h). */
export const texName = (name: string) => (name.length > 1 ? `\\mathrm{${name.replace(/_/g, '\\_')}}` : name);

interface Frac {
	n: string;
	d: string;
}

function rationalText(t: FormulaTree, params: readonly string[], values: Readonly<Record<string, number>>): Frac | undefined {
	switch (t.kind) {
		case 'num':
			return { n: `(${printQ(parseDecimal(String(t.value)))})`, d: '1' };
		case 'name':
			if (t.name === 'z') return { n: 'z', d: '1' };
			if (params.includes(t.name)) return { n: internal(params.indexOf(t.name)), d: '1' };
			// a parameter given as a number counts as the decimal the user typed (1.3 → 13/10)
			return Object.hasOwn(values, t.name) ? { n: `(${printQ(parseDecimal(String(values[t.name])))})`, d: '1' } : undefined;
		case 'call':
			return undefined;
		case 'op': {
			if (t.op === 'pow') {
				const e = t.args[1]!;
				const p =
					e.kind === 'num' ? e.value : e.kind === 'op' && e.op === 'unaryMinus' && e.args[0]!.kind === 'num' ? -e.args[0]!.value : NaN;
				if (!Number.isInteger(p) || Math.abs(p) > 64) return undefined;
				const a = rationalText(t.args[0]!, params, values);
				if (!a) return undefined;
				return p >= 0 ? { n: `(${a.n})^${p}`, d: `(${a.d})^${p}` } : { n: `(${a.d})^${-p}`, d: `(${a.n})^${-p}` };
			}
			const xs = t.args.map((x) => rationalText(x, params, values));
			if (xs.some((x) => !x)) return undefined;
			const [a, b] = xs as Frac[];
			switch (t.op) {
				case 'unaryPlus':
					return a;
				case 'unaryMinus':
					return { n: `-(${a!.n})`, d: a!.d };
				case 'add':
				case 'subtract': {
					const s = t.op === 'add' ? '+' : '-';
					return { n: `(${a!.n})*(${b!.d})${s}(${b!.n})*(${a!.d})`, d: `(${a!.d})*(${b!.d})` };
				}
				case 'multiply':
					return { n: `(${a!.n})*(${b!.n})`, d: `(${a!.d})*(${b!.d})` };
				case 'divide':
					return { n: `(${a!.n})*(${b!.d})`, d: `(${a!.d})*(${b!.n})` };
			}
			return undefined;
		}
	}
}

type NSym = ReturnType<typeof nerdamer>;

/** Coefficients of x^0, x^1, … of an expanded polynomial (nerdamer's `coeffs`). */
function coeffList(e: NSym, x: string): NSym[] {
	const v = (nerdamer as unknown as { coeffs(e: NSym, x: string): { symbol: { elements: unknown[] } } }).coeffs(e, x);
	return v.symbol.elements.map((s) => nerdamer(s as string));
}

/** An expanded polynomial in `vars` as a QPoly, by `coeffs` in each variable in turn. */
function toQPoly(e: NSym, vars: readonly string[]): QPoly {
	const out: QPoly = constQPoly(vars, makeQ(0n));
	const walk = (s: NSym, i: number, exps: number[]) => {
		if (i === vars.length) {
			const q = parseFraction(s.toString());
			if (q.n !== 0n) out.terms.set(exps.join(','), q);
			return;
		}
		const vs = s.variables();
		if (!vs.includes(vars[i]!)) return walk(s, i + 1, [...exps, 0]);
		coeffList(s, vars[i]!).forEach((c, k) => {
			if (c.toString() !== '0') walk(c, i + 1, [...exps, k]);
		});
	};
	walk(e, 0, []);
	return out;
}

export interface ExactTaylor {
	/** coefficients of z^0..z^N, each a polynomial in `vars` */
	coeffs: QPoly[];
	/** the degree in z when the formula is a polynomial in z (denominator free of z) */
	degree?: number;
	vars: readonly string[];
}

/** Exact coefficients of z^0..z^N, or undefined when the formula is not rational in z (see above). */
export function taylorExact(
	t: FormulaTree,
	params: readonly string[],
	values: Readonly<Record<string, number>>,
	N: number,
	key: string
): ExactTaylor | undefined {
	const r = rationalText(t, params, values);
	if (!r) return undefined;
	const vars = [...params];
	const expand = (text: string) => nerdamer(`expand(${text})`);
	const num = expand(r.n);
	const den = expand(r.d);
	const inZ = (e: NSym) =>
		(e.variables().includes('z') ? coeffList(e, 'z') : [e]).map((c): QPoly => ({ ...toQPoly(c, internalNames(vars)), vars }));
	const n = inZ(num);
	const dd = inZ(den);
	// strip common leading powers of z (e.g. (z^4 - z^6)/z^2)
	while (n.length && dd.length && isZeroQPoly(n[0]!) && isZeroQPoly(dd[0]!)) {
		n.shift();
		dd.shift();
	}
	const d0 = dd[0] ? constantOf(dd[0]) : undefined;
	if (!d0 || d0.n === 0n) {
		if (dd[0] && d0 === undefined) return undefined; // D(0) depends on a parameter: leave it to the numbers
		throw new HoloError(`${key} is not analytic at z = 0: its denominator ${restore(den.toString(), vars)} vanishes there`, key);
	}
	const inv = divQ(makeQ(1n), d0);
	const c: QPoly[] = [];
	for (let k = 0; k <= N; k++) {
		let s: QPoly = n[k] ?? constQPoly(vars, makeQ(0n));
		for (let j = 1; j <= k && j < dd.length; j++) s = addQPoly(s, mulQPoly(dd[j]!, c[k - j]!), makeQ(-1n));
		c.push(scaleQPoly(s, inv));
	}
	return { coeffs: c, vars, degree: dd.length === 1 ? n.length - 1 : undefined };
}

/** LaTeX of an exact polynomial in the parameters, from nerdamer. */
export function latexOf(p: QPoly): string {
	return isZeroQPoly(p) ? '0' : restore(nerdamer(printQPoly(p, internalNames(p.vars))).toTeX(), p.vars.map(texName));
}

/** Plain text of an exact polynomial for messages ('1-2*cm'), tidied by nerdamer. */
export function textOf(p: QPoly): string {
	return isZeroQPoly(p) ? '0' : restore(nerdamer(printQPoly(p, internalNames(p.vars))).toString(), p.vars);
}
