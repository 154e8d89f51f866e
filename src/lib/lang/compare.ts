/**
 * `compare <dataset> [verb] [x="col"] [y="col"] [err="col"] [tol=…] [fit=zh] [key=value …]` puts a dataset's
 * column beside the engine's value at each of its x points. The x column is `x=` or the first column named like
 * the verb's width key (l, R, …); the y column is `y=`, or the column named like the verb, or the first other
 * column; the per-point standard deviation is `err=` or a column named err, sigma, dy or error.
 * It answers a table (x, engine, dataset, diff = engine − dataset, and with errors sigma and
 * pull = (dataset − engine)/sigma) with the dataset named in its plot hint, and a check:
 * - with errors: χ² = Σ pull², dof = points − fitted parameters; it passes when the p-value Pr(χ²_dof ≥ χ²)
 *   is at least 0.05 (residual = χ²/dof, tolerance = the 95 % point of χ²_dof / dof);
 * - without: it passes when max |diff|/|engine| ≤ tol, a relative tolerance (default 1e-4).
 * `fit=<key>` first fits one parameter (a bulk key such as zh, or c under `units cft`) by least squares
 * (fit.ts) and compares at the fitted value.
 */
import type * as A from './ast';
import type { LineEnv, StatementOut } from './env';
import { LangError } from './errors';
import type { CheckResult, Result, TableResult } from './result';
import { runVerb } from './run-verb';
import { applySinks } from './sinks';
import { didYouMean } from './suggest';
import { resolveValue } from './values';
import { verbNames, verbSpec } from './verbs/index';
import { fitParameter, type FitOutcome } from './fit';
import { chi2Quantile, chi2Sf } from '../holo/index';

/** relative: engine numbers are good to ~1e-10, a user's own numerics to a few digits less */
export const DEFAULT_COMPARE_TOL = 1e-4;
/** the χ² test's significance level */
export const COMPARE_ALPHA = 0.05;
const ERR_COLUMNS = ['err', 'sigma', 'dy', 'error', 'dA', 'uncertainty'];

