// The .tex and .md exports of untrusted pads: only allow-listed math compiles, user text is escaped, and
// every formula Bulkpad's own engine writes still passes the allow-list.
import { describe, expect, it } from 'vitest';
import { Pad } from '../lang/pad';
import { hostileFormulas } from '../../helpers/hostile-tex';
import { renderLatex, texText } from '../../../src/lib/server/export/latex';
import { renderMarkdown } from '../../../src/lib/server/export/markdown';
import { safeMath } from '../../../src/lib/server/export/safe-math';
import type { PadDocument } from '../../../src/lib/server/export/schema';

type Results = NonNullable<PadDocument['steps'][number]['results']>;

const doc = (results: Results, extra: Partial<PadDocument> = {}): PadDocument => ({
	format: 'bulkpad-pad',
	version: 1,
	title: 'Hostile',
	bulk: { name: 'brane', params: { d: 4, zh: 1 } },
	units: { system: 'geo', G: 1 },
	steps: [{ n: 1, input: 'darea l=0.3', status: 'ok', results, error: null }],
	...extra
});

const HOSTILE_LATEX = hostileFormulas();

/** Control words the exporter itself writes around formulas and text. */
const DOCUMENT_WORDS = new Set(
	'documentclass usepackage title author date begin end maketitle noindent texttt textbf textit item subsection textbackslash textasciitilde textless textgreater textbar ldots small hline IfFileExists newcommand toprule midrule bottomrule endfirsthead endhead endlastfoot multicolumn footnotesize allowdisplaybreaks'.split(
		' '
	)
);

/** Every control word outside verbatim blocks (their contents are printed, not read as TeX). */
function controlWords(tex: string): Set<string> {
	const outside = tex.replace(/\\begin\{verbatim\}\n[^\n]*\n\\end\{verbatim\}/g, '');
	return new Set([...outside.matchAll(/\\([A-Za-z]+)/g)].map((m) => m[1]));
}

describe('the math allow-list', () => {
	it.each(HOSTILE_LATEX)('refuses %s', (latex) => expect(safeMath(latex)).toBeNull());

	it.each([
		['\\frac{\\sqrt{\\pi}\\,\\Gamma(\\tfrac{1}{4})^2}{32\\pi}'],
		['\\operatorname{sech}^2 x + \\tanh^2 x = 1'],
		['\\begin{array}{r|rr}\n\\ell & o1 & \\mathrm{exact} \\\\ \\hline\n0.1 & 1 & 2\n\\end{array}'],
		['\\left\\{ \\begin{cases} a & b \\\\ c & d \\end{cases} \\right.'],
		['\\Delta A_{\\mathrm{Pad\\acute e}} \\approx 1.5\\times10^{-7}']
	])('keeps %s as it is', (latex) => expect(safeMath(latex)).toBe(latex));

	it('removes blank lines, which would end math mode', () => expect(safeMath('a\n  \n\nb')).toBe('a\nb'));

	// Every formula the engine writes, over each verb and sink, must compile as math (not fall back to text).
	const LINES = [
		'use boosted d=4 zh=1 v=0.6',
		'darea l=0.4 o=1,2,3,exact | tex',
		'coeffs darea o=4 | tex',
		'tent l=0.4 o=3',
		'firstlaw l=0.4 o=3',
		'stress',
		'thermo',
		'energy',
		'use brane d=3 zh=1',
		'coeffs darea o=6 | tex',
		'sweep darea l=0.1..0.5:5 o=1,exact | tex',
		'validity',
		'resum l=0.3',
		'let w = 2',
		'#2 * w / 3 + sqrt(2)',
		'use charged d=4 zh=1 q=0.5',
		'coeffs darea o=4 | tex',
		'use vacuum d=2',
		'mi pair l=1 gap=0.3'
	];
	it('passes every formula the engine writes', () => {
		const pad = new Pad();
		const formulas: string[] = [];
		for (const line of LINES) {
			let results: Results;
			try {
				results = pad.run(line).results as Results;
			} catch {
				continue; // a line this bulk refuses has no formula to check
			}
			for (const r of results) {
				if ('latex' in r && typeof r.latex === 'string') formulas.push(r.latex);
				if (r.kind === 'series') for (const t of r.terms) formulas.push(t.latex);
			}
		}
		expect(formulas.length).toBeGreaterThan(15);
		const refused = formulas.filter((f) => safeMath(f) === null);
		expect(refused, `formulas the allow-list refuses:\n${refused.join('\n')}`).toEqual([]);
	});
});

