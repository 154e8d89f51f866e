/**
 * One verb statement: sort and evaluate its keys, walk its points (swept values × orders), ask the engine at
 * each, and shape the answer as API.md says — one scalar (or record) for one point and one order, otherwise a
 * table whose first column is the swept key and whose other columns are the orders (o1, o2, …, exact).
 */
import type * as A from './ast';
import { type LineEnv, type StatementOut, findKey, withEngine } from './env';
import { LangError } from './errors';
import { describeBulk, orderWords, shortNumber, texRecord, texScalar, SYMBOLS } from './format';
import { readOrders, resolveKeys, sortKeys } from './keys';
import { limitError } from './limits';
import type { Order, Result, StepRef } from './result';
import { checkBulk, checkKey } from './schema';
import { applySinks } from './sinks';
import { buildTable, seriesLatex, tableRef, validityHints } from './tables';
import { type Resolved, type Scalar, resolveValue } from './values';
import { type BulkName, type Verb, canonicalKey } from './vocab';
import * as V from './verbs';

export function runVerb(s: A.VerbStmt, env: LineEnv): StatementOut {
	const verb = s.verb.text as Verb;
	const bulkName = env.bulk.name as BulkName;
	const kind = V.VERB_KIND[verb];
	const verbSpan: A.Span = s.verb;
	const sorted = sortKeys(verb, s.subject, s.keys, bulkName, verbSpan);

	// bulk keys against the pad's bulk, quantities against the line's bulk (values.ts explains why)
	const bres = resolveKeys(sorted.bulkKeys, { ctx: env.ctx, lets: env.lets, bulk: env.bulk.params }, env);
	const base = { ...env.bulk.params };
	for (const [kv, r] of bres.values) if (!r.many) setBulkKey(base, kv.key, r.value);
	const qscope = { ctx: env.ctx, lets: env.lets, bulk: base };
	const qres = resolveKeys(sorted.quantityKeys, qscope, env, bres.swept);
	const swept = qres.swept ?? bres.swept;
	const sweptIsBulk = swept !== undefined && bres.swept === swept;
	const oRes = sorted.orderKey ? resolveValue(sorted.orderKey.value, qscope, env.limits) : undefined;
	const orders = readOrders(sorted.orderKey, oRes, env);

	if ((kind === 'series' || verb === 'validity' || verb === 'resum') && orders.includes('exact')) {
		const span = sorted.orderKey?.value ?? verbSpan;
		throw new LangError(`${verb} needs a whole order, e.g. o=4`, span.start, span.end);
	}
	if (kind === 'series' && (orders.length > 1 || swept)) {
		const span = swept?.value ?? sorted.orderKey!.value;
		throw new LangError('coeffs shows one series: give one value of each key', span.start, span.end);
	}
	// a record or check verb with several orders and nothing else swept sweeps the order itself
	let xKey = swept ? canonicalKey(swept.key) : mainKey(sorted.form.keys);
	let xs: (Scalar | undefined)[] = swept ? allValues(swept, bres, qres) : [mainValue(xKey, qres.values, sorted.quantityKeys)];
	let orderSweep = false;
	if ((kind === 'record' || kind === 'check') && orders.length > 1) {
		if (swept) {
			const o = sorted.orderKey!;
			throw new LangError(`${verb} takes one order when '${swept.key}' is swept`, o.value.start, o.value.end);
		}
		orderSweep = true;
		xKey = 'o';
		xs = orders.map((o) => (o === 'exact' ? 'exact' : o));
	}

	const total = orderSweep ? orders.length : xs.length * orders.length;
	if (env.pointsUsed + total > env.limits.maxPoints) {
		const span = swept?.value ?? sorted.orderKey?.value ?? verbSpan;
		throw limitError(
			'maxPoints',
			`this line asks for ${env.pointsUsed + total} points; at most ${env.limits.maxPoints} sweep points are allowed`,
			span.start,
			span.end,
			env.limits
		);
	}
	env.pointsUsed += total;

	let done = 0;
	const tick = (): void => {
		done++;
		env.onProgress?.(done, total);
	};
	const pointAt = (x: Scalar | undefined, order: Order): V.Point => {
		const where = swept && x !== undefined ? `at ${swept.key}=${typeof x === 'number' ? shortNumber(x) : x}` : '';
		const params = sweptIsBulk ? withKey(base, swept!.key, x!) : base;
		const checked = checkBulk(bulkName, params);
		if (!checked.ok) throw keyError(s.keys, checked, verbSpan, where);
		const { q, words } = quantitiesAt(
			sorted.quantityKeys,
			qres.values,
			sweptIsBulk ? { ...qscope, bulk: checked.value } : undefined,
			env,
			swept,
			x,
			where
		);
		return withEngine(s.keys, verbSpan, where, () => {
			const bulk = V.makeBulk(bulkName, checked.value);
			const G = q.G ?? (V.USES_G.has(verb) ? V.newtonG(env.units, bulk.d) : 1);
			return { bulk, q, words, order, shape: sorted.shape, G };
		});
	};
	const engine = <T>(_p: V.Point, x: Scalar | undefined, f: () => T): T =>
		withEngine(s.keys, verbSpan, swept && x !== undefined ? `at ${swept.key}=${typeof x === 'number' ? shortNumber(x) : x}` : '', f);

	const shown = { ...base };
	if (sweptIsBulk) delete shown[swept!.key]; // the table's first column shows it
	const bulkText = describeBulk({ name: bulkName, params: shown });
	// a table's label names the charge chemical potential too (a single value's label comes from the engine's answer)
	const sym = verb === 'mu' && bulkName === 'charged' && (base.d ?? 4) !== 2 ? 'μ_Q' : (SYMBOLS[verb]?.text ?? verb);
	const results: Result[] = [];
	let ref: StepRef | undefined;

	if (kind === 'series') {
		const p = pointAt(xs[0], orders[0]!);
		const st = engine(p, undefined, () => V.seriesAt(p));
		tick();
		const n = orders[0] as number;
		results.push({
			kind: 'series',
			label: `ΔA series to order ${n} · ${bulkText}`,
			terms: st.terms,
			latex: seriesLatex(st),
			order: n
		});
		ref = { fields: Object.fromEntries(st.terms.map((t) => [`a${t.k}`, t.coeff])), order: n };
	} else if (!s.sweep && !orderSweep && xs.length === 1 && orders.length === 1) {
		const x = xs[0];
		const order = orders[0]!;
		const p = pointAt(x, order);
		const args = argsOf(p.q);
		const argText = Object.entries(args)
			.map(([k, v]) => `${k}=${shortNumber(v)}`)
			.join(' ');
		if (kind === 'scalar') {
			const { value, warning, fields: extra, symbol, tag, note } = engine(p, x, () => V.scalarAt(verb, p));
			tick();
			results.push({
				kind: 'scalar',
				label: `${symbol ?? sym}${tag ?? ''}${argText ? `${tag ? ' ' : ''}(${argText})` : ''}, ${orderWords(order)} · ${bulkText}`,
				value,
				order,
				latex: texScalar(verb, args, order, value),
				fields: { ...args, ...(extra ?? {}) },
				...(warning ? { warning } : {}),
				...(note ? { note } : {})
			});
			ref = { value, fields: { ...args, ...(extra ?? {}) }, order };
		} else if (kind === 'record') {
			const fields = engine(p, x, () => V.recordAt(verb, p));
			tick();
			const note = V.recordNote(verb, p);
			results.push({
				kind: 'record',
				label: `${sym}${argText ? `(${argText})` : ''} · ${bulkText}`,
				fields,
				latex: texRecord(fields),
				...(note ? { note } : {})
			});
			ref = { fields: { ...fields } };
		} else {
			const c = engine(p, x, () => V.checkAt(verb, p));
			tick();
			results.push({
				kind: 'check',
				label: `first law${c.relation ? ` ${c.relation}` : ''}${argText ? ` (${argText})` : ''}, ${orderWords(order)} · ${bulkText}`,
				pass: c.pass,
				lhs: c.lhs,
				rhs: c.rhs,
				residual: c.residual,
				tolerance: c.tolerance,
				order,
				...(c.note ? { note: c.note } : {})
			});
			ref = { value: c.residual, fields: { lhs: c.lhs, rhs: c.rhs, residual: c.residual, ...(c.fields ?? {}) }, order };
		}
	} else {
		const table = buildTable(verb, kind, xKey, xs, orders, orderSweep, pointAt, engine, tick);
		table.label = `${sym} vs ${xKey} · ${bulkText}`;
		const plotted = s.sweep !== undefined || s.sinks.some((k) => k.text === 'plot');
		if (plotted) table.plot = { ...table.plot!, show: true };
		if (plotted && xKey === 'l' && kind === 'scalar' && V.SERIES_VERBS.has(verb) && !sweptIsBulk) {
			const validity = validityHints(orders, (o) => pointAt(xs[0], o));
			if (Object.keys(validity).length) table.plot = { ...table.plot!, validity };
		}
		results.push(table);
		ref = tableRef(table);
	}
	return { results: applySinks(results, s.sinks, verb), ...(ref ? { ref } : {}) };
}

