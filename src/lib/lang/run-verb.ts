/**
 * One verb statement, for every verb alike: sort and evaluate its keys, walk its points (swept values ×
 * orders), ask the verb's module (./verbs/) at each, and shape the answer as API.md says — one scalar (or
 * record, series, check) for one point and one order, otherwise a table whose first column is the swept key
 * and whose other columns are the orders (o1, o2, …, exact). Nothing here is specific to one verb: what
 * differs between verbs is data on their registry entry (kind, flags, symbol).
 */
import type * as A from './ast';
import { engine } from './engine';
import { type LineEnv, type StatementOut, findKey, withEngine } from './env';
import { LangError } from './errors';
import { describeBulk, orderWords, shortNumber, texRecord, texScalar } from './format';
import { readOrders, resolveKeys, sortKeys } from './keys';
import { limitError } from './limits';
import type { Order, Result, StepRef } from './result';
import { checkBulk, checkKey } from './schema';
import { applySinks } from './sinks';
import { buildTable, seriesLatex, tableRef, validityHints } from './tables';
import { coefficientList } from './coeff-list';
import { type Resolved, type Scalar, resolveValue } from './values';
import type { Point, VerbSpec } from './verbs/index';
import type { PointCarry } from './verbs/types';
import { verbSpec } from './verbs/index';
import { DEFAULT_VALIDITY_TOL } from './verbs/validity';
import { type BulkName, canonicalKey } from './vocab';

/** Asks the engine at a point; engine errors point at the line's characters (env.ts). */
export type EngineCall = <T>(x: Scalar | undefined, f: () => T) => T;

