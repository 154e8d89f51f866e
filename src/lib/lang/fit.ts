/**
 * `compare <dataset> <verb> fit=zh`: the one parameter (a numeric key of the pad's bulk, or c under `units cft`)
 * that best fits the dataset, by least squares: χ²(p) = Σ ((engine(x_i; p) − y_i)/σ_i)² (σ_i = 1 without an
 * error column), minimised by Brent's method (holo/numeric/minimize.ts) in ln p after a coarse scan over
 * p₀/8 … 8p₀ around the current value p₀. Its standard error is the Δχ² = 1 rule, σ_p² = 2/χ²''(p̂), from a
 * central second difference; without per-point errors it is scaled by √(χ²_min/(N − 1)), estimating σ from the
 * scatter (both standard practice: Press et al., Numerical Recipes, 3rd ed., §15.1 and §15.6).
 * Every χ² evaluation runs the verb at all N points and counts against the line's points limit.
 */
import type * as A from './ast';
import type { LineEnv } from './env';
import { LangError } from './errors';
import { limitError } from './limits';
import type { ScalarResult, TableResult } from './result';
import { minimizeBrent } from '../holo/index';

export interface FitOutcome {
	key: string;
	value: number;
	error: number;
	text: string;
	/** the engine at the fitted value */
	table: TableResult;
	result: ScalarResult;
	fields: Record<string, number>;
}

const SCAN = 9;
const MAX_ITER = 40;
/** evaluations of the whole dataset at most: the scan, Brent's steps, the curvature and the final table */
export const FIT_EVALUATIONS = SCAN + MAX_ITER + 3;

const fmt = (v: number) => String(Number(v.toPrecision(5)));

export function fitParameter(
	kv: A.KeyValue,
	rest: A.KeyValue[],
	env: LineEnv,
	data: { ys: number[]; sigmas?: number[] },
	engineAt: (extra: A.KeyValue[], lineEnv: LineEnv) => TableResult
): FitOutcome {
	const v = kv.value;
	const key = v.type === 'name' ? v.name : v.type === 'string' ? v.value : undefined;
	if (!key) throw new LangError('fit names one parameter: fit=zh (or fit=c under units cft)', v.start, v.end);
	const n = data.ys.length;
	if (n < 2) throw new LangError('a fit needs at least 2 data points', kv.start, kv.end);
	const cft = key === 'c';
	let p0: number | undefined;
	if (cft) {
		if (env.units.system !== 'cft') throw new LangError('fit=c needs CFT units: units cft c=… first', v.start, v.end);
		p0 = env.units.c;
	} else {
		const given = env.bulk.params[key];
		if (typeof given !== 'number') {
			const keys = Object.keys(env.bulk.params).filter((k) => typeof env.bulk.params[k] === 'number');
			throw new LangError(`the bulk has no number '${key}' to fit`, v.start, v.end, {
				hint: `fit one of ${keys.join(', ')}, or c under units cft`
			});
		}
		if (rest.some((r) => r.key === key)) throw new LangError(`fit varies ${key}: leave ${key}= off the line`, kv.start, kv.end);
		p0 = given;
	}
	if (!(p0! > 0)) throw new LangError(`the fit starts from ${key} = ${p0}: give it a positive starting value`, v.start, v.end);
	if (env.pointsUsed + n * FIT_EVALUATIONS > env.limits.maxPoints) {
		throw limitError(
			'maxPoints',
			`a fit evaluates the dataset's ${n} points up to ${FIT_EVALUATIONS} times: at most ${Math.floor((env.limits.maxPoints - env.pointsUsed) / FIT_EVALUATIONS)} points`,
			kv.start,
			kv.end,
			env.limits
		);
	}

	const at = { start: kv.start, end: kv.end };
	const tableAt = (p: number): TableResult => {
		if (cft) {
			const e2: LineEnv = { ...env, units: { system: 'cft', c: p } };
			try {
				return engineAt([], e2);
			} finally {
				env.pointsUsed = e2.pointsUsed;
			}
		}
		const pkv: A.KeyValue = { type: 'kv', key, keySpan: at, value: { type: 'number', value: p, raw: String(p), ...at }, ...at };
		return engineAt([pkv], env);
	};
	const chi2 = (p: number): number => {
		let t: TableResult;
		try {
			t = tableAt(p);
		} catch (e) {
			// a value the engine refuses (outside the bulk's range) is no fit; a limit is still a limit
			if (e instanceof LangError && e.code === 'language') return Infinity;
			throw e;
		}
		let s = 0;
		for (let i = 0; i < n; i++) s += (((t.rows[i]![1] as number) - data.ys[i]!) / (data.sigmas?.[i] ?? 1)) ** 2;
		return Number.isFinite(s) ? s : Infinity;
	};

	const lo = Math.log(p0! / 8);
	const hi = Math.log(p0! * 8);
	const grid = Array.from({ length: SCAN }, (_, i) => lo + ((hi - lo) * i) / (SCAN - 1));
	const values = grid.map((u) => chi2(Math.exp(u)));
	const best = values.indexOf(Math.min(...values));
	if (!Number.isFinite(values[best]!))
		throw new LangError(`no ${key} in ${fmt(p0! / 8)} … ${fmt(p0! * 8)} gives an engine value at every point`, kv.start, kv.end);
	const a = grid[Math.max(0, best - 1)]!;
	const b = grid[Math.min(SCAN - 1, best + 1)]!;
	const m = minimizeBrent((u) => chi2(Math.exp(u)), a, b, 1e-9, MAX_ITER);
	const p = Math.exp(m.x);
	const h = 1e-3 * p;
	const curvature = (chi2(p + h) - 2 * m.fx + chi2(p - h)) / (h * h);
	let error = curvature > 0 ? Math.sqrt(2 / curvature) : NaN;
	if (!data.sigmas) error *= Math.sqrt(m.fx / Math.max(1, n - 1));
	const table = tableAt(p);
	const edge = best === 0 || best === SCAN - 1;
	const text = `${fmt(p)} ± ${fmt(error)}`;
	const orderCol = table.columns[1]!;
	const fields = { [key]: p, [`${key}_err`]: error, chi2_min: m.fx };
	const result: ScalarResult = {
		kind: 'scalar',
		label: `${key} fitted (${orderCol}) = ${text}`,
		value: p,
		order: orderCol === 'exact' ? 'exact' : Number(orderCol.slice(1)) || 'exact',
		fields,
		note: `least squares in one parameter (Brent's method); ± is one standard error from the curvature of χ² (Δχ² = 1)${data.sigmas ? '' : ', scaled by the scatter since the dataset gives no errors'}`,
		...(edge
			? {
					warning: `the best ${key} is at the edge of the range searched (${fmt(p0! / 8)} … ${fmt(p0! * 8)}): start nearer with ${cft ? 'units cft c=…' : `use … ${key}=…`}`
				}
			: {})
	};
	return { key, value: p, error, text, table, result, fields };
}
