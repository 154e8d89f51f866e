import { HoloError } from '../errors';
import { fgStress } from '../metric/fg';
import { findHorizon, type Horizon } from '../metric/horizon';
import { metricCoeffsNumeric, metricExactLatex, metricTerms, type MetricTerms } from '../metric/coeffs';
import { checkBoundary, readMetric, taylorOf, type MetricModel } from '../metric/model';
import { differenceFromOne } from '../metric/near-boundary';
import { evaluateQPoly } from '../metric/rational';
import type { Bulk, PowerTerm, SeriesCapability, Stress } from '../types';
import { readDimension } from './params';
import { compileMetricFunction } from './sandbox';

/**
 * A custom static metric ds² = (1/z²)(−g dt² + dz²/f + h dy² + dx⃗²): f, g (default f) and h (default 1) are
 * strings in z and parameters; parameters are numeric keys (m=2) or symbolic (listed in `params="m,q"` or free
 * names). The structure (holo/metric/): Taylor coefficients at z = 0 (exact when rational in z), f(0) = g(0) =
 * h(0) = 1 exactly, the horizon (first simple zero of f, with g), T and s, ⟨T_μν⟩ from Fefferman–Graham, and the
 * small-width series (metricSeriesOf).
 *
 * The strip: when f and h are polynomials in z at the given numbers, the slice gets power terms in units of the
 * horizon (as the brane's), so the strip routine keeps 1 − z* / zh exact and reaches every width the brane reaches
 * at the same accuracy; otherwise f and h are black boxes and the admissible turning points end at the horizon or
 * at the first z where a value is not finite, f ≤ 0, h ≤ 0 or H = h/z^{2(d−1)} stops decreasing.
 */
const metricData = new WeakMap<Bulk, { model: MetricModel; horizon?: Horizon }>();

/** The metric model behind a metric bulk (for the series and the capabilities). */
export function metricModelOf(bulk: Bulk): { model: MetricModel; horizon?: Horizon } | undefined {
	return metricData.get(bulk);
}

/** The `coeffs` terms of a metric bulk (symbolic in its named parameters, or numbers). */
export function metricSeriesTerms(bulk: Bulk, n: number): MetricTerms {
	const data = metricData.get(bulk);
	if (!data) throw new HoloError(`${bulk.name} is not a metric bulk`, 'bulk');
	if (!Number.isInteger(n) || n < 1 || n > 14) throw new HoloError('order must be a whole number from 1 to 14', 'o');
	const hasScale = bulk.horizon !== undefined || typeof bulk.params.zh === 'number';
	return metricTerms(data.model, n, hasScale ? bulk.scale : undefined);
}

/**
 * Bulk.series of a numeric metric: the powers K ≤ n d of l/scale with a nonzero coefficient (mixed powers, like
 * the charged brane's); LaTeX exact (π/B forms, metric/exact-series.ts) for a rational metric measured in l
 * itself, else decimals (coeffs with named parameters goes through metricSeriesTerms).
 */
function metricSeriesCapability(model: MetricModel, scale: number, onePerOrder: boolean): SeriesCapability {
	// per order, in an array: deltaAreaSeries asks for values and powers on every call
	const memo: { powers: number[]; values: number[] }[] = [];
	const at = (n: number) => {
		let r = memo[n];
		if (!r) {
			r = metricCoeffsNumeric(model, n, scale);
			if (onePerOrder) {
				// the brane's layout: a_k at power k d, k = 1..n (zeros kept), so Horner in τ = (l/scale)^d applies
				const byPower = new Map(r.powers.map((K, i) => [K, r!.values[i]!]));
				const powers = Array.from({ length: n }, (_, i) => (i + 1) * model.d);
				r = { powers, values: powers.map((K) => byPower.get(K) ?? 0) };
			}
			memo[n] = r;
		}
		return r;
	};
	return {
		mixedPowers: !onePerOrder,
		powers: (n) => at(n).powers,
		values: (n) => at(n).values,
		coeffs: (n) => {
			const { powers, values } = at(n);
			// exact π/B forms are coefficients of l^K: used when l/scale is l itself
			const exact = scale === 1 ? metricExactLatex(model, n) : undefined;
			return values.map((value, i) => {
				const tex = exact?.get(powers[i]!);
				return { k: i + 1, power: powers[i], value, latex: tex ?? `\\approx ${Number(value.toPrecision(12))}`, exact: tex !== undefined };
			});
		}
	};
}

