import { HoloError } from '../errors';
import { taylorOf, type MetricModel } from './model';
import { evaluateQPoly } from './rational';
import { exactMetricCoeffs, type ExactCoeff } from './exact-series';
import { NUMBERS, polyRing, type DPoly } from './ring';
import { metricSeries } from './series';
import { texName } from './taylor-exact';
import { atomValues as atomValuesOf0 } from '../series/exact-latex';
import { evaluateTerms } from '../series/laurent';

const atomValuesOf = (d: number) => atomValuesOf0(d, 0);

/**
 * The metric's small-width series (series.ts) at its numbers or in its symbolic parameters. "Order n" keeps the
 * powers K ≤ n d of l, the cut in l of the named bulks (the brane's order n is K = d…nd); with `scale` (the
 * horizon, when there is one) the coefficients multiply (l/scale)^K, so a metric written as the brane gives the
 * brane's a_k.
 */
export interface MetricCoeffs {
	/** exponents K of l/scale with a nonzero coefficient, ascending */
	powers: number[];
	values: number[];
}

const numericCache = new WeakMap<MetricModel, Map<string, MetricCoeffs>>();

export function metricCoeffsNumeric(model: MetricModel, n: number, scale = 1): MetricCoeffs {
	let cache = numericCache.get(model);
	if (!cache) numericCache.set(model, (cache = new Map()));
	const key = `${n}:${scale}`;
	const hit = cache.get(key);
	if (hit) return hit;
	if (model.symbols.length) throw new HoloError(`${model.symbols.join(', ')} need numbers for a numeric series`, model.symbols[0]!);
	const M = n * model.d;
	const coeffsOf = (k: 'f' | 'h') => {
		const t = taylorOf(model, k, M);
		// exact coefficients at the numbers keep the structural zeros exact
		return t.exact ? t.exact.coeffs.map((p) => evaluateQPoly(p, model.values)) : Array.from(t.numeric!);
	};
	const { c } = metricSeries(NUMBERS, model.d, coeffsOf('f'), coeffsOf('h'), M);
	const powers: number[] = [];
	const values: number[] = [];
	c.forEach((v, i) => {
		if (v !== 0) {
			powers.push(i + 1);
			values.push(v * Math.pow(scale, i + 1));
		}
	});
	const out = { powers, values };
	cache.set(key, out);
	return out;
}

export interface SymbolicCoeff {
	power: number;
	/** monomial (exponents of `vars`, joined by ',') → coefficient */
	poly: DPoly;
	latex: string;
}

/** Coefficients as polynomials in the shown parameters (every parameter listed or left without a number). */
export function metricCoeffsSymbolic(model: MetricModel, n: number): { vars: string[]; coeffs: SymbolicCoeff[] } {
	const vars = model.shown;
	const M = n * model.d;
	const R = polyRing(vars);
	const toD = (k: 'f' | 'h') => {
		const t = taylorOf(model, k, M);
		if (!t.exact)
			throw new HoloError(`${k} is not a rational function of z: its series has numbers only`, k, 'give every parameter a number');
		return t.exact.coeffs.map((p) => {
			const out: DPoly = new Map();
			for (const [mono, q] of p.terms) out.set(mono, Number(q.n) / Number(q.d));
			return out;
		});
	};
	const { c } = metricSeries(R, model.d, toD('f'), toD('h'), M);
	const coeffs: SymbolicCoeff[] = [];
	c.forEach((poly, i) => {
		if (poly.size) coeffs.push({ power: i + 1, poly, latex: polyLatex(poly, vars) });
	});
	return { vars, coeffs };
}

/** A polynomial with decimal coefficients (12 significant digits) as LaTeX, highest total degree last. */
export function polyLatex(p: DPoly, vars: readonly string[]): string {
	const rows = [...p].map(([k, v]) => ({ e: k.split(',').map(Number), v }));
	rows.sort((a, b) => a.e.reduce((s, x) => s + x, 0) - b.e.reduce((s, x) => s + x, 0) || (a.e.join() < b.e.join() ? -1 : 1));
	let out = '';
	rows.forEach(({ e, v }, i) => {
		const mono = e
			.map((x, j) => (x === 0 ? '' : x === 1 ? texName(vars[j]!) : `${texName(vars[j]!)}^{${x}}`))
			.filter(Boolean)
			.join(' ');
		const abs = Math.abs(v);
		const num =
			mono && Math.abs(abs - 1) < 1e-15
				? ''
				: Number(abs.toPrecision(12))
						.toString()
						.replace(/e([+-]\d+)$/, (_, x) => `\\times 10^{${Number(x)}}`);
		const sign = v < 0 ? '-' : i === 0 ? '' : '+';
		out += `${i === 0 ? '' : ' '}${sign}${i === 0 ? '' : ' '}${num}${num && mono ? '\\,' : ''}${mono}`;
	});
	return out || '0';
}

