import { describe, expect, it } from 'vitest';
import type { TableResult } from '../../../src/lib/lang/result';
import { figureOfSteps, figureOfTable } from '../../../src/lib/client/figure/spec';
import { bandLegend, layoutFigure, tolText, type Prim } from '../../../src/lib/client/figure/layout';
import { sceneSvg } from '../../../src/lib/client/figure/svg';
import { scenePdf } from '../../../src/lib/client/figure/pdf';
import { figurePgf } from '../../../src/lib/client/figure/pgf';
import { BACKGROUNDS, GUIDE_STYLE, contrast, guideStyle } from '../../../src/lib/client/figure/palette';
import { labelText } from '../../../src/lib/client/figure/texlabel';

/** A hand-made growth-like table: ΔA(t) rising to saturation, with two reference curves as the quench helper fills. */
const ts = Array.from({ length: 21 }, (_, i) => i * 0.1);
const growth: TableResult = {
	kind: 'table',
	label: 'ΔA vs t · vaidya d=3 m=1',
	columns: ['t', 'exact'],
	rows: ts.map((t) => [t, Math.min(0.5 * t * t, 0.6)]),
	plot: {
		x: 't',
		show: true,
		guides: [
			// runs far above the data on purpose: the guide must be clipped, not widen the y axis
			{ label: 'm\\,t^{2}/2', points: ts.map((t) => [t, 0.5 * t * t * 10] as [number, number]) },
			{
				label: '\\Delta A_{\\mathrm{th}}',
				points: [
					[0, 0.6],
					[2, 0.6]
				]
			}
		]
	}
};

const guidePaths = (prims: Prim[]) => prims.filter((p): p is Extract<Prim, { t: 'path' }> => p.t === 'path' && p.cls === 'plot-guide');

