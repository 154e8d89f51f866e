/**
 * A figure's geometry as a flat list of drawing primitives, shared by the screen (SVG), the SVG/PNG files and
 * the PDF writer, so all of them show the same thing. Coordinates are SVG user units (y down), one unit is
 * one CSS pixel and 0.75 pt in the PDF.
 */
import { formatNumber } from '$lib/client/format';
import { linearScale, logDomain, logScale, niceDomain, type Scale } from '$lib/client/scale';
import { DATASET_COLOUR, INK, guideStyle } from './palette';
import type { FigureSpec } from './spec';
import { labelRuns, type LabelRun } from './texlabel';

export type Prim =
	| {
			t: 'line';
			x1: number;
			y1: number;
			x2: number;
			y2: number;
			stroke: string;
			width: number;
			dash?: string;
			opacity?: number;
			cls?: string;
	  }
	| { t: 'path'; segs: [number, number][][]; stroke: string; width: number; dash?: string; clip: number; cls?: string; col?: string }
	| { t: 'rect'; x: number; y: number; w: number; h: number; fill: string; opacity: number; cls?: string; col?: string }
	| { t: 'marker'; x: number; y: number; r: number; fill: string; stroke: string; clip: number }
	| {
			t: 'text';
			x: number;
			y: number;
			runs: LabelRun[];
			size: number;
			anchor: 'start' | 'middle' | 'end';
			fill: string;
			rotate?: boolean;
			cls?: string;
	  };

export interface Panel {
	x: number;
	y: number;
	w: number;
	h: number;
	xs: Scale;
	ys: Scale;
}
export interface Scene {
	width: number;
	height: number;
	panels: Panel[];
	prims: Prim[];
}

const W = 640;
const MAIN_H = 300;
const RES_H = 110;
const M = { l: 66, r: 14, t: 12, b: 40 };
const plain = (text: string): LabelRun[] => [{ text, shift: 0, italic: false }];

/**
 * Width of text in the plot's monospace font — used to keep labels from overlapping, so it errs wide: 0.62 em a
 * Latin character (IBM Plex Mono is 0.6), a full em for anything else (≤, ℓ, Greek come from a fallback font).
 */
export function textWidth(runs: LabelRun[], size: number): number {
	const em = (ch: string) => (ch.codePointAt(0)! < 0x250 ? 0.62 : 1);
	return runs.reduce((w, r) => w + [...r.text].reduce((a, ch) => a + em(ch), 0) * size * (r.shift ? 0.72 : 1), 0);
}

function extent(vals: number[], log: boolean): [number, number] {
	const ok = vals.filter((v) => Number.isFinite(v) && (!log || v > 0));
	if (!ok.length) return log ? [0.1, 1] : [0, 1];
	return [Math.min(...ok), Math.max(...ok)];
}

/** Ticks at whole numbers only, for axes of orders (no 1.2, 1.4, …). */
export function integerTicks(s: Scale, count: number): number[] {
	const [a, b] = [Math.min(...s.domain), Math.max(...s.domain)];
	const step = Math.max(1, Math.ceil((b - a) / Math.max(1, count)));
	const out: number[] = [];
	for (let v = Math.ceil(a); v <= b + 1e-9; v += step) out.push(v);
	return out;
}

/**
 * Band labels ("order 3 ≤ 0.41") each end at their dashed l_max line; a label that would overlap one already
 * placed drops to the next row. Returns the row of each label, in input order.
 */
export function stackLabels(items: { right: number; width: number }[], gap = 6): number[] {
	const rows: { left: number; right: number }[][] = [];
	return items.map((it) => {
		const left = it.right - it.width;
		let r = 0;
		while (rows[r]?.some((o) => left < o.right + gap && it.right + gap > o.left)) r++;
		(rows[r] ??= []).push({ left, right: it.right });
		return r;
	});
}