export function runVerb(s: A.VerbStmt, env: LineEnv): StatementOut {
	const spec = verbSpec(s.verb.text);
	if (!spec) throw new LangError(`unknown verb '${s.verb.text}'`, s.verb.start, s.verb.end);
	const verb = spec.name;
	const bulkName = env.bulk.name as BulkName;
	const verbSpan: A.Span = s.verb;
	const sorted = sortKeys(spec, s.subject, s.keys, bulkName, verbSpan);

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

	if (spec.wholeOrder && orders.includes('exact')) {
		const span = sorted.orderKey?.value ?? verbSpan;
		throw new LangError(`${verb} needs a whole order, e.g. o=4`, span.start, span.end);
	}
	if (spec.kind === 'series' && (orders.length > 1 || swept)) {
		const span = swept?.value ?? sorted.orderKey!.value;
		throw new LangError(`${verb} shows one series: give one value of each key`, span.start, span.end);
	}
	if (spec.kind === 'table' && (orders.length > 1 || swept || s.sweep)) {
		const span = swept?.value ?? sorted.orderKey?.value ?? verbSpan;
		throw new LangError(`${verb} shows one surface: give one value of each key`, span.start, span.end);
	}
	// a record or check verb with several orders and nothing else swept sweeps the order itself
	let xKey = swept ? canonicalKey(swept.key) : mainKey(sorted.form.keys);
	let xs: (Scalar | undefined)[] = swept ? allValues(swept, bres, qres) : [mainValue(xKey, qres.values, sorted.quantityKeys)];
	let orderSweep = false;
	if ((spec.kind === 'record' || spec.kind === 'check') && orders.length > 1) {
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
	const whereAt = (x: Scalar | undefined): string =>
		swept && x !== undefined ? `at ${swept.key}=${typeof x === 'number' ? shortNumber(x) : x}` : '';
	// the point's place is formatted only when an engine error needs it (it was ~6 % of a 2000-point sweep)
	const call: EngineCall = (x, f) => {
		try {
			return f();
		} catch (e) {
			return withEngine(s.keys, verbSpan, whereAt(x), () => {
				throw e;
			});
		}
	};

	// the bulk, G and the quantity keys that do not move are built once per line, not once per point
	const fixed = sweptIsBulk ? undefined : bulkAt(bulkName, base, s.keys, verbSpan, '', spec, env);
	const fixedQ = sweptIsBulk ? undefined : quantitiesAt(sorted.quantityKeys, qres.values, undefined, env, swept, '');
	// a swept line walks its points in order: each order column hands its last answer's start to the next point
	const carries = new Map<Order, PointCarry>();
	const carryOf = (order: Order): PointCarry | undefined => {
		if (!swept) return undefined;
		let c = carries.get(order);
		if (!c) carries.set(order, (c = {}));
		return c;
	};
	const validityTol = env.ctx.validityTol ?? DEFAULT_VALIDITY_TOL;
	const pointAt = (x: Scalar | undefined, order: Order): Point => {
		const where = (): string => whereAt(x);
		const b = fixed ?? bulkAt(bulkName, withKey(base, swept!.key, x!), s.keys, verbSpan, where(), spec, env);
		let qw: { q: Record<string, number>; words: Record<string, string> };
		if (fixedQ && swept && x !== undefined) {
			qw = { q: { ...fixedQ.q }, words: { ...fixedQ.words } };
			setQuantity(qw, swept, x, where);
		} else qw = fixedQ ?? quantitiesAt(sorted.quantityKeys, qres.values, { ...qscope, bulk: b.checked }, env, swept, where(), x);
		const carry = carryOf(order);
		return {
			holo: engine,
			bulk: b.bulk,
			q: qw.q,
			words: qw.words,
			order,
			shape: sorted.shape,
			G: qw.q.G ?? b.G,
			validityTol,
			...(carry ? { carry } : {})
		};
	};

	const shown = { ...base };
	if (sweptIsBulk) delete shown[swept!.key]; // the table's first column shows it
	const bulkText = describeBulk({ name: bulkName, params: shown });
	const sym = spec.tableSymbol?.(bulkName, base) ?? spec.symbol.text;
	const results: Result[] = [];
	let ref: StepRef | undefined;

	if (spec.kind === 'series') {
		const p = pointAt(xs[0], orders[0]!);
		const st = call(undefined, () => spec.at(p));
		tick();
		const n = orders[0] as number;
		const list = coefficientList(st, { name: bulkName, params: base });
		results.push({
			kind: 'series',
			label: `ΔA series to order ${n} · ${bulkText}`,
			terms: st.terms,
			latex: seriesLatex(st),
			list: list.latex,
			text: list.text,
			order: n
		});
		ref = { fields: Object.fromEntries(st.terms.map((t) => [`a${t.k}`, t.coeff])), order: n };
	} else if (spec.kind === 'table') {
		const p = call(xs[0], () => pointAt(xs[0], orders[0]!));
		const tab = call(xs[0], () => spec.at(p));
		tick();
		const argText = Object.entries(argsOf(p.q))
			.map(([k, v]) => `${k}=${shortNumber(v)}`)
			.join(' ');
		const x = tab.x ?? tab.columns[0]!;
		// "z, v vs x · profile (l=2 t=1) · bulk": what is plotted comes first, as the figures' axis label reads it
		const plotted = tab.columns.filter((c) => c !== x).join(', ');
		results.push({
			kind: 'table',
			label: `${plotted} vs ${x} · ${sym}${argText ? ` (${argText})` : ''} · ${bulkText}`,
			columns: tab.columns,
			rows: tab.rows,
			plot: { x, show: true },
			...(tab.note ? { note: tab.note } : {})
		});
		ref = { fields: { ...(tab.fields ?? {}) } };
	} else if (!s.sweep && !orderSweep && xs.length === 1 && orders.length === 1) {
		const out = onePoint(
			spec,
			call(xs[0], () => pointAt(xs[0], orders[0]!)),
			xs[0],
			call,
			sym,
			bulkText
		);
		tick();
		results.push(out.result);
		ref = out.ref;
	} else {
		const table = buildTable(spec, xKey, xs, orders, orderSweep, (x, o) => call(x, () => pointAt(x, o)), call, tick);
		table.label = `${sym} vs ${xKey} · ${bulkText}`;
		const plotted = s.sweep !== undefined || s.sinks.some((k) => k.text === 'plot');
		if (plotted) table.plot = { ...table.plot!, show: true };
		if (plotted && xKey === 'l' && spec.kind === 'scalar' && spec.series && !sweptIsBulk) {
			const validity = validityHints(orders, (o) => call(xs[0], () => pointAt(xs[0], o)));
			if (Object.keys(validity).length) table.plot = { ...table.plot!, validity, tol: validityTol };
		}
		if (plotted && spec.guides && !orderSweep && xs.every((x) => typeof x === 'number')) {
			const guides = call(xs[0], () => spec.guides!(pointAt(xs[0], orders[0]!), xKey, xs as number[]));
			if (guides?.length) table.plot = { ...table.plot!, guides };
		}
		results.push(table);
		ref = tableRef(table);
	}
	return { results: applySinks(results, s.sinks, verb), ...(ref ? { ref } : {}) };
}

/** One point, one order: the verb's answer as a scalar, record or check result, and what `#n` exposes. */
function onePoint(
	spec: Exclude<VerbSpec, { kind: 'series' | 'table' }>,
	p: Point,
	x: Scalar | undefined,
	call: EngineCall,
	sym: string,
	bulkText: string
): { result: Result; ref: StepRef } {
	const args = argsOf(p.q);
	const argText = Object.entries(args)
		.map(([k, v]) => `${k}=${shortNumber(v)}`)
		.join(' ');
	const order = p.order;
	if (spec.kind === 'scalar') {
		const { value, warning, fields: extra, symbol, tag, note: verbNote, pointNote } = call(x, () => spec.at(p));
		const note = [verbNote, pointNote].filter(Boolean).join('. ');
		const fields = { ...args, ...(extra ?? {}) };
		return {
			result: {
				kind: 'scalar',
				label: `${symbol ?? sym}${tag ?? ''}${argText ? `${tag ? ' ' : ''}(${argText})` : ''}, ${orderWords(order)} · ${bulkText}`,
				value,
				order,
				latex: texScalar(spec.symbol.tex || spec.name, args, order, value),
				fields,
				...(warning ? { warning } : {}),
				...(note ? { note } : {})
			},
			ref: { value, fields: { ...fields }, order }
		};
	}
	if (spec.kind === 'record') {
		const { fields, note } = call(x, () => spec.at(p));
		return {
			result: {
				kind: 'record',
				label: `${sym}${argText ? `(${argText})` : ''} · ${bulkText}`,
				fields,
				latex: texRecord(fields),
				...(note ? { note } : {})
			},
			ref: { fields: { ...fields } }
		};
	}
	const c = call(x, () => spec.at(p));
	return {
		result: {
			kind: 'check',
			label: `${sym}${c.relation ? ` ${c.relation}` : ''}${argText ? ` (${argText})` : ''}, ${orderWords(order)} · ${bulkText}`,
			pass: c.pass,
			lhs: c.lhs,
			rhs: c.rhs,
			residual: c.residual,
			tolerance: c.tolerance,
			order,
			...(c.note ? { note: c.note } : {})
		},
		ref: { value: c.residual, fields: { lhs: c.lhs, rhs: c.rhs, residual: c.residual, ...(c.fields ?? {}) }, order }
	};
}

/** The line's bulk at one set of bulk keys: checked against its schema, built, and G for the verb. */
function bulkAt(
	name: BulkName,
	params: Record<string, number | string>,
	keys: A.KeyValue[],
	verbSpan: A.Span,
	where: string,
	spec: VerbSpec,
	env: LineEnv
): { checked: Record<string, number | string>; bulk: Point['bulk']; G: number } {
	const checked = checkBulk(name, params);
	if (!checked.ok) throw keyError(keys, checked, verbSpan, where);
	return withEngine(keys, verbSpan, where, () => {
		const bulk = bulkOf(name, checked.value);
		return { checked: checked.value, bulk, G: spec.usesG ? engine.newtonG(env.units, bulk.d) : 1 };
	});
}

/**
 * Bulks by name and checked keys, kept across lines. The engine keys its prepared slice and the strip's node
 * tables by the bulk object, so a new bulk per line rebuilt them every time: about two thirds of a light line's
 * 300 µs went there (`darea l=0.5`, measured in-process) for 6 µs of physics. A bulk is never changed after it is
 * made, so sharing it changes no answer. Metric bulks (user formulas) are left out, and the map stays small: 16
 * bulks with the tables of wide sweeps (l = 0.01…80) held 3.2 MB, so 64 stay well inside a process's heap.
 */
const bulks = new Map<string, Point['bulk']>();
const BULKS_KEPT = 64;
function bulkOf(name: BulkName, params: Record<string, number | string>): Point['bulk'] {
	if (name === 'metric') return engine.makeBulk(name, params);
	const key = `${name}:${JSON.stringify(params)}`;
	let b = bulks.get(key);
	if (!b) {
		b = engine.makeBulk(name, params);
		if (bulks.size >= BULKS_KEPT) bulks.delete(bulks.keys().next().value!);
		bulks.set(key, b);
	}
	return b;
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

type Quantities = { q: Record<string, number>; words: Record<string, string> };

/** One quantity key's value checked against its schema and put in its place. */
function setQuantity(out: Quantities, kv: A.KeyValue, v: Scalar, whereAt: string | (() => string)): void {
	const k = canonicalKey(kv.key);
	const c = checkKey(k, v);
	if (!c.ok) {
		const where = typeof whereAt === 'string' ? whereAt : whereAt();
		throw new LangError(where ? `${c.message} (${where})` : c.message, kv.value.start, kv.value.end);
	}
	if (typeof c.value === 'string') out.words[k] = c.value;
	else out.q[k] = c.value as number;
}

/**
 * The quantity keys at one point, each checked against its schema. With `rescope` (a swept bulk key), a
 * quantity written with bulk keys (`l=zh/2`) follows the swept key point by point.
 */
function quantitiesAt(
	kvs: A.KeyValue[],
	values: Map<A.KeyValue, Resolved>,
	rescope: Parameters<typeof resolveValue>[1] | undefined,
	env: LineEnv,
	swept: A.KeyValue | undefined,
	where: string,
	x?: Scalar
): Quantities {
	const out: Quantities = { q: {}, words: {} };
	for (const kv of kvs) {
		if (kv === swept) {
			if (x !== undefined) setQuantity(out, kv, x, where);
			continue;
		}
		const r = rescope && kv.value.type !== 'number' ? resolveValue(kv.value, rescope, env.limits) : values.get(kv)!;
		setQuantity(out, kv, r.many ? r.values[0]! : r.value, where);
	}
	return out;
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