describe('the .tex export of a hostile pad', () => {
	const results: Results = [
		...HOSTILE_LATEX.map((latex, i) => ({
			kind: 'scalar' as const,
			label: `\\input{/etc/hostname} ${i}`,
			value: 1,
			order: 2,
			latex,
			unit: '\\write18{x}',
			warning: '^^5cinput'
		})),
		{ kind: 'series', label: 's', terms: [{ k: 2, coeff: 1, latex: '\\input{x}' }], latex: HOSTILE_LATEX[4] },
		// a coefficient list whose rows, cut at their signs, would each hide a hostile word or an unbalanced environment
		{
			kind: 'series',
			label: 'list',
			terms: [{ k: 1, coeff: 2, latex: 'x' }],
			latex: 'x',
			list: `\\begin{aligned}\na_{1} &= \\begin{aligned} ${'y + '.repeat(80)}\\input{x} - z \\end{aligned} \\\\\n\\end{itemize}\\write18{x} + ${'w + '.repeat(60)}1\n\\end{aligned}`
		},
		{ kind: 'table', label: 't', columns: ['\\csname', '$x$'], rows: [['\\immediate\\write18{x}', 1, 'extra cell']] },
		{ kind: 'record', label: 'r', fields: { '\\def\\x': 1 }, latex: '\\catcode`\\^=7' },
		{ kind: 'note', text: '\\end{itemize}\\input{/etc/hostname}' }
	];
	const tex = renderLatex(
		doc(results, {
			title: '\\input{/etc/hostname} ^^5c \u0000\u007f\u009b',
			bulk: { name: 'brane', params: { d: 4, x: '\\write18{y}' } },
			steps: [
				{ n: 1, input: 'darea l=0.3 // \\end{verbatim}\\input{/etc/hostname}', status: 'ok', results, error: null },
				{ n: 2, input: 'x', status: 'error', results: null, error: { message: '\\immediate\\write18{z}' } }
			]
		}),
		{ owner: '\\catcode`\\%=11' }
	);

	it('writes no control word beyond the document frame and the math allow-list', () => {
		const words = [...controlWords(tex)].filter(
			(w) => !DOCUMENT_WORDS.has(w) && safeMath(`\\${w}`) === null && !['begin', 'end'].includes(w)
		);
		expect(words).toEqual([]);
	});

	it('prints each refused formula as escaped text', () => {
		for (const latex of HOSTILE_LATEX) expect(tex).toContain(`\\texttt{${texText(latex)}}`);
		expect(tex).not.toMatch(/\^\^/);
		expect(tex.replace(/\\begin\{verbatim\}\n[^\n]*\n\\end\{verbatim\}/g, '')).not.toContain('\\input{');
		expect(tex).toContain('\\begin{verbatim}\ndarea l=0.3 // \\end {verbatim}\\input{/etc/hostname}\n\\end{verbatim}');
		// the failed step (with its hostile message) is left out of the export altogether
		expect(tex.match(/\\end\{verbatim\}/g)).toHaveLength(1);
		expect(tex).not.toContain('write18{z}');
	});

	it('uses only the environments it opened itself', () => {
		const envs = new Set([...tex.matchAll(/\\begin\{([^}]*)\}/g)].map((m) => m[1]));
		expect([...envs].sort()).toEqual(['align*', 'document', 'itemize', 'longtable', 'verbatim']);
	});

	it('gives a hostile coefficient list by its value and drops its lines that name no coefficient', () => {
		expect(tex).toContain(
			`a_{1} &\\approx 2 \\quad \\text{(exact form not typeset here, too long for one row; it is in the pad's JSON export)}`
		);
		expect(tex).not.toContain('y + y');
		expect(tex).not.toContain('w + w');
	});

	it('escapes control characters in text fields', () => {
		expect(texText('a\u0000b\u007fc\u009bd')).toBe('a b c d');
	});
});

describe('the .md export of a hostile pad', () => {
	const html = '<img src=x onerror=alert(1)>';
	const md = renderMarkdown(
		doc(
			[
				{
					kind: 'scalar',
					label: `${html} **b** [l](javascript:x)`,
					value: 1,
					order: 2,
					unit: '</td><script>',
					warning: '<!-- x -->',
					latex: '<script>alert(1)</script>'
				},
				{ kind: 'scalar', label: 'refused', value: 1, order: 2, latex: '\\input{x} <b>$$</b>' },
				{ kind: 'scalar', label: 'm', value: 1, order: 2, latex: 'a < b > c' },
				{
					kind: 'table',
					label: 't|<b>',
					columns: ['<th>', 'a|b'],
					rows: [
						['<script>x</script>', 1],
						['&lt;script&gt;', null],
						['`code` <i>', 2]
					]
				},
				{ kind: 'note', text: `${html}\n# heading` },
				{ kind: 'record', label: 'r', fields: { '<svg onload=x>': 1 } }
			],
			{ title: `<h1>${html}</h1>`, bulk: { name: 'brane', params: { x: '` <img src=y> ``' } } }
		),
		{ owner: '<b>owner</b>' }
	);

	/** The text a Markdown renderer treats as Markdown: fenced blocks and inline code spans removed (never HTML). */
	const outsideCode = md.replace(/^(`{3,})[^\n]*\n[\s\S]*?\n\1$/gm, '').replace(/(`+)[\s\S]*?\1/g, '');

	it('leaves no raw HTML outside code', () => {
		expect(outsideCode).not.toMatch(/</);
		expect(outsideCode).not.toMatch(/&(?!amp;|lt;|gt;)/);
	});

	it('shows the text escaped, so a reader still sees what was typed', () => {
		expect(md).toContain('# &lt;h1&gt;&lt;img src=x onerror=alert(1)&gt;&lt;/h1&gt;');
		expect(md).toContain('| &lt;script&gt;x&lt;/script&gt; | 1 |');
		expect(md).toContain('| &amp;lt;script&amp;gt; | — |');
		expect(md).toContain('\\*\\*b\\*\\* \\[l\\](javascript:x)');
		expect(md).toContain('| &lt;th&gt; | a\\|b |');
	});

	it('writes math only when the allow-list takes it, with < and > as \\lt and \\gt', () => {
		expect(md).toContain('```tex\n\\input{x} <b>$$</b>\n```');
		// harmless as TeX, so it stays math; no tag can form without a literal <
		expect(md).toContain('$$\n\\lt script\\gt alert(1)\\lt /script\\gt \n$$');
		expect(md).toContain('$$\na \\lt  b \\gt  c\n$$');
	});

	it('keeps a bulk parameter with backticks inside its code span', () => {
		expect(md).toContain('bulk now ``` brane x=` <img src=y> `` ```;');
	});
});
