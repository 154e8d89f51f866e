import { betaShifted, binomRat, nAtoms } from '../series/exact';
import { atomValues, formatTerms } from '../series/exact-latex';
import {
	addProduct,
	addTo,
	evaluateTerms,
	invertMonomial,
	monomial,
	normalize,
	rat,
	ratMul,
	scale,
	terms,
	zero,
	type LPoly,
	type Term
} from '../series/laurent';
import type { QPoly } from './rational';
import type { Ring } from './ring';
import { metricSeries } from './series';
import { texName } from './taylor-exact';

/**
 * Exact coefficients of a rational metric's series: series.ts run over ℚ[π, B₁^{±1}, …, B_{d−2}^{±1}, p₁, …]
 * — the brane's atoms (series/exact.ts: B_s = B(s/m, ½), every Beta value of the expansion reduced to them by
 * `betaShifted`) with the metric's shown parameters as further atoms — in laurent.ts's exact arithmetic. So a
 * metric written as the brane prints the brane's own π/B forms (series/exact-latex.ts's canonical `formatTerms`),
 * and a metric with parameters prints each coefficient as a polynomial in them with those forms as coefficients.
 *
 * Limits: laurent.ts keys hold at most 10 atoms (d + #parameters ≤ 10) and exponents below 18 in the algebra,
 * and the strings grow fast with the order, so exact forms are made to EXACT_METRIC_ORDER; beyond, or when a
 * check fails, the caller keeps the decimals. Never trusted alone: every exact coefficient is evaluated and
 * compared with the double-precision series (coeffs.ts) before it is shown.
 */
export const EXACT_METRIC_ORDER = 6;
const MAX_ATOMS = 10;

export interface ExactCoeff {
	/** power K of l */
	power: number;
	latex: string;
	/** the exact form evaluated at the parameters' numbers (NaN while one is symbolic) */
	value: number;
	terms: Term[];
}

/** A one-term LPoly of nAtoms(d) atoms re-keyed into N atoms (the parameters' slots after the brane's). */
function embed(p: LPoly, N: number): LPoly {
	const out = zero(N);
	for (const t of terms(p)) addTo(out, monomial(N, t.c, Object.fromEntries(t.e.map((x, i) => [i, x]))));
	return normalize(out);
}

function exactRing(d: number, N: number): Ring<LPoly> {
	const betas = new Map<string, LPoly>();
	const beta = (r: number, n: number) => {
		const key = `${r}:${n}`;
		let b = betas.get(key);
		if (!b) betas.set(key, (b = embed(scale(betaShifted(d, r, n), binomRat(-1, 2, n)), N)));
		return b;
	};
	const w0inv = invertMonomial(embed(scale(betaShifted(d, d, 0), rat(2)), N));
	const mul = (a: LPoly, b: LPoly) => {
		const o = zero(N);
		addProduct(o, a, b);
		return normalize(o);
	};
	const byInt = (a: LPoly, c: number) => {
		if (!Number.isInteger(c)) throw new Error(`exact ring: ${c} is not an integer`);
		return scale(a, rat(c));
	};
	return {
		zero: zero(N),
		one: monomial(N, rat(1)),
		add(a, b) {
			if (a.t.size === 0) return b;
			if (b.t.size === 0) return a;
			const o = zero(N);
			addTo(o, a);
			addTo(o, b);
			return normalize(o);
		},
		mul,
		scale: byInt,
		isZero: (a) => a.t.size === 0,
		exact: {
			scaleQ: (a, num, den) => scale(a, rat(num, den)),
			scaleBeta: (a, r, n) => mul(a, beta(r, n)),
			divW0: (a) => mul(a, w0inv),
			finish: (a, K) => scale(a, rat(2, K))
		}
	};
}

