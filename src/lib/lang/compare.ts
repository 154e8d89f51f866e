/**
 * `compare <dataset> [verb] [x="col"] [y="col"] [tol=…] [key=value …]` puts a dataset's column beside the
 * engine's value at each of its x points. The x column is `x=` or the first column named like the verb's
 * width key (l, R, …); the y column is `y=`, or the column named like the verb, or the first other column.
 * It answers a table (x, engine, dataset, diff) with the dataset named in its plot hint, and a check that
 * passes when max |diff| ≤ tol · max(1, max |engine|) (tol defaults to 1e-6).
 */
import type * as A from './ast';
import type { LineEnv, StatementOut } from './env';
import { LangError } from './errors';
import type { Result, TableResult } from './result';
import { runVerb } from './run-verb';
import { applySinks } from './sinks';
import { didYouMean } from './suggest';
import { resolveValue } from './values';
import { verbNames, verbSpec } from './verbs/index';

const DEFAULT_TOL = 1e-6;

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
		if (kv.key === 'x' || kv.key === 'y' || kv.key === 'tol') own.set(kv.key, kv);
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
	const yCol = text('y') ?? (ds.columns.includes(verb) ? verb : ds.columns.find((c) => c !== xCol));
	if (!yCol) throw new LangError(`dataset '${name}' has no column to compare: say which with y="…"`, s.dataset.start, s.dataset.end);
	let tol = DEFAULT_TOL;
	const tkv = own.get('tol');
	if (tkv) {
		const r = resolveValue(tkv.value, scope, env.limits);
		if (r.many || typeof r.value !== 'number' || !(r.value > 0))
			throw new LangError('tol must be a number > 0', tkv.value.start, tkv.value.end);
		tol = r.value;
	}
	const xi = ds.columns.indexOf(xCol);
	const yi = ds.columns.indexOf(yCol);
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
	const stmt: A.VerbStmt = {
		type: 'verb',
		verb: { text: verb, start: verbSpan.start, end: verbSpan.end },
		keys: [xkv, ...rest],
		sinks: [],
		start: s.start,
		end: s.end
	};
	const engine = runVerb(stmt, env).results[0] as TableResult;
	if (engine.kind !== 'table' || engine.columns.length !== 2) {
		throw new LangError('compare takes one order: o=3 or o=exact', s.start, s.end);
	}

	let worst = 0;
	let worstAt = 0;
	let scale = 1;
	const rows = ds.rows.map((r, i) => {
		const e = engine.rows[i]![1] as number;
		const y = r[yi]!;
		const diff = e - y;
		scale = Math.max(scale, Math.abs(e));
		if (!(Math.abs(diff) <= worst)) {
			worst = Math.abs(diff);
			worstAt = i;
		}
		return [r[xi]!, e, y, diff];
	});
	const order = engine.columns[1]!;
	const table: TableResult = {
		kind: 'table',
		label: `${name}: ${yCol} against ${verb} (${order}) vs ${xCol}`,
		columns: [xCol, 'engine', 'dataset', 'diff'],
		rows,
		plot: { x: xCol, dataset: name, show: true }
	};
	if (engine.warning) table.warning = engine.warning;
	const tolerance = tol * scale;
	const check: Result = {
		kind: 'check',
		label: `${name} agrees with ${verb} (${order}) to max |diff| ≤ ${tol} · max(1, |engine|)`,
		pass: worst <= tolerance,
		lhs: rows[worstAt]![1]!,
		rhs: rows[worstAt]![2]!,
		residual: worst,
		tolerance
	};
	return {
		results: applySinks([table, check], s.sinks, `${name}-${verb}`),
		ref: { value: worst, fields: { residual: worst, points: rows.length } }
	};
}
