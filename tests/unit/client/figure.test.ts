import { describe, expect, it } from 'vitest';
import type { TableResult } from '../../../src/lib/lang/result';
import {
	columnLegend,
	keyLabel,
	labelRuns,
	labelText,
	quantityLabel,
	texForPgf,
	unicodeToTex
} from '../../../src/lib/client/figure/texlabel';
import { figureFileName, figureOfSteps, figureOfTable, withLabels } from '../../../src/lib/client/figure/spec';
import { integerTicks, layoutFigure, stackLabels, textWidth } from '../../../src/lib/client/figure/layout';
import { sceneSvg } from '../../../src/lib/client/figure/svg';
import { scenePdf } from '../../../src/lib/client/figure/pdf';
import { figurePgf } from '../../../src/lib/client/figure/pgf';
import { readDpi, withDpi } from '../../../src/lib/client/figure/png';
import { BACKGROUNDS, contrast, ORDER_COLOURS, ORDER_DASHES, curveStyle } from '../../../src/lib/client/figure/palette';
import { VALIDITY_TOLERANCE } from '../../../src/lib/client/figure/tolerance';
import { DEFAULT_VALIDITY_TOL } from '../../../src/lib/lang/verbs/validity';
import { linearScale } from '../../../src/lib/client/scale';

const sweep: TableResult = {
	kind: 'table',
	label: 'ΔA vs l · boosted d=4 zh=1 v=0.6',
	columns: ['l', 'o1', 'o2', 'o3', 'exact'],
	rows: Array.from({ length: 20 }, (_, i) => {
		const l = 0.05 + i * 0.06;
		return [l, l ** 2, l ** 2 + 0.1 * l ** 4, l ** 2 + 0.1 * l ** 4 - 0.01 * l ** 6, Math.sin(l) ** 2];
	}),
	plot: { x: 'l', validity: { o1: 0.4, o2: 0.42, o3: 0.44 }, show: true }
};

describe('figure labels are LaTeX', () => {
	it('defaults: ℓ on x, ΔA on y, orders and exact in the legend', () => {
		const f = figureOfTable(sweep);
		expect(f.xlabel).toBe('\\ell');
		expect(f.ylabel).toBe('\\Delta A');
		expect(f.curves.map((c) => labelText(c.legend))).toEqual(['order 1', 'order 2', 'order 3', 'exact']);
		expect(keyLabel('zh')).toBe('z_h');
		expect(unicodeToTex('ΔA_fin')).toBe('\\Delta A_fin');
		expect(quantityLabel('S vs R · brane d=4 zh=1')).toBe('S');
	});
	it('draws Greek, subscripts and upright text as runs', () => {
		expect(labelRuns('z_h')).toEqual([
			{ text: 'z', shift: 0, italic: true },
			{ text: 'h', shift: -1, italic: true }
		]);
		expect(labelText('\\Delta A / \\ell^{2}')).toBe('ΔA/ℓ^2');
		expect(labelText('\\mathrm{order}\\;3')).toBe('order 3');
		expect(labelText('\\tau = (\\ell/z_h)^d')).toBe('τ=(ℓ/z_h)^d');
	});
	it('passes known LaTeX to pgfplots in math mode and escapes anything else', () => {
		expect(texForPgf('\\Delta A')).toBe('$\\Delta A$');
		expect(texForPgf('z_{h}')).toBe('$z_{h}$');
		// a command outside the label vocabulary could read files: it becomes text
		expect(texForPgf('\\input{/etc/passwd}')).toBe('\\textbackslash{}input\\{/etc/passwd\\}');
		expect(texForPgf('a}b{')).not.toContain('$');
		expect(texForPgf('50%')).toBe('50\\%');
	});
	it('user edits replace defaults; empty keeps them', () => {
		const f = withLabels(figureOfTable(sweep), { xlabel: '\\ell/z_h', ylabel: ' ', legends: { o1: 'n=1' } });
		expect(f.xlabel).toBe('\\ell/z_h');
		expect(f.ylabel).toBe('\\Delta A');
		expect(f.curves[0]!.legend).toBe('n=1');
	});
	it('file names keep the Δ', () => {
		expect(figureFileName('ΔA vs l · boosted d=4')).toBe('delta-a-vs-l-boosted-d-4');
	});
});