/** An exact Taylor coefficient (a polynomial in the shown parameters) as an LPoly with them at slots d, d+1, …. */
function fromQPoly(p: QPoly, d: number, N: number): LPoly {
	const out = zero(N);
	for (const [k, q] of p.terms) {
		const e: Record<number, number> = {};
		if (k !== '') k.split(',').forEach((x, i) => x !== '0' && (e[d + i] = Number(x)));
		addTo(out, monomial(N, { num: q.n, den: q.d }, e));
	}
	return normalize(out);
}

/** LaTeX of Σ_group (π/B form) · (parameter monomial), parameters in `vars`. */
function latexOf(ts: Term[], d: number, vars: readonly string[]): string {
	const groups = new Map<string, Term[]>();
	for (const t of ts) {
		const key = t.e.slice(d).join(',');
		const g = groups.get(key) ?? [];
		g.push({ c: t.c, e: t.e.slice(0, d) });
		groups.set(key, g);
	}
	const rows = [...groups].map(([k, g]) => ({ e: k === '' ? [] : k.split(',').map(Number), g }));
	rows.sort((a, b) => a.e.reduce((s, x) => s + x, 0) - b.e.reduce((s, x) => s + x, 0) || (a.e.join() < b.e.join() ? 1 : -1));
	const parts = rows.map(({ e, g }) => {
		const mono = e
			.map((x, j) => (x === 0 ? '' : x === 1 ? texName(vars[j]!) : `${texName(vars[j]!)}^{${x}}`))
			.filter(Boolean)
			.join(' ');
		const c = formatTerms(g, d, false);
		if (!mono) return c;
		if (c === '1') return mono;
		if (c === '-1') return `-${mono}`;
		return `${c}\\,${mono}`;
	});
	return parts.map((p, i) => (i === 0 ? p : p.startsWith('-') ? ` - ${p.slice(1)}` : ` + ${p}`)).join('') || '0';
}

/**
 * c_K (K ≤ n d, nonzero only) of ΔA = l^{2−d} Σ c_K l^K exactly, from the exact Taylor coefficients f[0..nd],
 * h[0..nd] (polynomials in `vars`); undefined when the atoms would not fit (d + #vars > 10) or n is too high.
 */
export function exactMetricCoeffs(
	d: number,
	n: number,
	f: QPoly[],
	h: QPoly[],
	vars: readonly string[],
	values: Readonly<Record<string, number>>
): ExactCoeff[] | undefined {
	const N = nAtoms(d) + vars.length;
	if (d < 3 || n > EXACT_METRIC_ORDER || N > MAX_ATOMS) return undefined;
	const M = n * d;
	const R = exactRing(d, N);
	let c: LPoly[];
	try {
		c = metricSeries(
			R,
			d,
			f.slice(0, M + 1).map((p) => fromQPoly(p, d, N)),
			h.slice(0, M + 1).map((p) => fromQPoly(p, d, N)),
			M
		).c;
	} catch (e) {
		// an exponent out of laurent.ts's range: leave the decimals
		if (e instanceof Error && /out of range|too many atoms/.test(e.message)) return undefined;
		throw e;
	}
	const W0 = terms(embed(scale(betaShifted(d, d, 0), rat(2)), N))[0]!;
	const atoms = [...atomValues(d, 0), ...vars.map((v) => (Object.hasOwn(values, v) ? values[v]! : NaN))];
	const out: ExactCoeff[] = [];
	c.forEach((p, i) => {
		if (p.t.size === 0) return;
		const K = i + 1;
		const e = d - 2 - K;
		// W₀^{d−2−K} on the finished terms (its exponents leave laurent.ts's range inside the algebra)
		let cw = rat(1);
		for (let j = 0; j < Math.abs(e); j++) cw = ratMul(cw, e > 0 ? W0.c : { num: W0.c.den, den: W0.c.num });
		const ts = terms(
			p,
			cw,
			W0.e.map((x) => x * e)
		);
		out.push({ power: K, terms: ts, latex: latexOf(ts, d, vars), value: atoms.some(Number.isNaN) ? NaN : evaluateTerms(ts, atoms) });
	});
	return out;
}
