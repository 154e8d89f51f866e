import type { PadDocument } from './schema';
import { latexNumber, orderText } from './numbers';
import { bulkText } from './markdown';
import { MAX_MATH_LENGTH, safeMath } from './safe-math';

export { safeMath };

type Result = NonNullable<PadDocument['steps'][number]['results']>[number];

/** pdfLaTeX's inputenc knows Latin accents but not these; everything else outside Latin-1 becomes `?`. */
const UNICODE: Record<string, string> = {
	Δ: '$\\Delta$',
	δ: '$\\delta$',
	Γ: '$\\Gamma$',
	γ: '$\\gamma$',
	μ: '$\\mu$',
	π: '$\\pi$',
	Σ: '$\\Sigma$',
	σ: '$\\sigma$',
	α: '$\\alpha$',
	β: '$\\beta$',
	ε: '$\\epsilon$',
	ζ: '$\\zeta$',
	θ: '$\\theta$',
	λ: '$\\lambda$',
	ν: '$\\nu$',
	ρ: '$\\rho$',
	τ: '$\\tau$',
	φ: '$\\phi$',
	χ: '$\\chi$',
	ψ: '$\\psi$',
	ω: '$\\omega$',
	Ω: '$\\Omega$',
	ℓ: '$\\ell$',
	'∞': '$\\infty$',
	'≈': '$\\approx$',
	'≤': '$\\leq$',
	'≥': '$\\geq$',
	'≠': '$\\neq$',
	'±': '$\\pm$',
	'×': '$\\times$',
	'·': '$\\cdot$',
	'−': '$-$',
	'→': '$\\to$',
	'∂': '$\\partial$',
	'√': '$\\surd$',
	'∴': '$\\therefore$',
	'²': '$^2$',
	'³': '$^3$',
	'⁴': '$^4$',
	'₀': '$_0$',
	'₁': '$_1$',
	'₂': '$_2$',
	'₃': '$_3$',
	'—': '---',
	'–': '--',
	'…': '\\ldots{}',
	'‘': '`',
	'’': "'",
	'“': '``',
	'”': "''",
	'⚠': '(!)',
	'✓': '(ok)'
};

const SPECIAL: Record<string, string> = {
	'\\': '\\textbackslash{}',
	'{': '\\{',
	'}': '\\}',
	$: '\\$',
	'&': '\\&',
	'#': '\\#',
	'^': '\\^{}',
	_: '\\_',
	'%': '\\%',
	'~': '\\textasciitilde{}',
	'<': '\\textless{}',
	'>': '\\textgreater{}',
	'|': '\\textbar{}'
};

/** Any text into LaTeX text mode: specials escaped, known Unicode mapped, the rest replaced. */
export function texText(s: string): string {
	let out = '';
	for (const ch of s.replace(/\r?\n/g, ' ')) {
		if (ch in SPECIAL) out += SPECIAL[ch];
		else if (ch in UNICODE) out += UNICODE[ch];
		else if (ch.codePointAt(0)! < 0x20 || (ch.codePointAt(0)! >= 0x7f && ch.codePointAt(0)! < 0xa0)) out += ' ';
		else if (ch.codePointAt(0)! <= 0xff) out += ch;
		else out += '?';
	}
	return out;
}

/**
 * Verbatim lines may not end their own environment (LaTeX ends it at the exact text `\end{verbatim}`, so a
 * space breaks the match); control characters and non-Latin-1 characters cannot pass through pdfLaTeX.
 * Inside verbatim every special character, `^` included, is plain text, so nothing else can run.
 */
function verbatimLine(s: string): string {
	return s
		.replace(/\r?\n/g, ' ')
		.replace(/\\end\s*\{verbatim\}/g, '\\end {verbatim}')
		.replace(/[^\x20-\x7e\xa0-\xff]/gu, '?');
}

function display(latex: string | undefined): string[] {
	if (!latex) return [];
	const safe = safeMath(latex);
	return safe ? ['\\[', safe, '\\]'] : [`\\texttt{${texText(latex)}}`];
}

const n = (v: unknown) => `$${latexNumber(v)}$`;
const warnLine = (w?: string) => (w ? [`\\\\\\textit{Warning: ${texText(w)}}`] : []);

/**
 * Tables as a booktabs longtable: it breaks across pages and repeats its header on each (a sweep of 80 rows
 * would otherwise run off one page). The preamble falls back to \hline rules where booktabs is missing.
 */
