/**
 * Shapes of a verb's answer beyond one number: the table of a sweep (first column the swept key, then one
 * column per order, or a record's fields), what `#n` of a one-row table exposes, the plot's validity hints
 * and the LaTeX of a series.
 */
import { LangError } from './errors';
import { isHoloError } from './engine';
import { orderName } from './format';
import type { Order, StepRef, TableResult } from './result';
import type { EngineCall } from './run-verb';
import type { Scalar } from './values';
import type { Point, SeriesTerms, VerbSpec } from './verbs/index';

export function buildTable(
	spec: Exclude<VerbSpec, { kind: 'series' | 'table' }>,
	xKey: string,
	xs: (Scalar | undefined)[],
	orders: Order[],
	orderSweep: boolean,
	pointAt: (x: Scalar | undefined, o: Order) => Point,
	call: EngineCall,
	tick: () => void
): TableResult {
	const rows: (number | string | null)[][] = [];
	let columns: string[];
	const warnings = new Map<Order, { at: number; text: string }>();
	let note: string | undefined;
	// soliton strips: which surface each row is (1 connected, 0 disconnected), as a last column
	const phaseOf = new Map<unknown[], number>();
	if (spec.kind === 'scalar') {
		// a value never shown without its error estimate (resum): each order column gets an `_err` column
		const errorField = spec.errorField;
		columns = [xKey, ...orders.flatMap((o) => (errorField ? [orderName(o), `${orderName(o)}_err`] : [orderName(o)]))];
		for (const x of xs) {
			const row: (number | string | null)[] = [x ?? null];
			for (const o of orders) {
				const p = pointAt(x, o);
				const { value, warning: w, fields, note: n } = call(x, () => spec.at(p));
				note ??= n;
				row.push(value);
				if (errorField) row.push(fields?.[errorField] ?? null);
				if (fields?.connected !== undefined) phaseOf.set(row, fields.connected);
				const at = p.q.l ?? p.q.R ?? 0;
				if (w && (warnings.get(o)?.at ?? -Infinity) < at) warnings.set(o, { at, text: w });
				tick();
			}
			rows.push(row);
		}
	} else {
		columns = [xKey];
		const points = orderSweep ? orders.map((o) => [o, o] as const) : xs.map((x) => [x, orders[0]!] as const);
		for (const [x, o] of points) {
			const p = pointAt(orderSweep ? undefined : x, o);
			let fields: Record<string, number>;
			if (spec.kind === 'record') fields = call(x, () => spec.at(p)).fields;
			else {
				const c = call(x, () => spec.at(p));
				fields = { lhs: c.lhs, rhs: c.rhs, residual: c.residual, pass: c.pass ? 1 : 0 };
			}
			if (columns.length === 1) columns.push(...Object.keys(fields));
			rows.push([x ?? null, ...columns.slice(1).map((c) => fields[c] ?? null)]);
			tick();
		}
	}
	if (phaseOf.size) {
		columns.push('connected');
		for (const r of rows) r.push(phaseOf.get(r) ?? null);
	}
	const table: TableResult = { kind: 'table', label: '', columns, rows, plot: { x: xKey } };
	if (warnings.size) table.warning = mergeWarnings(warnings);
	if (note) table.note = note;
	return table;
}

/**
 * One line per distinct warning: orders whose warnings differ only in the order's number (past the radius
 * of convergence, every truncation says the same) are named together instead of repeating the sentence.
 */
function mergeWarnings(warnings: Map<Order, { text: string }>): string {
	const groups = new Map<string, Order[]>();
	for (const [o, w] of warnings) {
		const generic = typeof o === 'number' ? w.text.replace(`an order-${o} truncation`, 'a truncation') : w.text;
		groups.set(generic, [...(groups.get(generic) ?? []), o]);
	}
	return [...groups].map(([text, os]) => `${os.map(orderName).join(', ')}: ${text}`).join('; ');
}

/** A table's `#n`: a one-row table exposes its cells; the value is the last column (exact, or the highest order). */
export function tableRef(t: TableResult): StepRef | undefined {
	if (t.rows.length !== 1) return { fields: {} };
	const row = t.rows[0]!;
	const fields: Record<string, number> = {};
	t.columns.forEach((c, i) => {
		const v = row[i];
		if (typeof v === 'number') fields[c] = v;
	});
	const last = row[row.length - 1];
	const lastCol = t.columns[t.columns.length - 1]!;
	const order: Order | undefined = lastCol === 'exact' ? 'exact' : /^o\d+$/.test(lastCol) ? Number(lastCol.slice(1)) : undefined;
	return { ...(typeof last === 'number' ? { value: last } : {}), fields, ...(order !== undefined ? { order } : {}) };
}

/** ΔA = ℓ^{2−d} Σ a_k (ℓ/z_h)^{kd}, PHYSICS.md's form of the series (each term at its own power of ℓ/scale). */
export function seriesLatex(st: SeriesTerms): string {
	const d = st.d;
	const unit = (k: number) => (st.scale === '1' ? `\\ell^{${k}}` : `\\left(\\frac{\\ell}{${st.scale}}\\right)^{${k}}`);
	const terms = st.terms.map((t) => `\\left(${t.latex}\\right)${unit(t.power)}`);
	const pre = d === 2 ? '' : `\\ell^{${2 - d}}`;
	return `\\Delta A = ${pre}\\Big[${terms.join(' + ') || '0'}\\Big]`;
}

/**
 * The largest l where each order column stays within the pad's validity tolerance of the exact value, for the plot
 * to shade. A hint only: an order the engine cannot bound is left unshaded rather than failing the line.
 */
export function validityHints(orders: Order[], pointOf: (o: Order) => Point): Record<string, number> {
	const out: Record<string, number> = {};
	for (const o of orders) {
		if (o === 'exact' || o < 1) continue;
		try {
			const p = pointOf(o);
			if (!p.bulk.series) continue;
			const r = p.holo.validity(p.bulk, o, p.validityTol);
			if (Number.isFinite(r.l_max)) out[orderName(o)] = r.l_max;
		} catch (e) {
			if (e instanceof LangError || isHoloError(e)) continue;
			throw e;
		}
	}
	return out;
}