describe('plot guides', () => {
	it('become thin dashed grey polylines in plot coordinates, clipped to the main panel', () => {
		const f = figureOfTable(growth);
		expect(f.guides?.map((g) => g.legend)).toEqual(['m\\,t^{2}/2', '\\Delta A_{\\mathrm{th}}']);
		const scene = layoutFigure(f);
		const paths = guidePaths(scene.prims);
		expect(paths).toHaveLength(2);
		for (const [i, p] of paths.entries()) {
			expect(p.stroke).toBe(GUIDE_STYLE.stroke);
			expect(p.dash).toBe(guideStyle(i).dash);
			expect(p.width).toBeLessThanOrEqual(1);
			expect(p.clip).toBe(0);
		}
		const main = scene.panels[0]!;
		// the flat guide at ΔA_th sits where the panel's scale puts 0.6
		const flat = paths[1]!.segs[0]!;
		expect(flat[0]![1]).toBeCloseTo(main.ys(0.6), 9);
		expect(flat[1]![0]).toBeCloseTo(main.xs(2), 9);
	});
	it('never set the axes: the y range is the same with or without them', () => {
		const with_ = layoutFigure(figureOfTable(growth)).panels[0]!;
		const without = layoutFigure(figureOfTable({ ...growth, plot: { ...growth.plot!, guides: [] } })).panels[0]!;
		expect(with_.ys.domain).toEqual(without.ys.domain);
		expect(Math.max(...with_.ys.domain)).toBeLessThan(2); // the steep guide reaches 20
	});
	it('have a legend entry with their dashed grey line', () => {
		const scene = layoutFigure(figureOfTable(growth));
		const lines = scene.prims.filter((p) => p.t === 'line' && p.cls?.includes('legend-guide'));
		expect(lines).toHaveLength(2);
		// each guide its own dash, so the legend tells the thermal value from the early law in grey alone
		expect(new Set(lines.map((l) => (l.t === 'line' ? l.dash : '')))).toEqual(new Set([guideStyle(0).dash, guideStyle(1).dash]));
		expect(guideStyle(0).dash).not.toBe(guideStyle(1).dash);
		const texts = scene.prims
			.filter((p) => p.t === 'text' && p.cls === 'legend-text')
			.map((p) => (p.t === 'text' ? p.runs.map((r) => r.text).join('') : ''));
		// runs joined: Δ, A and the subscript th
		expect(texts).toEqual(['exact', 'm t2/2', 'ΔAth']);
		expect(labelText('\\Delta A_{\\mathrm{th}}')).toBe('ΔA_th');
	});
	it('appear in the SVG (clip-path of the main panel), the PDF and pgfplots', () => {
		const scene = layoutFigure(figureOfTable(growth));
		const svg = sceneSvg(scene, { file: true, id: 'g', label: 'growth' });
		const guides = svg.match(/<path class="plot-guide"[^>]*>/g) ?? [];
		expect(guides).toHaveLength(2);
		for (const [i, g] of guides.entries()) {
			expect(g).toContain(`stroke-dasharray="${guideStyle(i).dash}"`);
			expect(g).toContain('clip-path="url(#g-clip0)"');
		}
		// PDF: the guide colour 0x8C/255 ≈ 0.549 is set as a stroke colour
		const pdf = new TextDecoder('latin1').decode(scenePdf(scene, 'growth'));
		expect(pdf).toMatch(/0\.549 0\.549 0\.549 RG/);
		const pgf = figurePgf(figureOfTable(growth));
		expect(pgf).toContain('\\definecolor{bpguide}{HTML}{8C8C8C}');
		expect(pgf.match(/color=bpguide, no markers/g) ?? []).toHaveLength(2);
		// fixed limits, so pgfplots clips the steep guide instead of widening the axis
		expect(pgf).toMatch(/ymax=[0-9.]+/);
		expect(Number(/ymax=([0-9.e-]+)/.exec(pgf)![1])).toBeLessThan(2);
		expect(pgf).toContain('{$\\Delta A_{\\mathrm{th}}$}');
	});
	it('are named by their step when steps are overlaid', () => {
		const f = figureOfSteps([
			{ step: 4, table: growth },
			{ step: 7, table: { ...growth, plot: { x: 't' } } }
		]);
		expect(f.guides?.map((g) => g.legend)).toEqual(['\\#4\\;m\\,t^{2}/2', '\\#4\\;\\Delta A_{\\mathrm{th}}']);
	});
	it('grey stays visible on the white file and the dark page', () => {
		expect(contrast(GUIDE_STYLE.stroke, BACKGROUNDS.light)).toBeGreaterThanOrEqual(3);
		expect(contrast(GUIDE_STYLE.stroke, BACKGROUNDS.dark)).toBeGreaterThanOrEqual(3);
	});
});

describe('the validity tolerance in the legend', () => {
	it('is written as a paper writes it and printed with what the shading means', () => {
		expect(tolText(1e-3)).toBe('1e-3');
		expect(tolText(2.5e-4)).toBe('2.5e-4');
		expect(tolText(0.01)).toBe('1e-2');
		expect(bandLegend(1e-4)).toBe('shaded: series within 1e-4 of exact (relative), ℓ ≤ ℓ_max');
	});
	it('follows the table’s own tolerance into the screen, SVG and pgfplots', () => {
		const t: TableResult = {
			kind: 'table',
			label: 'ΔA vs l · brane d=4 zh=1',
			columns: ['l', 'o1', 'exact'],
			rows: [0.1, 0.2, 0.3].map((l) => [l, l * l, l * l * 1.01]),
			plot: { x: 'l', validity: { o1: 0.2 }, tol: 1e-4, show: true }
		};
		const f = figureOfTable(t, { tolerance: t.plot!.tol });
		expect(sceneSvg(layoutFigure(f), { file: true, id: 'v', label: 'v' })).toContain('series within 1e-4 of exact');
		expect(figurePgf(f)).toContain('shaded: series within $10^{-4}$ of exact (relative)');
	});
});