function tabular(columns: string[], rows: (number | string | null)[][]): string[] {
	const spec = columns.map(() => 'r').join('');
	const head = columns.map(texText).join(' & ') + ' \\\\';
	const out = [
		'{\\small',
		`\\begin{longtable}{${spec}}`,
		'\\toprule',
		head,
		'\\midrule',
		'\\endfirsthead',
		`\\multicolumn{${columns.length}}{r}{\\footnotesize (continued)} \\\\`,
		'\\toprule',
		head,
		'\\midrule',
		'\\endhead',
		'\\bottomrule',
		'\\endlastfoot'
	];
	for (const row of rows)
		out.push(
			row
				.slice(0, columns.length)
				.map((v) => (typeof v === 'string' ? texText(v) : n(v)))
				.join(' & ') + ' \\\\'
		);
	out.push('\\end{longtable}', '}');
	return out;
}

/** Rows of a displayed coefficient: a row much wider than this (in LaTeX characters) runs off the page. */
const ROW_CHARS = 150;
/** A row TeX cannot set at all ("Dimension too large" past ~5.7 m): such a coefficient is given by its value. */
const MAX_ROW_CHARS = 4000;

/**
 * One aligned line of a coefficient list cut into rows at its top-level + and − (brace depth 0), continuing
 * under the relation. \left/\right become \bigl/\bigr first: a stretchy pair must close on its own row, a fixed
 * size pair need not, so the sums inside a bracket can break too. Null when a row would still be too wide.
 */
export function breakRows(line: string, width = ROW_CHARS): string[] | null {
	if (line.length <= width) return [line];
	const s = line.replace(/\\left(?![A-Za-z])/g, '\\bigl').replace(/\\right(?![A-Za-z])/g, '\\bigr');
	const rows: string[] = [];
	let depth = 0;
	let from = 0;
	let last = -1; // the latest place a row may end (the space before a top-level sign)
	const cutAtLast = (end: number) => {
		if (end - from > width && last > from) {
			rows.push(s.slice(from, last));
			from = last + 1;
		}
	};
	for (let i = 0; i < s.length; i++) {
		const ch = s[i];
		if (ch === '\\')
			i++; // an escaped brace or a control word's first letter: never a break or a group
		else if (ch === '{') depth++;
		else if (ch === '}') depth--;
		else if (depth === 0 && ch === ' ' && (s[i + 1] === '+' || s[i + 1] === '-') && s[i + 2] === ' ') {
			cutAtLast(i);
			last = i;
		}
	}
	cutAtLast(s.length);
	rows.push(s.slice(from));
	if (rows.some((r) => r.length > MAX_ROW_CHARS)) return null;
	return rows.map((r, k) => (k === 0 ? r : `&\\qquad ${r}`));
}

/**
 * A series for a paper: its coefficient list (the expansion, a_k one per line, the symbols defined) in align*
 * blocks, not the one-line sum — at high orders that sum is far wider than any page (TeX stops at "Dimension too
 * large") and longer than the safe-math cap. Each coefficient is cut into rows (breakRows); one that cannot be
 * is given by its value, saying so. Blocks are cut before they pass the cap.
 */
function seriesDisplay(r: Extract<Result, { kind: 'series' }>): string[] {
	if (!r.list) return display(r.latex);
	const valueRow = (k: number) => {
		const term = r.terms.find((t) => t.k === k);
		return term
			? [
					`a_{${k}} &\\approx ${latexNumber(term.coeff)} \\quad \\text{(exact form not typeset here, too long for one row; it is in the pad's JSON export)}`
				]
			: [];
	};
	const rows = r.list
		.replace(/^\s*\\begin\{aligned\}/, '')
		.replace(/\\end\{aligned\}\s*$/, '')
		.split(/\s*\\\\\s*\n/)
		.map((l) => l.trim())
		.filter(Boolean)
		.flatMap((line) => {
			const k = /^a_\{(\d+)\}/.exec(line)?.[1];
			const cut = breakRows(line);
			if (cut && cut.every((row) => safeMath(row))) return cut;
			return k === undefined ? [] : valueRow(Number(k));
		});
	const out: string[] = [];
	let block: string[] = [];
	let size = 0;
	const flush = () => {
		if (block.length) out.push('\\begin{align*}', block.join(' \\\\\n'), '\\end{align*}');
		block = [];
		size = 0;
	};
	for (const row of rows) {
		if (size + row.length > MAX_MATH_LENGTH) flush();
		block.push(row);
		size += row.length + 4;
	}
	flush();
	return out;
}

