// Whole-pad export formats and the import schema: pure functions, table-driven.
import { describe, expect, it } from 'vitest';
import { renderMarkdown } from '../../../src/lib/server/export/markdown';
import { breakRows, renderLatex, safeMath, texText } from '../../../src/lib/server/export/latex';
import { formatNumber, latexNumber } from '../../../src/lib/server/export/numbers';
import { exportFilename, exportPad } from '../../../src/lib/server/export/index';
import { parsePadDocument, toPadDocument, type PadDocument } from '../../../src/lib/server/export/schema';

const doc = (steps: PadDocument['steps'], title = 'A pad'): PadDocument => ({
	format: 'bulkpad-pad',
	version: 1,
	title,
	bulk: { name: 'brane', params: { d: 4, zh: 1 } },
	units: { system: 'geo', G: 1 },
	steps
});
const ok = (n: number, input: string, results: NonNullable<PadDocument['steps'][number]['results']>) => ({
	n,
	input,
	status: 'ok' as const,
	results,
	error: null
});

describe('numbers', () => {
	it.each([
		[0.024585435882019824, '0.02458543588', '0.02458543588'],
		[3, '3', '3'],
		[-1.5e-7, '-1.5e-7', '-1.5\\times10^{-7}'],
		[6.02214076e23, '6.02214076e+23', '6.02214076\\times10^{23}'],
		[null, '—', '\\text{---}'],
		[Infinity, '∞', '\\infty']
	])('%s → %s and %s', (v, text, tex) => {
		expect(formatNumber(v)).toBe(text);
		expect(latexNumber(v)).toBe(tex);
	});
});

describe('file names', () => {
	it.each([
		['Boosted brane d=4: first law to third order', 'md', 'boosted-brane-d-4-first-law-to-third-order.md'],
		['Inès’ ΔA check', 'tex', 'ines-a-check.tex'],
		['"; rm -rf /', 'json', 'rm-rf.json'],
		['ΔΔΔ', 'md', 'pad.md']
	] as const)('%s → %s', (title, format, name) => expect(exportFilename(title, format)).toBe(name));
});

describe('Markdown', () => {
	it('keeps an input with backticks inside its own code block', () => {
		const md = renderMarkdown(doc([ok(1, 'darea l=0.3 // ``` tricky', [])]));
		expect(md).toContain('````bulkpad\ndarea l=0.3 // ``` tricky\n````');
	});
	it('escapes pipes in table cells and writes one line per row', () => {
		const md = renderMarkdown(
			doc([
				ok(1, 'sweep', [
					{
						kind: 'table',
						label: 'a|b',
						columns: ['l', 'o|1'],
						rows: [
							[0.1, 'x|y'],
							[0.2, null]
						]
					}
				])
			])
		);
		expect(md).toContain('| l | o\\|1 |\n| --- | --- |\n| 0.1 | x\\|y |\n| 0.2 | — |');
		expect(md).toContain('**a\\|b** (2 rows)');
	});
	it('says the order of a perturbative value and carries its warning', () => {
		const md = renderMarkdown(
			doc([ok(1, 'darea l=2 o=3', [{ kind: 'scalar', label: 'ΔA', value: 0.5, order: 3, warning: 'l is outside the series range' }])])
		);
		expect(md).toContain('- **ΔA** = 0.5 (order 3)');
		expect(md).toContain('> ⚠ l is outside the series range');
	});
});

