import { HoloError } from '../errors';
import type { FormulaTree } from '../formula';
import { gamma } from '../special/gamma';

/**
 * Taylor coefficients at z = 0 of any formula the sandbox accepts, in doubles, by truncated power-series
 * arithmetic on its tree (Taylor-mode automatic differentiation: the standard recurrences for ·, ÷, powers,
 * exp, log and the trigonometric and hyperbolic functions, e.g. Griewank & Walther, "Evaluating Derivatives",
 * SIAM 2008, ch. 13). Each coefficient is exact up to rounding of the operations (no differencing step), so it
 * can cross-check the exact coefficients of taylor-exact.ts. A function of a z-dependent argument that is not
 * analytic there (log or √ of a series starting at 0, abs at 0, floor, …) throws, naming the term.
 */
export type Series = Float64Array;

/** The tree as text, for messages that name the term at fault. */
export function printTree(t: FormulaTree): string {
	switch (t.kind) {
		case 'num':
			return String(t.value);
		case 'name':
			return t.name;
		case 'call':
			return `${t.name}(${t.args.map(printTree).join(', ')})`;
		default: {
			const [a, b] = t.args.map(printTree);
			const sym = { add: '+', subtract: '-', multiply: '*', divide: '/', pow: '^' } as Record<string, string>;
			if (t.op === 'unaryMinus') return `-(${a})`;
			if (t.op === 'unaryPlus') return a!;
			return `(${a} ${sym[t.op]} ${b})`;
		}
	}
}

const constant = (N: number, c: number): Series => {
	const s = new Float64Array(N + 1);
	s[0] = c;
	return s;
};
const isConstant = (a: Series) => a.every((x, i) => i === 0 || x === 0);

function mul(a: Series, b: Series): Series {
	const N = a.length - 1;
	const c = new Float64Array(N + 1);
	for (let i = 0; i <= N; i++) if (a[i] !== 0) for (let j = 0; i + j <= N; j++) c[i + j] += a[i] * b[j];
	return c;
}

function div(a: Series, b: Series, what: () => string): Series {
	if (b[0] === 0) throw notAnalytic(what(), 'its denominator vanishes at z = 0');
	const N = a.length - 1;
	const c = new Float64Array(N + 1);
	for (let k = 0; k <= N; k++) {
		let s = a[k];
		for (let j = 1; j <= k; j++) s -= b[j] * c[k - j];
		c[k] = s / b[0];
	}
	return c;
}

/** a^p for a real constant p, a₀ > 0 (Miller's recurrence); non-negative integer p by repeated products. */
function powConst(a: Series, p: number, what: () => string): Series {
	const N = a.length - 1;
	if (Number.isInteger(p) && p >= 0 && p <= 64) {
		let r = constant(N, 1);
		for (let i = 0; i < p; i++) r = mul(r, a);
		return r;
	}
	if (Number.isInteger(p) && p < 0 && p >= -64) return div(constant(N, 1), powConst(a, -p, what), what);
	if (!(a[0] > 0))
		throw notAnalytic(what(), a[0] === 0 ? 'a fractional power of a term vanishing at z = 0' : 'a fractional power of a negative number');
	const c = new Float64Array(N + 1);
	c[0] = Math.pow(a[0], p);
	for (let n = 1; n <= N; n++) {
		let s = 0;
		for (let k = 1; k <= n; k++) s += ((p + 1) * k - n) * a[k] * c[n - k];
		c[n] = s / (n * a[0]);
	}
	return c;
}

function expS(a: Series): Series {
	const N = a.length - 1;
	const c = new Float64Array(N + 1);
	c[0] = Math.exp(a[0]);
	for (let n = 1; n <= N; n++) {
		let s = 0;
		for (let k = 1; k <= n; k++) s += k * a[k] * c[n - k];
		c[n] = s / n;
	}
	return c;
}

function logS(a: Series, what: () => string): Series {
	if (!(a[0] > 0))
		throw notAnalytic(what(), a[0] === 0 ? 'the logarithm of a term vanishing at z = 0' : 'the logarithm of a negative number');
	const N = a.length - 1;
	const c = new Float64Array(N + 1);
	c[0] = Math.log(a[0]);
	for (let n = 1; n <= N; n++) {
		let s = n * a[n];
		for (let k = 1; k < n; k++) s -= k * c[k] * a[n - k];
		c[n] = s / (n * a[0]);
	}
	return c;
}

/** (sin, cos) or, with sign = −1 … (sinh, cosh): s' = c a', c' = ∓ s a'. */
function sinCos(a: Series, hyper: boolean): [Series, Series] {
	const N = a.length - 1;
	const s = new Float64Array(N + 1);
	const c = new Float64Array(N + 1);
	s[0] = hyper ? Math.sinh(a[0]) : Math.sin(a[0]);
	c[0] = hyper ? Math.cosh(a[0]) : Math.cos(a[0]);
	for (let n = 1; n <= N; n++) {
		let ss = 0;
		let cc = 0;
		for (let k = 1; k <= n; k++) {
			ss += k * a[k] * c[n - k];
			cc += k * a[k] * s[n - k];
		}
		s[n] = ss / n;
		c[n] = ((hyper ? 1 : -1) * cc) / n;
	}
	return [s, c];
}

const derivative = (a: Series): Series => {
	const c = new Float64Array(a.length);
	for (let k = 1; k < a.length; k++) c[k - 1] = k * a[k];
	return c;
};
/** ∫ q from 0 plus c₀. */
const integral = (q: Series, c0: number): Series => {
	const c = new Float64Array(q.length);
	c[0] = c0;
	for (let k = 1; k < q.length; k++) c[k] = q[k - 1] / k;
	return c;
};

