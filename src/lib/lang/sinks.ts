/**
 * Sinks (`| table`, `| plot`, `| tex`, `| csv`) reshape a statement's results: a scalar or record becomes a
 * one-row table when a table, plot or CSV is asked; `| tex` makes sure every result carries LaTeX (a table
 * gets a KaTeX `array`); `| csv` marks the table for download.
 */
import type * as A from './ast';
import { orderName, texField, texNumber } from './format';
import type { Result, TableResult } from './result';

export function applySinks(results: Result[], sinks: A.Word[], name: string): Result[] {
	if (sinks.length === 0) return results;
	const want = new Set(sinks.map((s) => s.text));
	const asTable = want.has('table') || want.has('plot') || want.has('csv');
	return results.map((r) => {
		let out: Result = asTable ? toTable(r) : r;
		if (out.kind === 'table') {
			if (want.has('plot')) out = { ...out, plot: { ...(out.plot ?? { x: out.columns[0]! }), show: true } };
			if (want.has('csv')) out = { ...out, download: { format: 'csv', filename: `${name}.csv` } };
			if (want.has('tex')) out = { ...out, latex: tableLatex(out) };
		}
		return out;
	});
}

function toTable(r: Result): Result {
	switch (r.kind) {
		case 'scalar': {
			const args = Object.entries(r.fields ?? {});
			return withWarning(
				{
					kind: 'table',
					label: r.label,
					columns: [...args.map(([k]) => k), orderName(r.order)],
					rows: [[...args.map(([, v]) => v), r.value]],
					plot: { x: args[0]?.[0] ?? orderName(r.order) }
				},
				r.warning
			);
		}
		case 'record':
			return withWarning({ kind: 'table', label: r.label, columns: Object.keys(r.fields), rows: [Object.values(r.fields)] }, r.warning);
		case 'series':
			return { kind: 'table', label: r.label, columns: ['k', 'coeff'], rows: r.terms.map((t) => [t.k, t.coeff]), plot: { x: 'k' } };
		case 'check':
			return {
				kind: 'table',
				label: r.label,
				columns: ['lhs', 'rhs', 'residual', 'tolerance', 'pass'],
				rows: [[r.lhs, r.rhs, r.residual, r.tolerance, r.pass ? 'yes' : 'no']]
			};
		default:
			return r;
	}
}

function withWarning(t: TableResult, w: string | undefined): TableResult {
	return w ? { ...t, warning: w } : t;
}

/** A KaTeX `array` (KaTeX has no `tabular`). */
export function tableLatex(t: TableResult): string {
	const head = t.columns.map((c) => (/^o\d+$/.test(c) ? `n=${c.slice(1)}` : texField(c === 'o' ? 'o' : c))).join(' & ');
	const body = t.rows.map((row) =>
		row.map((v) => (typeof v === 'number' ? texNumber(v, 8) : v === null ? '' : `\\text{${v}}`)).join(' & ')
	);
	const spec = `c|${'c'.repeat(Math.max(0, t.columns.length - 1))}`;
	return `\\begin{array}{${spec}}\n${head} \\\\ \\hline\n${body.join(' \\\\\n')}\n\\end{array}`;
}
