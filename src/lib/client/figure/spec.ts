/**
 * What a figure shows, before any geometry: curves (one per numeric column, or per step and column in an
 * overlay), dataset markers with their error bars, the validity bands, and a residual panel for comparisons.
 * Built from the step tables the engine answered; labels are LaTeX (see texlabel.ts) and can be overridden.
 */
import type { TableResult } from '$lib/lang/result';
import { columnLegend, keyLabel, quantityLabel } from './texlabel';
import { curveStyle, type CurveStyle } from './palette';

export interface Curve {
	id: string;
	/** the table column it came from (kept on the SVG path as data-col) */
	column: string;
	legend: string;
	points: [number, number][];
	style: CurveStyle;
}
export interface Markers {
	legend: string;
	points: [number, number][];
	/** one standard deviation per point, when the dataset has an err/sigma column */
	errors?: number[];
}
export interface Band {
	column: string;
	lmax: number;
	legend: string;
	style: CurveStyle;
}
export interface Residual {
	label: string;
	points: [number, number][];
	errors?: number[];
}
/** A reference curve under the data (TableResult.plot.guides): LaTeX legend, points in plot coordinates. */
export interface Guide {
	legend: string;
	points: [number, number][];
}
export interface FigureSpec {
	title: string;
	xlabel: string;
	ylabel: string;
	curves: Curve[];
	markers: Markers | null;
	bands: Band[];
	residual: Residual | null;
	/** the x values are whole numbers (orders): ticks only at integers */
	integerX: boolean;
	logX: boolean;
	logY: boolean;
	/** shown in the legend: the tolerance the validity bands were computed with */
	tolerance?: number;
	/** reference curves: thin dashed grey, clipped to the plot box, never widening the axes */
	guides?: Guide[];
}

/** Labels a user typed over the defaults: x, y and per-curve legends by curve id. */
export interface LabelEdits {
	xlabel?: string;
	ylabel?: string;
	legends?: Record<string, string>;
}

const num = (v: unknown) => (typeof v === 'number' ? v : NaN);
/** a dataset's name as upright LaTeX text (`syn_zh` → \mathrm{syn\_zh}) */
const nameTex = (name: string) => `\\mathrm{${name.replace(/[^A-Za-z0-9_]/g, '').replace(/_/g, '\\_')}}`;
const isCompare = (t: TableResult) => !!t.plot?.dataset && t.columns.includes('engine') && t.columns.includes('dataset');

function xColumn(t: TableResult): number {
	return Math.max(0, t.columns.indexOf(t.plot?.x ?? t.columns[0]!));
}

/** Numeric columns of one table as curves; a comparison's engine column is the only curve. */
function tableCurves(t: TableResult, step?: number, offset = 0): Curve[] {
	const xi = xColumn(t);
	const skip = new Set([t.plot?.dataset, 'dataset', 'diff', 'sigma', 'err', 'pull']);
	const cols = t.columns
		.map((c, i) => ({ c, i }))
		.filter(({ c, i }) => i !== xi && !skip.has(c) && !/_err$/.test(c) && t.rows.some((r) => typeof r[i] === 'number'));
	return cols.map(({ c, i }, k) => ({
		id: step === undefined ? c : `#${step}:${c}`,
		column: c,
		legend: columnLegend(c, step),
		points: t.rows.map((r) => [num(r[xi]), num(r[i])] as [number, number]),
		style: curveStyle(c, offset + k, step !== undefined)
	}));
}

/**
 * The table's guides that can be drawn: two finite points at least (a stored result went through JSON, so
 * non-finite numbers are null; a guide whose window holds none of the plotted times has no points).
 */
function guidesOf(t: TableResult): Guide[] {
	return (t.plot?.guides ?? [])
		.map((g) => ({ legend: g.label, points: g.points.map((p) => [num(p[0]), num(p[1])] as [number, number]) }))
		.filter((g) => g.points.filter((p) => Number.isFinite(p[0]) && Number.isFinite(p[1])).length >= 2);
}

function integerValues(xs: number[]): boolean {
	const ok = xs.filter(Number.isFinite);
	return ok.length > 0 && ok.every((x) => Number.isInteger(x));
}