function segments(points: [number, number][], xs: Scale, ys: Scale): [number, number][][] {
	const out: [number, number][][] = [];
	let cur: [number, number][] = [];
	for (const [px, py] of points) {
		const ok = Number.isFinite(px) && Number.isFinite(py) && (!xs.log || px > 0) && (!ys.log || py > 0);
		if (!ok) {
			if (cur.length) out.push(cur);
			cur = [];
			continue;
		}
		cur.push([xs(px), ys(py)]);
	}
	if (cur.length) out.push(cur);
	return out;
}

export function layoutFigure(f: FigureSpec): Scene {
	const hasRes = !!f.residual && f.residual.points.some((p) => Number.isFinite(p[1]));
	const height = MAIN_H + (hasRes ? RES_H : 0);
	const mainBottom = MAIN_H - (hasRes ? 14 : M.b);
	const right = W - M.r;
	const prims: Prim[] = [];

	const allX = [...f.curves.flatMap((c) => c.points.map((p) => p[0])), ...(f.markers?.points.map((p) => p[0]) ?? [])];
	const [xa, xb] = extent(allX, f.logX);
	const xs = f.logX ? logScale(logDomain(xa, xb), [M.l, right]) : linearScale(niceDomain(xa, xb, 6), [M.l, right]);
	// orders far past their l_max run off to large values: the y range follows exact, the data and each order
	// only where it is reliable
	const exact = f.curves.some((c) => c.column === 'exact');
	const bandOf = new Map(f.bands.map((b) => [b.column, b.lmax]));
	const ys0 = f.curves.flatMap((c) => {
		const lmax = bandOf.get(c.column);
		return (exact && lmax !== undefined && c.column !== 'exact' ? c.points.filter((p) => p[0] <= lmax * 1.1) : c.points).map((p) => p[1]);
	});
	const dataYs = (f.markers?.points ?? []).flatMap((p, i) => {
		const e = f.markers?.errors?.[i];
		return Number.isFinite(e) ? [p[1] - e!, p[1] + e!] : [p[1]];
	});
	const [ya, yb] = extent([...ys0, ...dataYs], f.logY);
	const ys = f.logY ? logScale(logDomain(ya, yb), [mainBottom, M.t]) : linearScale(niceDomain(ya, yb, 5), [mainBottom, M.t]);
	const main: Panel = { x: M.l, y: M.t, w: right - M.l, h: mainBottom - M.t, xs, ys };
	const panels = [main];

	const [x0, x1] = xs.domain;
	const xTicks = f.integerX && !f.logX ? integerTicks(xs, 8) : xs.ticks(6);
	const tick = (v: number) => plain(formatNumber(v, 4));

	// validity bands: shaded to l_max, dashed edge, labels stacked so none overlaps another
	const bands = f.bands
		.filter((b) => !f.logX || b.lmax > 0)
		.map((b) => ({ ...b, clipped: Math.min(Math.max(b.lmax, Math.min(x0, x1)), Math.max(x0, x1)) }))
		.sort((a, b) => b.lmax - a.lmax);
	for (const b of bands) {
		const xA = xs(Math.min(x0, x1));
		prims.push({
			t: 'rect',
			x: Math.min(xA, xs(b.clipped)),
			y: M.t,
			w: Math.abs(xs(b.clipped) - xA),
			h: main.h,
			fill: b.style.stroke,
			opacity: 0.06,
			cls: 'validity-band',
			col: b.column
		});
	}
	const inside = bands.filter((b) => b.lmax >= Math.min(x0, x1) && b.lmax <= Math.max(x0, x1));
	const labels = inside.map((b) => ({ b, runs: [...labelRuns(b.legend), ...plain(` ≤ ${formatNumber(b.lmax, 3)}`)] }));
	const rows = stackLabels([...labels].reverse().map((l) => ({ right: xs(l.b.lmax) - 3, width: textWidth(l.runs, 9) }))).reverse();
	labels.forEach(({ b, runs }, k) => {
		prims.push({ t: 'line', x1: xs(b.lmax), x2: xs(b.lmax), y1: M.t, y2: mainBottom, stroke: b.style.stroke, width: 1, dash: '3 3' });
		prims.push({
			t: 'text',
			x: xs(b.lmax) - 3,
			y: mainBottom - 6 - rows[k]! * 12.5,
			runs,
			size: 9,
			anchor: 'end',
			fill: b.style.stroke,
			cls: 'band-label'
		});
	});

	axes(prims, main, xTicks, ys.ticks(5), tick, !hasRes);
	prims.push({
		t: 'text',
		x: 14,
		y: M.t + main.h / 2,
		runs: labelRuns(f.ylabel),
		size: 12,
		anchor: 'middle',
		fill: INK,
		rotate: true,
		cls: 'axis-label'
	});

	// guides under everything else: reference curves, clipped to the main panel; they never set the axes' range
	for (const [i, g] of (f.guides ?? []).entries())
		prims.push({
			t: 'path',
			segs: segments(g.points, xs, ys),
			...guideStyle(i),
			clip: 0,
			cls: 'plot-guide'
		});
	if (f.markers) markerPrims(prims, f.markers.points, f.markers.errors, xs, ys, 0);
	// curves after the data, so the engine's line is never hidden under the markers
	for (const c of f.curves)
		prims.push({
			t: 'path',
			segs: segments(c.points, xs, ys),
			stroke: c.style.stroke,
			width: c.style.width,
			dash: c.style.dash,
			clip: 0,
			cls: 'series-path',
			col: c.column
		});

	let xLabelY = height - 6;
	if (hasRes) {
		const r = f.residual!;
		const top = MAIN_H + 6;
		const bottom = height - M.b;
		const rv = r.points.flatMap((p, i) => {
			const e = r.errors?.[i];
			return Number.isFinite(e) ? [p[1] - e!, p[1] + e!] : [p[1]];
		});
		const [ra, rb] = extent([...rv, 0], false);
		const rs = linearScale(niceDomain(ra, rb, 3), [bottom, top]);
		const rx = f.logX ? logScale(xs.domain, [M.l, right]) : linearScale(xs.domain, [M.l, right]);
		const panel: Panel = { x: M.l, y: top, w: right - M.l, h: bottom - top, xs: rx, ys: rs };
		panels.push(panel);
		axes(prims, panel, xTicks, rs.ticks(3), tick, true);
		prims.push({ t: 'line', x1: M.l, x2: right, y1: rs(0), y2: rs(0), stroke: INK, width: 1, opacity: 0.6, dash: '4 3' });
		prims.push({
			t: 'text',
			x: 14,
			y: top + panel.h / 2,
			runs: labelRuns(r.label),
			size: 9,
			anchor: 'middle',
			fill: INK,
			rotate: true,
			cls: 'residual-label'
		});
		markerPrims(prims, r.points, r.errors, rx, rs, 1);
		xLabelY = height - 6;
	}
	prims.push({
		t: 'text',
		x: (M.l + right) / 2,
		y: xLabelY,
		runs: labelRuns(f.xlabel),
		size: 12,
		anchor: 'middle',
		fill: INK,
		cls: 'axis-label'
	});

	legend(prims, f);
	return { width: W, height, panels, prims };
}