describe('LaTeX', () => {
	it.each([
		['50% of #3 & $x_1^2$ {ok} ~ \\', '50\\% of \\#3 \\& \\$x\\_1\\^{}2\\$ \\{ok\\} \\textasciitilde{} \\textbackslash{}'],
		['ΔA ≈ 0.1 — Inès', '$\\Delta$A $\\approx$ 0.1 --- Inès'],
		['漢字', '??']
	])('texText(%s)', (input, out) => expect(texText(input)).toBe(out));

	it.each([
		['\\frac{\\sqrt{\\pi}\\,\\Gamma(\\tfrac{1}{4})^2}{32\\pi}', true],
		['\\Delta A^{(2)}\\big|_{\\ell=0.3} = 0.0245', true],
		['\\begin{aligned} a &= b \\\\ c &= d \\end{aligned}', true],
		['\\left(\\bullet\\right)', true],
		['\\input{/etc/passwd}', false],
		['\\immediate\\write18{rm -rf ~}', false],
		['\\def\\x{1}\\x', false],
		['\\csname input\\endcsname{x}', false],
		['\\end{document}', false],
		['x$\\input y$', false],
		['^^5cinput{x}', false],
		['\\frac{1}{2', false],
		['}{', false],
		['\\catcode`\\^=7', false],
		['\\includegraphics{x}', false]
	])('safeMath(%s) is %s', (latex, safe) => expect(safeMath(latex) !== null).toBe(safe));

	it('prints an unsafe formula as text and keeps the document whole', () => {
		const tex = renderLatex(doc([ok(1, 'coeffs', [{ kind: 'series', label: 's', terms: [], latex: '\\input{/etc/passwd}' }])]));
		expect(tex).not.toContain('\\input{');
		expect(tex).toContain('\\texttt{\\textbackslash{}input\\{/etc/passwd\\}}');
	});

	it('sets a series as its coefficient list in align* blocks under the cap, a too-long coefficient by its value', () => {
		const long = Array.from({ length: 4000 }, (_, i) => `x_{${i}}`).join('+'); // ~28k characters, over the cap
		const mid = Array.from({ length: 1200 }, (_, i) => `y_{${i}}`).join(' + '); // ~10k: cut into rows; two do not share a block
		const terms = [
			{ k: 1, coeff: 0.5, latex: '\\tfrac{1}{2}' },
			{ k: 2, coeff: -0.25, latex: mid },
			{ k: 3, coeff: 0.125, latex: mid },
			{ k: 4, coeff: 1.5e-3, latex: long }
		];
		const list = [
			'\\begin{aligned}',
			['\\Delta A &= \\sum_{k\\ge1} a_{k}\\,\\tau^{k}', ...terms.map((t) => `a_{${t.k}} &= ${t.latex}`), '&\\text{where}'].join(' \\\\\n'),
			'\\end{aligned}'
		].join('\n');
		const tex = renderLatex(
			doc([ok(1, 'coeffs darea o=4', [{ kind: 'series', label: 's', terms, latex: terms.map((t) => t.latex).join('+'), list }])])
		);
		const blocks = [...tex.matchAll(/\\begin\{align\*\}\n([\s\S]*?)\n\\end\{align\*\}/g)].map((m) => m[1]);
		expect(blocks.length).toBeGreaterThanOrEqual(2);
		for (const b of blocks) {
			expect(b.length).toBeLessThanOrEqual(20_000);
			expect(safeMath(b)).not.toBeNull();
		}
		const all = blocks.join('\n');
		expect(all).toContain('a_{1} &= \\tfrac{1}{2}');
		expect(all).toContain('a_{3} &= y_{0}');
		expect(all).toContain(`a_{4} &\\approx ${latexNumber(1.5e-3)}`);
		expect(all).not.toContain('x_{0}');
		expect(all).toContain('\\text{where}');
	});

	it('cuts a wide coefficient into rows at its top-level signs, never inside a group, with fixed-size brackets', () => {
		const line =
			'a_{2} &= \\frac{1}{2}\\left(' + Array.from({ length: 60 }, (_, i) => `c_{${i}}\\tfrac{1}{${i + 1}}`).join(' - ') + '\\right)';
		const rows = breakRows(line, 100)!;
		expect(rows.length).toBeGreaterThan(3);
		expect(rows[0].startsWith('a_{2} &= \\frac{1}{2}\\bigl(')).toBe(true);
		expect(rows.at(-1)!.endsWith('\\bigr)')).toBe(true);
		for (const r of rows.slice(1)) expect(r).toMatch(/^&\\qquad - c_\{\d+\}/);
		// the rows put back together are the line (with the brackets fixed-size)
		expect(rows.map((r, k) => (k ? r.replace('&\\qquad ', ' ') : r)).join('')).toBe(
			line.replace('\\left(', '\\bigl(').replace('\\right)', '\\bigr)')
		);
		// a sign inside braces is no place to break; a row that cannot be cut short enough is refused
		expect(breakRows('x = {' + 'a + '.repeat(2000) + 'b}', 100)).toBeNull();
		expect(breakRows('short', 100)).toEqual(['short']);
	});

	it('keeps an input from ending its verbatim block early', () => {
		const tex = renderLatex(doc([ok(1, 'x \\end{verbatim} \\input{y}', [])]));
		expect(tex).toContain('\\begin{verbatim}\nx \\end {verbatim} \\input{y}\n\\end{verbatim}');
		expect(tex.match(/\\end\{verbatim\}/g)).toHaveLength(1);
	});

	it('sets a long table as one booktabs longtable that breaks across pages with its header repeated', () => {
		const rows = Array.from({ length: 95 }, (_, i) => [i / 100, i]);
		const tex = renderLatex(doc([ok(1, 'sweep', [{ kind: 'table', label: 't', columns: ['l', 'exact'], rows }])]));
		expect(tex).toContain('\\usepackage{longtable}');
		expect(tex.match(/\\begin\{longtable\}\{rr\}/g)).toHaveLength(1);
		expect(tex).toMatch(/\\toprule\nl & exact \\\\\n\\midrule\n\\endfirsthead\n[^\n]*\n\\toprule\nl & exact \\\\\n\\midrule\n\\endhead/);
		// 95 rows, the header twice and the continuation line
		expect(tex.match(/ \\\\\n/g)!.length).toBe(95 + 3);
	});

	it('leaves out failed and hidden steps, saying how many, and keeps the others numbered', () => {
		const failed = {
			n: 2,
			input: 'darea l=',
			status: 'error' as const,
			results: null,
			error: { message: 'expected a value', start: 8, end: 8 }
		};
		const hidden = { ...ok(3, 'darea l=0.2', []), hidden: true };
		const tex = renderLatex(doc([ok(1, 'darea l=0.1', []), failed, hidden, ok(4, 'darea l=0.3', [])] as never));
		expect(tex).toContain('2 steps (2 failed or hidden steps left out)');
		expect(tex).toContain('\\subsection*{Step \\#1}');
		expect(tex).toContain('\\subsection*{Step \\#4}');
		expect(tex).not.toContain('Step \\#2');
		expect(tex).not.toContain('Step \\#3');
		expect(tex).not.toContain('expected a value');
	});
});