describe('figure geometry', () => {
	it('orders get integer ticks only', () => {
		const s = linearScale([1, 3], [0, 100]);
		expect(integerTicks(s, 8)).toEqual([1, 2, 3]);
		const validity: TableResult = {
			kind: 'table',
			label: 'l_max vs o',
			columns: ['o', 'l_max'],
			rows: [
				[1, 0.3],
				[2, 0.4],
				[3, 0.5]
			],
			plot: { x: 'o' }
		};
		const f = figureOfTable(validity);
		expect(f.integerX).toBe(true);
		const scene = layoutFigure(f);
		const main = scene.panels[0]!;
		const ticks = scene.prims
			.filter((p) => p.t === 'text' && Math.abs(p.y - (main.y + main.h + 14)) < 0.01)
			.map((p) => (p.t === 'text' ? p.runs[0]!.text : ''));
		expect(ticks.length).toBeGreaterThan(1);
		for (const t of ticks) expect(Number(t)).toSatisfy(Number.isInteger);
	});
	it('band labels never overlap', () => {
		const rows = stackLabels([
			{ right: 300, width: 80 },
			{ right: 310, width: 80 },
			{ right: 320, width: 80 },
			{ right: 500, width: 80 }
		]);
		expect(rows).toEqual([0, 1, 2, 0]);
		const scene = layoutFigure(figureOfTable(sweep));
		const labels = scene.prims.filter((p) => p.t === 'text' && p.cls === 'band-label') as Extract<
			(typeof scene.prims)[number],
			{ t: 'text' }
		>[];
		expect(labels).toHaveLength(3);
		for (let i = 0; i < labels.length; i++)
			for (let j = i + 1; j < labels.length; j++) {
				const a = labels[i]!;
				const b = labels[j]!;
				const overlapX = a.x - textWidth(a.runs, 9) < b.x && b.x - textWidth(b.runs, 9) < a.x;
				const overlapY = Math.abs(a.y - b.y) < 9;
				expect(overlapX && overlapY, `labels ${i} and ${j}`).toBe(false);
			}
	});
	it('order colours are colour-blind safe and keep 3:1 contrast on white files and the dark page, each with its own dash', () => {
		for (const c of ORDER_COLOURS) {
			expect(contrast(c, BACKGROUNDS.light), `${c} on white`).toBeGreaterThanOrEqual(3);
			expect(contrast(c, BACKGROUNDS.dark), `${c} on dark`).toBeGreaterThanOrEqual(3);
		}
		expect(new Set(ORDER_DASHES).size).toBe(ORDER_DASHES.length);
		expect(curveStyle('o3', 2, false).dash).not.toBe('');
	});
	it('states the tolerance the bands use, the same as the engine', () => {
		expect(VALIDITY_TOLERANCE).toBe(DEFAULT_VALIDITY_TOL);
		const svg = sceneSvg(layoutFigure(figureOfTable(sweep, { tolerance: VALIDITY_TOLERANCE })), { file: true, id: 'f', label: 'x' });
		expect(svg).toContain('shaded: series within 1e-3 of exact (relative)');
	});
	it('a comparison draws markers with error bars under the engine line, and a residual panel', () => {
		const cmp: TableResult = {
			kind: 'table',
			label: 'mine: darea against darea (exact) vs l',
			columns: ['l', 'engine', 'dataset', 'diff', 'sigma', 'pull'],
			rows: [
				[0.1, 1, 1.1, -0.1, 0.05, 2],
				[0.2, 2, 1.95, 0.05, 0.05, -1]
			],
			plot: { x: 'l', dataset: 'mine', show: true }
		};
		const f = figureOfTable(cmp);
		expect(f.curves.map((c) => c.column)).toEqual(['engine']);
		expect(f.markers!.errors).toEqual([0.05, 0.05]);
		expect(f.residual!.points).toEqual([
			[0.1, 0.1],
			[0.2, -0.05]
		]);
		const scene = layoutFigure(f);
		expect(scene.panels).toHaveLength(2);
		const kinds = scene.prims.map((p) =>
			p.t === 'path' && p.cls === 'series-path' ? 'curve' : p.t === 'marker' && p.clip === 0 ? 'marker' : ''
		);
		expect(kinds.lastIndexOf('marker')).toBeLessThan(kinds.indexOf('curve'));
		expect(scene.prims.filter((p) => p.t === 'line' && p.cls === 'error-bar')).toHaveLength(4);
	});
	it('overlays steps, each curve its own style, with a difference panel for two curves on one grid', () => {
		const other: TableResult = { ...sweep, columns: ['l', 'exact'], rows: sweep.rows.map((r) => [r[0]!, (r[4] as number) * 1.1]) };
		const one: TableResult = { ...sweep, columns: ['l', 'exact'], rows: sweep.rows.map((r) => [r[0]!, r[4]!]) };
		const f = figureOfSteps([
			{ step: 9, table: one },
			{ step: 35, table: other }
		]);
		expect(f.curves.map((c) => c.id)).toEqual(['#9:exact', '#35:exact']);
		expect(labelText(f.curves[1]!.legend)).toBe('#35 exact');
		expect(f.curves[0]!.style).not.toEqual(f.curves[1]!.style);
		expect(f.residual!.points[3]![1]).toBeCloseTo((one.rows[3]![1] as number) * 0.1, 12);
	});
});