export function runCompare(s: A.CompareStmt, env: LineEnv): StatementOut {
	const datasets = env.ctx.datasets ?? {};
	const name = s.dataset.text;
	const ds = Object.prototype.hasOwnProperty.call(datasets, name) ? datasets[name] : undefined;
	if (!ds) {
		throw new LangError(`unknown dataset '${name}'${didYouMean(name, Object.keys(datasets))}`, s.dataset.start, s.dataset.end, {
			hint: Object.keys(datasets).length ? `datasets: ${Object.keys(datasets).join(', ')}` : 'upload a CSV dataset first'
		});
	}
	const inferred = ds.columns.find((c) => verbNames().includes(c) && verbSpec(c)?.kind === 'scalar');
	const verb = s.verb?.text ?? inferred;
	const verbSpan: A.Span = s.verb ?? s.dataset;
	if (!verb)
		throw new LangError(
			'say which quantity to compare: compare <dataset> <verb>, e.g. compare mydata darea',
			s.dataset.start,
			s.dataset.end
		);
	const spec = verbSpec(verb);
	if (spec?.kind !== 'scalar') {
		throw new LangError(
			`compare works with verbs that give one number (darea, area, entropy, …), not ${verb}`,
			verbSpan.start,
			verbSpan.end
		);
	}

	const own = new Map<string, A.KeyValue>();
	const rest: A.KeyValue[] = [];
	for (const kv of s.keys) {
		if (kv.key === 'x' || kv.key === 'y' || kv.key === 'tol' || kv.key === 'err' || kv.key === 'fit') own.set(kv.key, kv);
		else rest.push(kv);
	}
	const scope = { ctx: env.ctx, lets: env.lets, bulk: env.bulk.params };
	const text = (k: string): string | undefined => {
		const kv = own.get(k);
		if (!kv) return undefined;
		const r = resolveValue(kv.value, scope, env.limits);
		if (r.many || typeof r.value !== 'string') throw new LangError(`${k} names a column: ${k}="…"`, kv.value.start, kv.value.end);
		if (!ds.columns.includes(r.value)) {
			throw new LangError(`dataset '${name}' has no column '${r.value}'${didYouMean(r.value, ds.columns)}`, kv.value.start, kv.value.end, {
				hint: `columns: ${ds.columns.join(', ')}`
			});
		}
		return r.value;
	};
	const form = Object.values(spec.forms)[0]!;
	const xCol = text('x') ?? ds.columns.find((c) => form.keys.includes(c) && c !== 'o');
	if (!xCol)
		throw new LangError(
			`dataset '${name}' has no column ${form.keys.filter((k) => k !== 'o').join(' or ')}: say which with x="…"`,
			s.dataset.start,
			s.dataset.end
		);
	const yCol = text('y') ?? (ds.columns.includes(verb) ? verb : ds.columns.find((c) => c !== xCol && !ERR_COLUMNS.includes(c)));
	if (!yCol) throw new LangError(`dataset '${name}' has no column to compare: say which with y="…"`, s.dataset.start, s.dataset.end);
	const eCol = text('err') ?? ds.columns.find((c) => ERR_COLUMNS.includes(c) && c !== xCol && c !== yCol);
	let tol = DEFAULT_COMPARE_TOL;
	const tkv = own.get('tol');
	if (tkv) {
		const r = resolveValue(tkv.value, scope, env.limits);
		if (r.many || typeof r.value !== 'number' || !(r.value > 0))
			throw new LangError('tol must be a number > 0', tkv.value.start, tkv.value.end);
		tol = r.value;
	}
	const xi = ds.columns.indexOf(xCol);
	const yi = ds.columns.indexOf(yCol);
	const ei = eCol ? ds.columns.indexOf(eCol) : -1;
	if (ei >= 0) {
		const bad = ds.rows.findIndex((r) => !(r[ei]! > 0));
		if (bad >= 0) {
			const kv = own.get('err');
			throw new LangError(
				`dataset '${name}' row ${bad + 1}: ${eCol} must be > 0 (a standard deviation)`,
				(kv ?? s.dataset).start,
				(kv ?? s.dataset).end
			);
		}
	}
	if (rest.some((kv) => kv.key === xCol)) {
		const kv = rest.find((k) => k.key === xCol)!;
		throw new LangError(`'${xCol}' comes from the dataset`, kv.start, kv.end);
	}
	if (ds.rows.length === 0) throw new LangError(`dataset '${name}' has no rows`, s.dataset.start, s.dataset.end);

	// the engine side is an ordinary verb line over the dataset's x values, pointing at the dataset's name
	const at = { start: s.dataset.start, end: s.dataset.end };
	const list: A.ListValue = {
		type: 'list',
		items: ds.rows.map((r) => ({ type: 'number', value: r[xi]!, raw: String(r[xi]), ...at })),
		...at
	};
	const xkv: A.KeyValue = { type: 'kv', key: xCol, keySpan: at, value: list, ...at };
	/** the engine at every x, with `extra` keys (a fitted parameter) on the line */
	const engineAt = (extra: A.KeyValue[], lineEnv: LineEnv): TableResult => {
		const stmt: A.VerbStmt = {
			type: 'verb',
			verb: { text: verb, start: verbSpan.start, end: verbSpan.end },
			keys: [xkv, ...rest, ...extra],
			sinks: [],
			start: s.start,
			end: s.end
		};
		const t = runVerb(stmt, lineEnv).results[0] as TableResult;
		if (t.kind !== 'table' || t.columns.length !== 2) throw new LangError('compare takes one order: o=3 or o=exact', s.start, s.end);
		return t;
	};
	const ys = ds.rows.map((r) => r[yi]!);
	const sigmas = ei >= 0 ? ds.rows.map((r) => r[ei]!) : undefined;
	let fit: FitOutcome | undefined;
	const fkv = own.get('fit');
	if (fkv) fit = fitParameter(fkv, rest, env, { ys, ...(sigmas ? { sigmas } : {}) }, engineAt);
	const engine = fit ? fit.table : engineAt([], env);
	let worst = 0;
	let worstAt = 0;
	let chi2 = 0;
	const rows = ds.rows.map((r, i) => {
		const e = engine.rows[i]![1] as number;
		const y = ys[i]!;
		const diff = e - y;
		const rel = Math.abs(diff) / Math.max(Math.abs(e), Number.MIN_VALUE);
		const score = sigmas ? Math.abs(diff) / sigmas[i]! : rel;
		if (!(score <= worst)) {
			worst = score;
			worstAt = i;
		}
		if (sigmas) {
			chi2 += (diff / sigmas[i]!) ** 2;
			return [r[xi]!, e, y, diff, sigmas[i]!, -diff / sigmas[i]!];
		}
		return [r[xi]!, e, y, diff];
	});
	const order = engine.columns[1]!;
	const fitted = fit ? ` at ${fit.key} = ${fit.text}` : '';
	const table: TableResult = {
		kind: 'table',
		label: `${name}: ${yCol} against ${verb} (${order}) vs ${xCol}${fitted}`,
		columns: sigmas ? [xCol, 'engine', 'dataset', 'diff', 'sigma', 'pull'] : [xCol, 'engine', 'dataset', 'diff'],
		rows,
		plot: { x: xCol, dataset: name, show: true }
	};
	if (engine.warning) table.warning = engine.warning;
	const fields: Record<string, number> = { points: rows.length, ...(fit?.fields ?? {}) };
	let check: CheckResult;
	if (sigmas) {
		const dof = Math.max(1, rows.length - (fit ? 1 : 0));
		const pvalue = chi2Sf(chi2, dof);
		const tolerance = chi2Quantile(COMPARE_ALPHA, dof) / dof;
		check = {
			kind: 'check',
			label: `${name} agrees with ${verb} (${order})${fitted} within its ${eCol}: χ²/dof = ${fmt(chi2 / dof)} over ${dof} dof, p = ${fmt(pvalue)} (passes at p ≥ ${COMPARE_ALPHA})`,
			pass: pvalue >= COMPARE_ALPHA,
			lhs: rows[worstAt]![1]!,
			rhs: rows[worstAt]![2]!,
			residual: chi2 / dof,
			tolerance,
			chi2dof: chi2 / dof,
			pvalue,
			note: `residual = χ²/dof with χ² = Σ ((dataset − engine)/${eCol})²; tolerance = χ²/dof at p = ${COMPARE_ALPHA}; lhs/rhs: engine and dataset at the largest |pull| (${xCol} = ${fmt(rows[worstAt]![0]!)})`
		};
		Object.assign(fields, { residual: chi2 / dof, chi2, dof, chi2dof: chi2 / dof, pvalue });
	} else {
		check = {
			kind: 'check',
			label: `${name} agrees with ${verb} (${order})${fitted} to max |engine − dataset|/|engine| ≤ ${tol} (relative)`,
			pass: worst <= tol,
			lhs: rows[worstAt]![1]!,
			rhs: rows[worstAt]![2]!,
			residual: worst,
			tolerance: tol,
			relation: 'engine = dataset',
			note: `residual = the largest relative difference, at ${xCol} = ${fmt(rows[worstAt]![0]!)}; no per-point errors (give an err or sigma column for a χ² test)`
		};
		Object.assign(fields, { residual: worst, max_abs_diff: Math.abs(rows[worstAt]![3]!) });
	}
	const results: Result[] = fit ? [fit.result, table, check] : [table, check];
	return {
		results: applySinks(results, s.sinks, `${name}-${verb}`),
		ref: { value: fit ? fit.value : worst, fields }
	};
}

const fmt = (v: number) => String(Number(v.toPrecision(4)));