function readSymbols(v: number | string | undefined): string[] {
	if (v === undefined) return [];
	const list = String(v)
		.split(/[\s,]+/)
		.filter(Boolean);
	for (const s of list)
		if (!/^[A-Za-z_][A-Za-z0-9_]*$/.test(s) || s === 'z') throw new HoloError(`params: '${s}' is not a parameter name`, 'params');
	return list;
}

/** c_k zh^k at powers k (units of `scale`) for a polynomial's numeric coefficients. */
function termsOf(coeffs: number[], scale: number): PowerTerm[] {
	return coeffs.map((c, k) => ({ c: c * Math.pow(scale, k), p: k })).filter((t) => t.c !== 0 || t.p === 0);
}

/**
 * f and h polynomials in z^d with a z^d term: every c_K sits at K = k d, one power per order as for the brane,
 * so the series uses the brane's Horner evaluation, Padé in τ and Domb–Sykes radius instead of the mixed-power ones.
 */
function onePerOrder(d: number, f: number[] | undefined, h: number[] | undefined): boolean {
	if (!f || !h) return false;
	const only = (c: number[]) => c.every((x, k) => k === 0 || x === 0 || k % d === 0);
	return only(f) && only(h) && ((f[d] ?? 0) !== 0 || (h[d] ?? 0) !== 0);
}