function notAnalytic(term: string, why: string): HoloError {
	return new HoloError(
		`not analytic at z = 0: ${term} (${why})`,
		'f',
		'the series and the stress tensor need f, g, h analytic at the boundary'
	);
}

const CONSTANT_ONLY: Record<string, (...x: number[]) => number> = {
	gamma,
	floor: Math.floor,
	ceil: Math.ceil,
	round: (x) => Math.sign(x) * Math.round(Math.abs(x)),
	log10: Math.log10,
	log2: Math.log2,
	min: Math.min,
	max: Math.max
};

/**
 * Coefficients of z^0..z^N of formula `t`, with the parameters' numbers in `values` (z is the variable; pi and
 * e are constants). Throws HoloError naming the term that is not analytic at z = 0.
 */
export function taylorNumeric(t: FormulaTree, values: Readonly<Record<string, number>>, N: number): Series {
	const rec = (t: FormulaTree): Series => {
		const what = () => printTree(t);
		switch (t.kind) {
			case 'num':
				return constant(N, t.value);
			case 'name': {
				if (t.name === 'z') {
					const s = constant(N, 0);
					if (N >= 1) s[1] = 1;
					return s;
				}
				const v = Object.hasOwn(values, t.name) ? values[t.name] : t.name === 'pi' ? Math.PI : t.name === 'e' ? Math.E : undefined;
				if (v === undefined) throw new HoloError(`${t.name} needs a number here (e.g. ${t.name}=1)`, t.name);
				return constant(N, v);
			}
			case 'op': {
				const a = t.args.map(rec);
				switch (t.op) {
					case 'add':
						return a[0]!.map((x, i) => x + a[1]![i]);
					case 'subtract':
						return a[0]!.map((x, i) => x - a[1]![i]);
					case 'multiply':
						return mul(a[0]!, a[1]!);
					case 'divide':
						return div(a[0]!, a[1]!, what);
					case 'unaryMinus':
						return a[0]!.map((x) => -x);
					case 'unaryPlus':
						return a[0]!;
					case 'pow':
						if (isConstant(a[1]!)) return powConst(a[0]!, a[1]![0], what);
						return expS(mul(a[1]!, logS(a[0]!, what)));
				}
				throw notAnalytic(what(), 'unknown operator');
			}
			case 'call': {
				const a = t.args.map(rec);
				const x = a[0]!;
				if (a.every(isConstant) && CONSTANT_ONLY[t.name]) return constant(N, CONSTANT_ONLY[t.name]!(...a.map((s) => s[0])));
				switch (t.name) {
					case 'sqrt':
						return powConst(x, 0.5, what);
					case 'cbrt':
						return x[0] < 0
							? powConst(
									x.map((v) => -v),
									1 / 3,
									what
								).map((v) => -v)
							: powConst(x, 1 / 3, what);
					case 'pow':
						if (isConstant(a[1]!)) return powConst(x, a[1]![0], what);
						return expS(mul(a[1]!, logS(x, what)));
					case 'exp':
						return expS(x);
					case 'log':
						return a.length === 2 ? logS(x, what).map((v) => v / Math.log(a[1]![0])) : logS(x, what);
					case 'log10':
						return logS(x, what).map((v) => v / Math.LN10);
					case 'log2':
						return logS(x, what).map((v) => v / Math.LN2);
					case 'sin':
						return sinCos(x, false)[0];
					case 'cos':
						return sinCos(x, false)[1];
					case 'tan': {
						const [s, c] = sinCos(x, false);
						return div(s, c, what);
					}
					case 'sinh':
						return sinCos(x, true)[0];
					case 'cosh':
						return sinCos(x, true)[1];
					case 'tanh': {
						const [s, c] = sinCos(x, true);
						return div(s, c, what);
					}
					case 'atan':
						return integral(
							div(
								derivative(x),
								constant(N, 1).map((v, i) => v + mul(x, x)[i]),
								what
							),
							Math.atan(x[0])
						);
					case 'asinh':
						return integral(
							div(
								derivative(x),
								powConst(
									constant(N, 1).map((v, i) => v + mul(x, x)[i]),
									0.5,
									what
								),
								what
							),
							Math.asinh(x[0])
						);
					case 'asin':
						return integral(
							div(
								derivative(x),
								powConst(
									constant(N, 1).map((v, i) => v - mul(x, x)[i]),
									0.5,
									what
								),
								what
							),
							Math.asin(x[0])
						);
					case 'acos':
						return integral(
							div(
								derivative(x),
								powConst(
									constant(N, 1).map((v, i) => v - mul(x, x)[i]),
									0.5,
									what
								),
								what
							),
							Math.acos(x[0])
						).map((v, i) => (i === 0 ? v : -v));
					case 'atanh':
						return integral(
							div(
								derivative(x),
								constant(N, 1).map((v, i) => v - mul(x, x)[i]),
								what
							),
							Math.atanh(x[0])
						);
					case 'acosh':
						return integral(
							div(
								derivative(x),
								powConst(
									mul(x, x).map((v, i) => v - (i === 0 ? 1 : 0)),
									0.5,
									what
								),
								what
							),
							Math.acosh(x[0])
						);
					case 'abs':
						if (x[0] === 0) throw notAnalytic(what(), 'abs of a term vanishing at z = 0');
						return x[0] > 0 ? x : x.map((v) => -v);
				}
				throw notAnalytic(what(), `${t.name} of a z-dependent argument`);
			}
		}
	};
	return rec(t);
}