function axes(prims: Prim[], p: Panel, xTicks: number[], yTicks: number[], tick: (v: number) => LabelRun[], xNumbers: boolean) {
	const bottom = p.y + p.h;
	for (const t of xTicks) {
		prims.push({ t: 'line', x1: p.xs(t), x2: p.xs(t), y1: p.y, y2: bottom, stroke: INK, width: 1, opacity: 0.08 });
		if (xNumbers) prims.push({ t: 'text', x: p.xs(t), y: bottom + 14, runs: tick(t), size: 10, anchor: 'middle', fill: INK });
	}
	for (const t of yTicks) {
		prims.push({ t: 'line', x1: p.x, x2: p.x + p.w, y1: p.ys(t), y2: p.ys(t), stroke: INK, width: 1, opacity: 0.08 });
		prims.push({ t: 'text', x: p.x - 6, y: p.ys(t) + 3, runs: tick(t), size: 10, anchor: 'end', fill: INK });
	}
	prims.push({ t: 'line', x1: p.x, x2: p.x + p.w, y1: bottom, y2: bottom, stroke: INK, width: 1, opacity: 0.5 });
	prims.push({ t: 'line', x1: p.x, x2: p.x, y1: p.y, y2: bottom, stroke: INK, width: 1, opacity: 0.5 });
}

