/**
 * Copy/download formats for a step's table: CSV for scripts and a LaTeX tabular for notes. Figures (SVG, PNG,
 * PDF, pgfplots) are made in src/lib/client/figure/.
 */
import type { TableResult } from '$lib/lang/result';
import { columnTitle, exactNumber } from './format';

function csvCell(v: string): string {
	return /[",\n\r]/.test(v) ? `"${v.replace(/"/g, '""')}"` : v;
}

/** RFC 4180 CSV with a header row; numbers at full precision. */
export function toCsv(t: Pick<TableResult, 'columns' | 'rows'>): string {
	const lines = [t.columns.map(csvCell).join(',')];
	for (const row of t.rows) lines.push(row.map((v) => csvCell(exactNumber(v))).join(','));
	return lines.join('\r\n') + '\r\n';
}

const TEX_SPECIAL: Record<string, string> = {
	'\\': '\\textbackslash{}',
	'&': '\\&',
	'%': '\\%',
	$: '\\$',
	'#': '\\#',
	_: '\\_',
	'{': '\\{',
	'}': '\\}',
	'~': '\\textasciitilde{}',
	'^': '\\textasciicircum{}'
};
export function escapeTex(s: string): string {
	return s.replace(/[\\&%$#_{}~^]/g, (c) => TEX_SPECIAL[c]!);
}

/** A number as LaTeX: mantissa \times 10^{e} for exponent forms. */
export function texNumber(x: number | string | null, digits = 8): string {
	if (x === null) return '--';
	if (typeof x === 'string') return escapeTex(x);
	if (!Number.isFinite(x)) return Number.isNaN(x) ? '\\text{NaN}' : x > 0 ? '\\infty' : '-\\infty';
	const a = Math.abs(x);
	const s = a !== 0 && (a < 1e-4 || a >= 1e6) ? x.toExponential(digits - 1).replace(/\.?0+e/, 'e') : String(Number(x.toPrecision(digits)));
	const m = /^(-?[\d.]+)e([+-]\d+)$/.exec(s);
	return m ? `${m[1]}\\times 10^{${Number(m[2])}}` : s;
}

/** A booktabs-free tabular (compiles with plain LaTeX), numbers in math mode. */
export function toLatexTable(t: Pick<TableResult, 'columns' | 'rows' | 'label'>): string {
	const spec = 'r'.repeat(t.columns.length);
	const head = t.columns.map((c) => escapeTex(columnTitle(c))).join(' & ');
	const body = t.rows.map((r) => '  ' + r.map((v) => (typeof v === 'number' ? `$${texNumber(v)}$` : texNumber(v))).join(' & ') + ' \\\\');
	return [
		`% ${escapeTex(t.label)} (Bulkpad)`,
		`\\begin{tabular}{${spec}}`,
		'  \\hline',
		`  ${head} \\\\`,
		'  \\hline',
		...body,
		'  \\hline',
		'\\end{tabular}'
	].join('\n');
}