function renderResult(r: Result): string[] {
	switch (r.kind) {
		case 'scalar':
			return [
				`\\item \\textbf{${texText(r.label)}} $=$ ${n(r.value)}${r.unit ? ' ' + texText(r.unit) : ''} (${texText(orderText(r.order))})`,
				...warnLine(r.warning),
				...display(r.latex)
			];
		case 'record':
			return [
				`\\item \\textbf{${texText(r.label)}}: ${Object.entries(r.fields)
					.map(([k, v]) => `${texText(k)} $=$ ${n(v)}`)
					.join(', ')}`,
				...warnLine(r.warning),
				...display(r.latex)
			];
		case 'table':
			return [`\\item \\textbf{${texText(r.label)}} (${r.rows.length} rows)`, ...warnLine(r.warning), ...tabular(r.columns, r.rows)];
		case 'series':
			return [`\\item \\textbf{${texText(r.label)}} (series, ${r.terms.length} terms)`, ...warnLine(r.warning), ...seriesDisplay(r)];
		case 'check': {
			const relation = typeof r.relation === 'string' ? [`\\\\relation: ${texText(r.relation)}`] : [];
			const chi = typeof r.chi2dof === 'number' ? `; $\\chi^2/\\mathrm{dof}$ $=$ ${n(r.chi2dof)}, $p$ $=$ ${n(r.pvalue)}` : '';
			return [
				`\\item \\textbf{${texText(r.label)}}: ${r.pass ? 'holds' : 'fails'}; lhs $=$ ${n(r.lhs)}, rhs $=$ ${n(r.rhs)}, residual $=$ ${n(r.residual)} (tolerance ${n(r.tolerance)})${chi}`,
				...relation,
				...warnLine(r.warning)
			];
		}
		case 'figure':
			return [`\\item \\textbf{${texText(r.label)}}: a figure overlaying the tables of steps ${r.steps.map((n) => `\\#${n}`).join(', ')}`];
		case 'note':
			return [`\\item ${texText(r.text)}`];
	}
}

/** A step the paper leaves out: one that failed or was not evaluated, or one the pad hides. */
function leftOut(s: PadDocument['steps'][number]): boolean {
	return s.status !== 'ok' || (s as { hidden?: unknown }).hidden === true;
}

/**
 * The pad as a compilable pdfLaTeX article (longtable and amsmath from the base distribution; booktabs when
 * installed): each evaluated step verbatim, then its results. Failed, unfinished and hidden steps are left
 * out and counted in the opening line; the kept steps keep their numbers, so #n references still read right.
 */
export function renderLatex(doc: PadDocument, meta: { owner?: string; exportedAt?: Date } = {}): string {
	const kept = doc.steps.filter((s) => !leftOut(s));
	const dropped = doc.steps.length - kept.length;
	const out = [
		'% Exported from Bulkpad. Compile with pdflatex.',
		'\\documentclass[11pt]{article}',
		'\\usepackage[T1]{fontenc}',
		'\\usepackage[utf8]{inputenc}',
		'\\usepackage{amsmath,amssymb}',
		// a long coefficient list is one align* of many rows: let it continue on the next page
		'\\allowdisplaybreaks',
		'\\usepackage{longtable}',
		'\\IfFileExists{booktabs.sty}{\\usepackage{booktabs}}{\\newcommand{\\toprule}{\\hline}\\newcommand{\\midrule}{\\hline}\\newcommand{\\bottomrule}{\\hline}}',
		`\\title{${texText(doc.title)}}`,
		`\\author{${texText(meta.owner ?? '')}}`,
		`\\date{${meta.exportedAt ? meta.exportedAt.toISOString().slice(0, 10) : ''}}`,
		'\\begin{document}',
		'\\maketitle',
		`\\noindent Bulkpad pad; bulk now \\texttt{${texText(bulkText(doc.bulk))}}; ${kept.length} steps${dropped ? ` (${dropped} failed or hidden ${dropped === 1 ? 'step' : 'steps'} left out)` : ''}.`
	];
	for (const s of kept) {
		out.push('', `\\subsection*{Step \\#${s.n}}`, '\\begin{verbatim}', verbatimLine(s.input), '\\end{verbatim}');
		const items = (s.results ?? []).flatMap(renderResult);
		if (items.length) out.push('\\begin{itemize}', ...items, '\\end{itemize}');
	}
	out.push('', '\\end{document}', '');
	return out.join('\n');
}
