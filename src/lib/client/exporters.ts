/**
 * Copy/download formats for a step's table: CSV for scripts, a LaTeX tabular for notes, and a pgfplots
 * snippet that draws the same figure as the plot in a paper.
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

export interface PgfOptions {
	x: string;
	logX?: boolean;
	logY?: boolean;
	ylabel?: string;
	/** l_max per column: drawn as a shaded band like the on-screen plot */
	validity?: Record<string, number>;
}

/** Line styles per column, matching the screen: exact solid, orders dashed. */
function pgfStyle(col: string, i: number): string {
	if (col === 'exact') return 'thick, solid, color=bulkteal';
	const dashes = ['densely dashed', 'dashed', 'dashdotted', 'densely dotted', 'loosely dashed', 'dotted'];
	return `${dashes[i % dashes.length]}, color=horizon!${Math.max(40, 100 - 12 * i)}!black`;
}

/** A standalone tikzpicture with pgfplots: one \addplot per numeric column, legend, optional log axes. */
export function toPgfplots(t: Pick<TableResult, 'columns' | 'rows' | 'label'>, o: PgfOptions): string {
	const xi = Math.max(0, t.columns.indexOf(o.x));
	const cols = t.columns.map((c, i) => ({ c, i })).filter(({ i }) => i !== xi);
	const ok = (x: unknown, log?: boolean): x is number => typeof x === 'number' && Number.isFinite(x) && (!log || x > 0);
	const axis = [
		`xlabel={$${escapeTex(o.x)}$}`,
		`ylabel={${escapeTex(o.ylabel ?? t.label)}}`,
		o.logX ? 'xmode=log' : null,
		o.logY ? 'ymode=log' : null,
		'legend pos=outer north east',
		'width=0.7\\linewidth',
		'grid=major'
	].filter(Boolean);
	const out = [
		`% ${escapeTex(t.label)} (Bulkpad) -- needs \\usepackage{pgfplots}`,
		'\\definecolor{bulkteal}{HTML}{1E7470}',
		'\\definecolor{horizon}{HTML}{C9731F}',
		'\\begin{tikzpicture}',
		`\\begin{axis}[${axis.join(', ')}]`
	];
	const legend: string[] = [];
	let k = 0;
	for (const { c, i } of cols) {
		const pts = t.rows.filter((r) => ok(r[xi], o.logX) && ok(r[i], o.logY)).map((r) => `(${exactNumber(r[xi])},${exactNumber(r[i])})`);
		if (!pts.length) continue;
		out.push(`\\addplot[${pgfStyle(c, k++)}] coordinates {`);
		for (let j = 0; j < pts.length; j += 6) out.push('  ' + pts.slice(j, j + 6).join(' '));
		out.push('};');
		legend.push(escapeTex(columnTitle(c)));
	}
	// the validity region: shaded up to each order's l_max, with a dashed edge (same as the screen)
	for (const [c, lmax] of Object.entries(o.validity ?? {})) {
		if (!Number.isFinite(lmax) || (o.logX && lmax <= 0)) continue;
		const at = `{axis cs:${lmax},1}`;
		out.push(`\\fill[horizon, opacity=0.07] ({rel axis cs:0,0}) rectangle (${at}|-{rel axis cs:0,1});`);
		out.push(
			`\\draw[horizon, densely dashed] (${at}|-{rel axis cs:0,0}) -- (${at}|-{rel axis cs:0,1}) node[pos=0.95, anchor=east, font=\\tiny] {${escapeTex(columnTitle(c))}};`
		);
	}
	out.push(`\\legend{${legend.join(', ')}}`, '\\end{axis}', '\\end{tikzpicture}');
	return out.join('\n');
}