export function evaluateCoeff(c: SymbolicCoeff, vars: readonly string[], values: Readonly<Record<string, number>>): number {
	let s = 0;
	for (const [k, v] of c.poly) {
		let t = v;
		k.split(',').forEach((e, i) => {
			if (e !== '0') t *= Math.pow(values[vars[i]!]!, Number(e));
		});
		s += t;
	}
	return s;
}

const exactCache = new WeakMap<MetricModel, Map<number, Map<number, string> | null>>();

/**
 * The exact π/B LaTeX of each c_K (power → LaTeX) when f and h are rational in z and exact-series.ts can carry
 * the order; each coefficient checked against the double-precision series first, monomial by monomial in the
 * shown parameters (1e−9 relative), so a disagreement leaves the decimals. Undefined when not available.
 */
export function metricExactLatex(model: MetricModel, n: number): Map<number, string> | undefined {
	let cache = exactCache.get(model);
	if (!cache) exactCache.set(model, (cache = new Map()));
	if (cache.has(n)) return cache.get(n) ?? undefined;
	let out: Map<number, string> | null = null;
	const M = n * model.d;
	const f = taylorOf(model, 'f', M);
	const h = taylorOf(model, 'h', M);
	if (f.exact && h.exact) {
		const exact = exactMetricCoeffs(model.d, n, f.exact.coeffs, h.exact.coeffs, model.shown, {});
		if (exact && agrees(model, n, exact)) out = new Map(exact.map((c) => [c.power, c.latex]));
	}
	cache.set(n, out);
	return out ?? undefined;
}

/** Every exact coefficient's monomials (in the shown parameters) against the double-precision ones. */
function agrees(model: MetricModel, n: number, exact: ExactCoeff[]): boolean {
	const d = model.d;
	const vars = model.shown;
	const numeric = new Map<number, DPoly>();
	if (vars.length) for (const c of metricCoeffsSymbolic(model, n).coeffs) numeric.set(c.power, c.poly);
	else {
		const { powers, values } = metricCoeffsNumeric(model, n);
		powers.forEach((K, i) => numeric.set(K, new Map([['', values[i]!]])));
	}
	if (numeric.size !== exact.length) return false;
	const atoms = atomValuesOf(d);
	return exact.every((c) => {
		const want = numeric.get(c.power);
		if (!want) return false;
		const groups = new Map<string, number>();
		for (const t of c.terms) {
			const key = vars.length ? t.e.slice(d).join(',') : '';
			groups.set(key, (groups.get(key) ?? 0) + evaluateTerms([{ c: t.c, e: t.e.slice(0, d) }], atoms));
		}
		if (groups.size !== want.size) return false;
		for (const [k, v] of groups) {
			const w = want.get(k);
			if (w === undefined || !(Math.abs(v - w) <= 1e-9 * Math.max(Math.abs(v), Math.abs(w)))) return false;
		}
		return true;
	});
}

export interface MetricTerms {
	terms: { k: number; coeff: number; latex: string; power: number }[];
	/** what l is measured in: the horizon (or a zh= key), or nothing (coefficients of l^K) */
	scale: 'z_h' | '1';
}

/**
 * The `coeffs` answer for a metric: with named parameters (listed in params= or left without a number) each
 * coefficient of l^K as a polynomial in them (coeff = its value when every parameter has a number, else NaN);
 * otherwise the numbers, in l/zh when the metric has a horizon or a zh= key.
 */
export function metricTerms(model: MetricModel, n: number, scale: number | undefined): MetricTerms {
	if (model.shown.length) {
		const { vars, coeffs } = metricCoeffsSymbolic(model, n);
		const known = model.symbols.length === 0;
		const exact = metricExactLatex(model, n);
		return {
			scale: '1',
			terms: coeffs.map((c, i) => ({
				k: i + 1,
				power: c.power,
				latex: exact?.get(c.power) ?? c.latex,
				coeff: known ? evaluateCoeff(c, vars, model.values) : NaN
			}))
		};
	}
	const { powers, values } = metricCoeffsNumeric(model, n, scale ?? 1);
	// the exact forms are coefficients of l^K: shown as they are only when l is not measured in another unit
	const exact = (scale ?? 1) === 1 ? metricExactLatex(model, n) : undefined;
	return {
		scale: scale === undefined ? '1' : 'z_h',
		terms: values.map((v, i) => ({
			k: i + 1,
			power: powers[i]!,
			coeff: v,
			latex: exact?.get(powers[i]!) ?? `\\approx ${Number(v.toPrecision(12))}`
		}))
	};
}