describe('figure files', () => {
	const scene = layoutFigure(figureOfTable(sweep));
	it('SVG: standalone, white, fixed ink, every curve as a path', () => {
		const svg = sceneSvg(scene, { file: true, id: 'f', label: 'ΔA' });
		expect(svg).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/);
		expect(svg).not.toContain('currentColor');
		expect(svg.match(/class="series-path"/g)).toHaveLength(4);
		expect(svg).toContain('>ℓ</tspan>');
	});
	it('PDF: a well-formed one-page file whose xref offsets point at its objects', () => {
		const bytes = scenePdf(scene, 'ΔA vs l');
		const text = String.fromCharCode(...bytes);
		expect(text.startsWith('%PDF-1.4')).toBe(true);
		expect(text.trimEnd().endsWith('%%EOF')).toBe(true);
		const xref = Number(/startxref\n(\d+)/.exec(text)![1]);
		expect(text.slice(xref, xref + 4)).toBe('xref');
		const offsets = [...text.slice(xref).matchAll(/^(\d{10}) 00000 n $/gm)].map((m) => Number(m[1]));
		offsets.forEach((o, i) => expect(text.slice(o, o + 12)).toMatch(new RegExp(`^${i + 1} 0 obj`)));
		// Δ goes out through the Symbol font as 'D'
		expect(text).toMatch(/\/F2 [\d.]+ Tf \(D\) Tj/);
		const len = Number(/\/Length (\d+)/.exec(text)![1]);
		const start = text.indexOf('stream\n') + 7;
		expect(text.slice(start + len, start + len + 10)).toBe('\nendstream');
	});
	it('PNG: says 300 dpi', () => {
		// the smallest valid PNG header + IHDR, then IEND: enough to place the chunk
		const ihdr = [0, 0, 0, 13, 73, 72, 68, 82, 0, 0, 0, 1, 0, 0, 0, 1, 8, 2, 0, 0, 0, 0x90, 0x77, 0x53, 0xde];
		const png = Uint8Array.from([137, 80, 78, 71, 13, 10, 26, 10, ...ihdr, 0, 0, 0, 0, 73, 69, 78, 68, 0xae, 0x42, 0x60, 0x82]);
		expect(readDpi(png)).toBeNull();
		expect(readDpi(withDpi(png))).toBe(300);
	});
	it('pgfplots: ASCII only, LaTeX labels, one \\addplot per curve, a second axis for residuals', () => {
		const s = figurePgf(figureOfTable(sweep), { standalone: true });
		expect(s).toMatch(/^[\x20-\x7e\n]*$/);
		expect(s).toContain('xlabel={$\\ell$}');
		expect(s).toContain('ylabel={$\\Delta A$}');
		expect(s.match(/\\addplot\[/g)).toHaveLength(4);
		expect(s).toContain('\\begin{document}');
	});
	it('legend text of an overlay names the step', () => {
		expect(columnLegend('o2', 9)).toBe('\\#9\\;\\mathrm{order}\\;2');
	});
});