function mainKey(keys: readonly string[]): string {
	return keys.find((k) => k !== 'o' && k !== 'G' && k !== 'tol') ?? 'o';
}

function mainValue(key: string, values: Map<A.KeyValue, Resolved>, kvs: A.KeyValue[]): Scalar | undefined {
	const kv = kvs.find((k) => canonicalKey(k.key) === key);
	const r = kv ? values.get(kv) : undefined;
	return r && !r.many ? r.value : undefined;
}

function allValues(swept: A.KeyValue, b: { values: Map<A.KeyValue, Resolved> }, q: { values: Map<A.KeyValue, Resolved> }): Scalar[] {
	const r = b.values.get(swept) ?? q.values.get(swept)!;
	return r.many ? r.values : [r.value];
}

/** `v` and `rapidity` say the same thing: setting one on a line drops the other from the pad's bulk. */
function setBulkKey(params: Record<string, number | string>, key: string, value: Scalar): void {
	if (key === 'v') delete params.rapidity;
	if (key === 'rapidity') delete params.v;
	params[key] = value;
}
function withKey(base: Record<string, number | string>, key: string, value: Scalar): Record<string, number | string> {
	const p = { ...base };
	setBulkKey(p, key, value);
	return p;
}

/** The quantity keys at one point, each checked against its schema. */
function quantitiesAt(
	kvs: A.KeyValue[],
	values: Map<A.KeyValue, Resolved>,
	rescope: Parameters<typeof resolveValue>[1] | undefined,
	env: LineEnv,
	swept: A.KeyValue | undefined,
	x: Scalar | undefined,
	where: string
): { q: Record<string, number>; words: Record<string, string> } {
	const q: Record<string, number> = {};
	const words: Record<string, string> = {};
	for (const kv of kvs) {
		let v: Scalar;
		if (kv === swept) v = x!;
		else {
			// a quantity written with bulk keys (`l=zh/2`) follows a swept bulk key point by point
			const r = rescope && kv.value.type !== 'number' ? resolveValue(kv.value, rescope, env.limits) : values.get(kv)!;
			v = r.many ? r.values[0]! : r.value;
		}
		const k = canonicalKey(kv.key);
		const c = checkKey(k, v);
		if (!c.ok) throw new LangError(where ? `${c.message} (${where})` : c.message, kv.value.start, kv.value.end);
		if (typeof c.value === 'string') words[k] = c.value;
		else q[k] = c.value as number;
	}
	return { q, words };
}

function keyError(keys: A.KeyValue[], c: { key?: string; message: string; hint?: string }, fallback: A.Span, where: string): LangError {
	const kv = findKey(keys, c.key);
	const span = kv ? (c.message.startsWith('key ') ? kv.keySpan : kv.value) : fallback;
	const msg = `${c.message}${kv ? '' : " in the pad's bulk"}${where ? ` (${where})` : ''}`;
	return new LangError(msg, span.start, span.end, c.hint ? { hint: c.hint } : {});
}

function argsOf(q: Record<string, number>): Record<string, number> {
	const out: Record<string, number> = {};
	for (const [k, v] of Object.entries(q)) if (k !== 'G' && k !== 'tol') out[k] = v;
	return out;
}