function markerPrims(prims: Prim[], pts: [number, number][], errors: number[] | undefined, xs: Scale, ys: Scale, clip: number) {
	pts.forEach(([x, y], i) => {
		if (!Number.isFinite(x) || !Number.isFinite(y) || (xs.log && x <= 0) || (ys.log && y <= 0)) return;
		const e = errors?.[i];
		if (Number.isFinite(e) && e! > 0 && !ys.log)
			prims.push({ t: 'line', x1: xs(x), x2: xs(x), y1: ys(y - e!), y2: ys(y + e!), stroke: DATASET_COLOUR, width: 1.2, cls: 'error-bar' });
		prims.push({ t: 'marker', x: xs(x), y: ys(y), r: 3, fill: DATASET_COLOUR, stroke: DATASET_COLOUR, clip });
	});
}

function legend(prims: Prim[], f: FigureSpec) {
	const x = M.l + 10;
	let y = M.t + 6;
	/** one legend row: its swatch (a line or a marker) at the row's height, then its label */
	const entry = (swatch: (y: number) => Prim, text: string) => {
		prims.push(swatch(y));
		prims.push({ t: 'text', x: x + 28, y: y + 8, runs: labelRuns(text), size: 10, anchor: 'start', fill: INK, cls: 'legend-text' });
		y += 14;
	};
	const line =
		(style: { stroke: string; width: number; dash?: string }, cls: string) =>
		(at: number): Prim => ({
			t: 'line',
			x1: x,
			x2: x + 22,
			y1: at + 4,
			y2: at + 4,
			stroke: style.stroke,
			width: style.width,
			dash: style.dash,
			cls
		});
	for (const c of f.curves) entry(line(c.style, 'legend-line'), c.legend);
	if (f.markers) {
		entry(
			(at) => ({ t: 'marker', x: x + 11, y: at + 4, r: 3, fill: DATASET_COLOUR, stroke: DATASET_COLOUR, clip: -1 }),
			f.markers.legend + (f.markers.errors ? '\\;\\pm\\sigma' : '')
		);
	}
	for (const [i, g] of (f.guides ?? []).entries()) entry(line(guideStyle(i), 'legend-line legend-guide'), g.legend);
	if (f.bands.length) {
		prims.push({
			t: 'text',
			x,
			y: y + 8,
			runs: plain(bandLegend(f.tolerance)),
			size: 9,
			anchor: 'start',
			fill: INK,
			cls: 'legend-text'
		});
	}
}

/** 0.001 → 1e-3, 0.00025 → 2.5e-4: how a tolerance is written in a paper. */
export function tolText(t: number): string {
	return t
		.toExponential()
		.replace('e+', 'e')
		.replace(/\.?0+e/, 'e');
}

/** The shading's legend line: what the band means and the relative tolerance it was found with. */
export function bandLegend(tolerance: number | undefined): string {
	return tolerance !== undefined
		? `shaded: series within ${tolText(tolerance)} of exact (relative), ℓ ≤ ℓ_max`
		: 'shaded: order reliable, ℓ ≤ ℓ_max';
}