describe('JSON document and import schema', () => {
	const steps = [
		{
			n: 1,
			input: 'use brane d=3 zh=1',
			status: 'ok',
			results: [{ kind: 'note', text: 'bulk: brane d=3 zh=1' }],
			error: null,
			ref: { fields: {} },
			bulkBefore: { name: 'brane', params: { d: 4, zh: 1 } }
		},
		{
			n: 2,
			input: 'darea l=',
			status: 'error',
			results: null,
			error: { message: 'expected a value', start: 8, end: 8, code: 'language' },
			ref: null,
			bulkBefore: null
		}
	];
	const source = { title: 'T', bulk: { name: 'brane', params: { d: 3, zh: 1 } }, units: { system: 'geo', G: 1 }, lets: {}, steps };

	it('round-trips through the schema unchanged', () => {
		const written = JSON.parse(exportPad(source, 'json').body);
		const parsed = parsePadDocument(written);
		expect(parsed).toEqual({ ok: true, doc: written });
		expect(written).toEqual(toPadDocument(source));
	});

	it.each([
		[{ steps: [{ ...steps[0], status: 'ok', results: null }] }, /steps\.0\.results: a step with status "ok" needs results/],
		[{ steps: [{ ...steps[1], error: null }] }, /steps\.0\.error: a step with status "error" needs an error/],
		[{ steps: [steps[1], steps[0]] }, /steps\.0\.n: steps must be numbered/],
		[{ units: { system: 'planck' } }, /units/],
		[{ steps: Array.from({ length: 1001 }, (_, i) => ({ ...steps[1], n: i + 1 })) }, /at most 1000 steps/]
	])('refuses %#', (change, message) => {
		const parsed = parsePadDocument({ ...toPadDocument(source), ...change });
		expect(parsed.ok).toBe(false);
		if (!parsed.ok) expect(parsed.message).toMatch(message);
	});
});