export function makeMetric(params: Record<string, number | string>): Bulk {
	const d = readDimension(params);
	const nums: Record<string, number> = {};
	for (const [k, v] of Object.entries(params)) {
		if (k === 'f' || k === 'h' || k === 'g' || k === 'params') continue;
		if (typeof v !== 'number' || !Number.isFinite(v)) throw new HoloError(`${k} must be a finite number`, k);
		nums[k] = v;
	}
	if (params.f === undefined) throw new HoloError('metric needs f="…" (a formula in z)', 'f');
	const ftext = String(params.f);
	const gtext = params.g === undefined ? undefined : String(params.g);
	const htext = params.h === undefined ? '1' : String(params.h);
	const listed = readSymbols(params.params);
	const values = { ...nums };
	delete values.d;
	const model = readMetric({ d, f: ftext, g: gtext, h: htext, values, symbols: listed });
	checkBoundary(model);
	const out: Record<string, number | string> = { d, f: ftext, h: htext, ...nums };
	if (gtext !== undefined) out.g = gtext;
	if (model.shown.length) out.params = model.shown.join(',');
	if (model.symbols.length) {
		// symbolic: structure only (coefficients, stress in symbols); numbers need values for every parameter
		const need = (): never => {
			throw new HoloError(
				`${model.symbols.join(', ')} ${model.symbols.length > 1 ? 'are' : 'is'} symbolic: give ${model.symbols.map((s) => `${s}=…`).join(' ')} for numbers`,
				model.symbols[0]!,
				'coeffs darea o=n | tex gives the series in the symbols'
			);
		};
		const bulk: Bulk = { name: 'metric', d, params: out, slice: { d, f: need, h: need }, stress: need, thermo: need };
		metricData.set(bulk, { model });
		return bulk;
	}
	const f = compileMetricFunction(ftext, 'f', nums);
	const g = gtext === undefined ? f : compileMetricFunction(gtext, 'g', nums);
	const h = compileMetricFunction(htext, 'h', nums);
	const tf = taylorOf(model, 'f', 0);
	const th = taylorOf(model, 'h', 0);
	const polyOf = (t: typeof tf, key: 'f' | 'h' | 'g') => {
		const deg = t.exact?.degree;
		if (deg === undefined || deg > 64) return undefined;
		return taylorOf(model, key, deg).exact!.coeffs.map((p) => evaluateQPoly(p, values));
	};
	const fPoly = polyOf(tf, 'f');
	const hPoly = polyOf(th, 'h');
	const gPoly = gtext === undefined ? fPoly : polyOf(taylorOf(model, 'g', 0), 'g');
	const derivative = (c: number[] | undefined) =>
		c ? (z: number) => c.reduce((s, x, k) => (k ? s + k * x * Math.pow(z, k - 1) : s), 0) : undefined;
	const horizon = findHorizon({ d, f, g, h, fPrime: derivative(fPoly), gPrime: derivative(gPoly), scale: nums.zh ?? 1 });
	const zh = horizon.kind === 'simple' ? horizon.zh : undefined;
	// an extremal or irregular zero still ends the turning points (zmax below)
	const scale = zh ?? nums.zh ?? 1;
	const m = 2 * (d - 1);
	const H = (z: number) => h(z) / Math.pow(z, m);
	const ok = (z: number) => {
		const fz = f(z);
		const hz = h(z);
		return Number.isFinite(fz) && Number.isFinite(hz) && fz > 0 && hz > 0;
	};
	// the admissible turning points end where H stops decreasing or a value fails, if before the horizon
	let zmax = Infinity;
	let prev = 1e-6 * scale;
	for (let i = 1; i <= 480; i++) {
		const z = 1e-6 * scale * Math.pow(10, i / 40);
		if (zh !== undefined && z >= zh) break;
		if (!ok(z) || !(H(z) < H(prev))) {
			let lo = prev;
			let hi = z;
			for (let k = 0; k < 60; k++) {
				const mid = Math.sqrt(lo * hi);
				if (ok(mid) && H(mid) < H(lo)) lo = mid;
				else hi = mid;
			}
			zmax = lo;
			break;
		}
		prev = z;
	}
	const terms = fPoly && hPoly && !Number.isFinite(zmax);
	const slice: Bulk['slice'] = {
		d,
		f,
		h,
		...(terms ? { scale, fTerms: termsOf(fPoly, scale), hTerms: termsOf(hPoly, scale) } : {}),
		...(zh !== undefined && Number.isFinite(zmax) === false ? { zh } : {}),
		zmax: Number.isFinite(zmax) ? zmax : zh === undefined && horizon.zh !== undefined ? horizon.zh : undefined
	};
	if (zh !== undefined && !terms) slice.zmax = Math.min(slice.zmax ?? Infinity, zh);
	if (!terms) {
		// a black box: f − 1 and h − 1 near the boundary from the Taylor series (metric/near-boundary.ts)
		const fm1 = differenceFromOne(model.trees.f, values, f);
		const hm1 = differenceFromOne(model.trees.h, values, h);
		if (fm1) slice.fm1 = fm1;
		if (hm1) slice.hm1 = hm1;
	}
	const fg = fgStress(model);
	const stress = (G: number): Stress => {
		if (fg.kind === 'deformation')
			throw new HoloError(fg.message, fg.keys[0]!, 'there is no stress tensor of a normalisable state to give');
		return fg.stress(G);
	};
	const bulk: Bulk = {
		name: 'metric',
		d,
		params: out,
		horizon: zh,
		scale: d >= 3 ? scale : undefined,
		slice,
		series: d >= 3 ? metricSeriesCapability(model, scale, onePerOrder(d, fPoly, hPoly)) : undefined,
		stress,
		thermo: (G) => {
			const s = stress(G);
			if (horizon.problem) throw new HoloError(horizon.problem.message, horizon.problem.key, 'no temperature without a regular horizon');
			const t = { T: horizon.T, s: horizon.s(G), e: s.tt, p: s.xx };
			return s.yy === s.xx ? t : { ...t, py: s.yy };
		}
	};
	metricData.set(bulk, { model, horizon });
	return bulk;
}