/** A figure of one step's table (the plot under a sweep or a comparison). */
export function figureOfTable(t: TableResult, opts: { logX?: boolean; logY?: boolean; tolerance?: number } = {}): FigureSpec {
	const xi = xColumn(t);
	const xName = t.columns[xi]!;
	const curves = tableCurves(t);
	const xs = t.rows.map((r) => num(r[xi]));
	let markers: Markers | null = null;
	let residual: Residual | null = null;
	if (isCompare(t)) {
		const di = t.columns.indexOf('dataset');
		const si = t.columns.indexOf('sigma');
		const errors = si >= 0 ? t.rows.map((r) => num(r[si])) : undefined;
		markers = {
			legend: nameTex(t.plot!.dataset ?? 'data'),
			points: t.rows.map((r) => [num(r[xi]), num(r[di])]),
			...(errors ? { errors } : {})
		};
		const fi = t.columns.indexOf('diff');
		residual = {
			label: '\\mathrm{data} - \\mathrm{engine}',
			// diff is engine − dataset in the table; the panel shows the data's deviation, as a referee reads it
			points: t.rows.map((r) => [num(r[xi]), -num(r[fi])]),
			...(errors ? { errors } : {})
		};
	} else if (t.plot?.dataset) {
		const di = t.columns.indexOf(t.plot.dataset);
		if (di >= 0) markers = { legend: nameTex(t.plot.dataset), points: t.rows.map((r) => [num(r[xi]), num(r[di])]) };
	}
	const bands = Object.entries(t.plot?.validity ?? {})
		.filter(([, lmax]) => Number.isFinite(lmax))
		.map(([c, lmax], k) => ({ column: c, lmax, legend: columnLegend(c), style: curveStyle(c, k, false) }));
	return {
		title: t.label,
		xlabel: keyLabel(xName),
		ylabel: isCompare(t) ? quantityLabel(t.label.split(' against ')[1] ?? t.label) : quantityLabel(t.label),
		curves,
		markers,
		bands,
		residual,
		integerX:
			xName === 'o' || xName === 'order' || xName === 'k' || (integerValues(xs) && xs.length <= 30 && xs.length > 1 && xName !== 'l'),
		logX: opts.logX ?? !!t.plot?.log,
		logY: opts.logY ?? !!t.plot?.log,
		...(opts.tolerance !== undefined ? { tolerance: opts.tolerance } : {}),
		...(guidesOf(t).length ? { guides: guidesOf(t) } : {})
	};
}

/**
 * Several steps on one figure (`plot #9 #35`): every curve of each step's first table, styled by its place in
 * the overlay. With two curves over the same x values, the residual panel shows the second minus the first.
 */
export function figureOfSteps(parts: { step: number; table: TableResult }[], opts: { logX?: boolean; logY?: boolean } = {}): FigureSpec {
	const curves: Curve[] = [];
	for (const p of parts) curves.push(...tableCurves(p.table, p.step, curves.length));
	const first = parts[0]?.table;
	const xNames = [...new Set(parts.map((p) => p.table.columns[xColumn(p.table)]!))];
	const ys = [...new Set(parts.map((p) => quantityLabel(p.table.label)))];
	let residual: Residual | null = null;
	const compared = parts.find((p) => isCompare(p.table));
	let markers: Markers | null = null;
	if (compared) {
		const one = figureOfTable(compared.table);
		markers = one.markers;
		residual = one.residual;
	} else if (curves.length === 2 && sameX(curves[0]!, curves[1]!)) {
		const [a, b] = curves as [Curve, Curve];
		residual = {
			label: `${b.legend} - ${a.legend}`.replace(/\\;/g, '\\,'),
			points: b.points.map((p, i) => [p[0], p[1] - a.points[i]![1]])
		};
	}
	// each step's guides, named by their step when several steps are overlaid
	const guides = parts.flatMap((p) =>
		guidesOf(p.table).map((g) => (parts.length > 1 ? { ...g, legend: `\\#${p.step}\\;${g.legend}` } : g))
	);
	return {
		title: parts.map((p) => `#${p.step}`).join(', '),
		xlabel: xNames.length === 1 ? keyLabel(xNames[0]!) : xNames.map(keyLabel).join(',\\;'),
		ylabel: ys.length === 1 ? ys[0]! : ys.join(',\\;'),
		curves,
		markers,
		bands: [],
		residual,
		integerX: xNames.every((x) => x === 'o' || x === 'k'),
		logX: opts.logX ?? !!first?.plot?.log,
		logY: opts.logY ?? !!first?.plot?.log,
		...(guides.length ? { guides } : {})
	};
}

function sameX(a: Curve, b: Curve): boolean {
	return (
		a.points.length === b.points.length && a.points.every((p, i) => Math.abs(p[0] - b.points[i]![0]) <= 1e-12 * Math.max(1, Math.abs(p[0])))
	);
}

/** The figure with the user's labels over the defaults (empty edits keep the default). */
export function withLabels(f: FigureSpec, e: LabelEdits): FigureSpec {
	return {
		...f,
		xlabel: e.xlabel?.trim() || f.xlabel,
		ylabel: e.ylabel?.trim() || f.ylabel,
		curves: f.curves.map((c) => ({ ...c, legend: e.legends?.[c.id]?.trim() || c.legend }))
	};
}

/** A file name keeping what the label says: Δ → delta, ℓ → ell (instead of dropping them). */
export function figureFileName(title: string): string {
	const words: Record<string, string> = { Δ: 'delta', ℓ: 'ell', μ: 'mu', τ: 'tau', κ: 'kappa', χ: 'chi', σ: 'sigma', '#': 'step' };
	return (
		[...title]
			.map((c) => (words[c] ? `-${words[c]}-` : c))
			.join('')
			.toLowerCase()
			.replace(/[^a-z0-9]+/g, '-')
			.replace(/^-|-$/g, '')
			.slice(0, 48)
			.replace(/-$/, '') || 'figure'
	);
}

export type { CurveStyle };
