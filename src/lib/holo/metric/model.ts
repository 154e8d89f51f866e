import { HoloError } from '../errors';
import { FormulaError, readFormulaTree, type FormulaTree } from '../formula';
import { evaluateQPoly, valueQ, constantOf, type QPoly } from './rational';
import { taylorExact, textOf as latexFree, type ExactTaylor } from './taylor-exact';
import { taylorNumeric } from './taylor-numeric';

/**
 * A custom static metric (PHYSICS.md, `metric`) read for its structure: ds² = (1/z²)(−g dt² + dz²/f + h dy² + dx⃗²),
 * f, g, h formulas in z through the one sandbox (formula.ts), g defaulting to f and h to 1. Parameters are numbers
 * (`values`) or symbols: named in `symbols` or found as free names of the formulas. Their Taylor coefficients
 * at z = 0 are exact (taylor-exact.ts, nerdamer's expand/coeffs) when the formula is rational in z, and always
 * also numeric (taylor-numeric.ts); the exact ones are checked against the numeric ones before use.
 */
export type MetricKey = 'f' | 'g' | 'h';

export interface MetricSpec {
	d: number;
	f: string;
	g?: string;
	h?: string;
	values: Readonly<Record<string, number>>;
	symbols?: readonly string[];
}

export interface MetricModel {
	d: number;
	texts: Record<MetricKey, string>;
	trees: Record<MetricKey, FormulaTree>;
	/** parameters left symbolic (no number given), sorted */
	symbols: string[];
	/** parameters shown symbolically (listed or without a number), sorted */
	shown: string[];
	values: Readonly<Record<string, number>>;
}

const MAX_LEN = 400;
const RESERVED = new Set(['z', 'pi', 'e']);

function readTree(text: string, key: MetricKey, names: string[], found: Set<string>): FormulaTree {
	if (typeof text !== 'string' || text.trim() === '') throw new HoloError(`${key} must be a formula in z`, key);
	for (let guard = 0; guard < 16; guard++) {
		try {
			return readFormulaTree(text, [...names, ...found, 'z'], { limits: { maxLength: MAX_LEN } });
		} catch (e) {
			if (!(e instanceof FormulaError)) throw e;
			const free = /^unknown name '([A-Za-z_][A-Za-z0-9_]*)'$/.exec(e.message)?.[1];
			if (free && !RESERVED.has(free)) {
				found.add(free);
				continue;
			}
			throw new HoloError(`${key} ${e.code === 'refused' ? 'is refused: ' : ''}${e.message}`, key);
		}
	}
	throw new HoloError(`${key} has too many free names`, key);
}

export function readMetric(spec: MetricSpec): MetricModel {
	const found = new Set<string>(spec.symbols ?? []);
	const names = Object.keys(spec.values).filter((k) => !RESERVED.has(k));
	const texts: Record<MetricKey, string> = { f: spec.f, g: spec.g ?? spec.f, h: spec.h ?? '1' };
	const trees = {} as Record<MetricKey, FormulaTree>;
	for (const key of ['f', 'g', 'h'] as const) trees[key] = readTree(texts[key], key, names, found);
	const symbols = [...found].filter((s) => !Object.hasOwn(spec.values, s)).sort();
	return { d: spec.d, texts, trees, symbols, shown: [...found].sort(), values: spec.values };
}

export interface KeyTaylor {
	/** doubles at the parameters' numbers (absent while a parameter is symbolic) */
	numeric?: Float64Array;
	/** exact, as polynomials in `shown` (absent when the formula is not rational in z) */
	exact?: ExactTaylor;
}

/** Fixed sample numbers for the symbols when cross-checking (irrational-looking, so no accidental zero). */
const SAMPLE = [0.3718, 0.5923, 0.2871, 0.4459, 0.6637, 0.1913];

function checkAgainst(exact: QPoly[], numeric: Float64Array, at: Record<string, number>, key: MetricKey): void {
	exact.forEach((p, k) => {
		const a = evaluateQPoly(p, at);
		const b = numeric[k]!;
		if (!(Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(a), Math.abs(b)))) {
			throw new HoloError(
				`${key}: exact and numeric Taylor coefficients of z^${k} disagree (${a} vs ${b})`,
				key,
				'please report this metric'
			);
		}
	});
}

const taylorCache = new WeakMap<MetricModel, Map<string, KeyTaylor>>();

/** Taylor coefficients of z^0..z^N of f, g or h; exact ones cross-checked against the numeric ones. */
export function taylorOf(model: MetricModel, key: MetricKey, N: number): KeyTaylor {
	let cache = taylorCache.get(model);
	if (!cache) taylorCache.set(model, (cache = new Map()));
	const hit = cache.get(`${key}:${N}`);
	if (hit) return hit;
	const tree = model.trees[key];
	const out: KeyTaylor = {};
	if (model.symbols.length === 0) out.numeric = taylorNumeric(tree, model.values, N);
	out.exact = taylorExact(tree, model.shown, model.values, N, key);
	if (out.exact) {
		const at: Record<string, number> = { ...model.values };
		model.shown.forEach((s, i) => {
			if (!Object.hasOwn(at, s)) at[s] = SAMPLE[i % SAMPLE.length]! + i;
		});
		const check = model.symbols.length === 0 ? out.numeric! : taylorNumeric(tree, at, N);
		checkAgainst(out.exact.coeffs, check, at, key);
	} else if (model.symbols.length > 0) {
		throw new HoloError(
			`${key} is not a rational function of z, so its parameters ${model.symbols.join(', ')} need numbers`,
			model.symbols[0]!,
			`give ${model.symbols.map((s) => `${s}=…`).join(' ')}`
		);
	}
	cache.set(`${key}:${N}`, out);
	return out;
}

/** f(0) = g(0) = h(0) = 1, exactly when the coefficients are exact; else to 1e−12. Names the function at fault. */
export function checkBoundary(model: MetricModel): void {
	for (const key of ['f', 'g', 'h'] as const) {
		const t = taylorOf(model, key, 0);
		const c0 = t.exact ? constantOf(t.exact.coeffs[0]!) : undefined;
		if (t.exact && !(c0 && c0.n === c0.d)) {
			throw new HoloError(
				`${key}(0) must be 1 (got ${latexFree(t.exact.coeffs[0]!)})`,
				key,
				'the metric must approach AdS at the boundary'
			);
		}
		if (!t.exact && !(Math.abs(t.numeric![0]! - 1) <= 1e-12)) {
			throw new HoloError(`${key}(0) must be 1 (got ${t.numeric![0]})`, key, 'the metric must approach AdS at the boundary');
		}
	}
}

/** Is coefficient k of f, g or h nonzero (exactly when exact; else above 1e−14 relative)? */
export function isNonzero(t: KeyTaylor, k: number): boolean {
	if (t.exact) return t.exact.coeffs[k]!.terms.size > 0;
	return Math.abs(t.numeric![k]!) > 1e-14;
}

/** The exact coefficient as a number at the model's values (symbols must have values). */
export function coefficientValue(model: MetricModel, t: KeyTaylor, k: number): number {
	return t.numeric ? t.numeric[k]! : evaluateQPoly(t.exact!.coeffs[k]!, model.values);
}

export { valueQ };
