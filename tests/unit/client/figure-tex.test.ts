// The figure files a paper takes, checked by the program a paper uses: pdflatex compiles the pgfplots export
// (with bands, a dataset with error bars and a residual panel), and pdfTeX's own PDF reader includes the PDF
// export (it refuses a file whose cross-reference table or objects are broken). Runs where pdflatex and
// pgfplots exist (scripts/ensure-texlive.mjs; Debian's texlive-pictures carries pgfplots).
import { execFile, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { describe, expect, it } from 'vitest';
import type { TableResult } from '../../../src/lib/lang/result';
import { figureOfSteps, figureOfTable, withLabels } from '../../../src/lib/client/figure/spec';
import { figurePgf } from '../../../src/lib/client/figure/pgf';
import { layoutFigure } from '../../../src/lib/client/figure/layout';
import { scenePdf } from '../../../src/lib/client/figure/pdf';

const run = promisify(execFile);
const hasPdflatex = spawnSync('pdflatex', ['--version']).status === 0;
const hasPgfplots = hasPdflatex && spawnSync('kpsewhich', ['pgfplots.sty'], { encoding: 'utf8' }).stdout.trim() !== '';

async function compile(tex: string, files: Record<string, Uint8Array> = {}) {
	const dir = mkdtempSync(join(tmpdir(), 'bulkpad-fig-'));
	writeFileSync(join(dir, 'doc.tex'), tex);
	for (const [name, bytes] of Object.entries(files)) writeFileSync(join(dir, name), bytes);
	const out = await run('pdflatex', ['-interaction=nonstopmode', '-halt-on-error', '-no-shell-escape', 'doc.tex'], {
		cwd: dir,
		maxBuffer: 16 << 20
	}).then(
		(r) => ({ code: 0, log: r.stdout }),
		(e: { code: number; stdout: string }) => ({ code: e.code, log: e.stdout })
	);
	const pdf = out.code === 0 ? readFileSync(join(dir, 'doc.pdf')) : null;
	return { ...out, pdf };
}

const sweep: TableResult = {
	kind: 'table',
	label: 'ΔA vs l · boosted d=4 zh=1 v=0.6',
	columns: ['l', 'o1', 'o2', 'exact'],
	rows: Array.from({ length: 12 }, (_, i) => {
		const l = 0.05 + i * 0.1;
		return [l, l ** 2, l ** 2 + 0.1 * l ** 4, Math.sin(l) ** 2];
	}),
	plot: { x: 'l', validity: { o1: 0.4, o2: 0.6 }, show: true }
};
const compare: TableResult = {
	kind: 'table',
	label: 'mine: darea against darea (exact) vs l',
	columns: ['l', 'engine', 'dataset', 'diff', 'sigma', 'pull'],
	rows: [
		[0.1, 1, 1.1, -0.1, 0.05, 2],
		[0.2, 2, 1.95, 0.05, 0.05, -1],
		[0.3, 3, 3.02, -0.02, 0.05, 0.4]
	],
	plot: { x: 'l', dataset: 'mine', show: true }
};

describe.runIf(hasPgfplots)('pgfplots export compiles with plain pdflatex', () => {
	it('a sweep with validity bands, user labels, and a comparison with error bars and a residual panel', { timeout: 180_000 }, async () => {
		const a = figurePgf(withLabels(figureOfTable(sweep), { ylabel: '\\Delta A/\\ell^{2}', legends: { o1: 'n=1' } }), { standalone: true });
		const b = figurePgf(figureOfTable(compare), { standalone: false });
		const doc = a.replace('\\end{document}', b.replace(/^%.*\n/, '') + '\n\\end{document}');
		const r = await compile(doc);
		expect(r.code, r.log.slice(-2000)).toBe(0);
		expect(r.pdf!.subarray(0, 5).toString()).toBe('%PDF-');
	});
	it('an overlay of two steps with its difference panel', { timeout: 180_000 }, async () => {
		const one: TableResult = { ...sweep, columns: ['l', 'exact'], rows: sweep.rows.map((r) => [r[0]!, r[3]!]) };
		const two: TableResult = { ...sweep, columns: ['l', 'exact'], rows: sweep.rows.map((r) => [r[0]!, (r[3] as number) * 1.05]) };
		const f = figureOfSteps([
			{ step: 9, table: one },
			{ step: 35, table: two }
		]);
		const r = await compile(figurePgf(f, { standalone: true }));
		expect(r.code, r.log.slice(-2000)).toBe(0);
	});
});

describe.runIf(hasPdflatex)('the PDF export is a PDF that pdfTeX reads', () => {
	it('\\includegraphics takes the figure PDF', { timeout: 120_000 }, async () => {
		const pdf = scenePdf(layoutFigure(figureOfTable(compare)), 'ΔA (mine)');
		const doc = [
			'\\documentclass{article}',
			'\\usepackage{graphicx}',
			'\\begin{document}',
			'\\includegraphics{fig.pdf}',
			'\\end{document}'
		].join('\n');
		const r = await compile(doc, { 'fig.pdf': pdf });
		expect(r.code, r.log.slice(-2000)).toBe(0);
		expect(r.log).not.toMatch(/PDF inclusion: .*(error|invalid)/i);
	});
});
