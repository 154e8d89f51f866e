/**
 * A figure as pgfplots code that plain pdflatex compiles (ASCII only: labels are LaTeX, never raw Unicode).
 * `standalone` wraps it in a minimal article; otherwise it is the tikzpicture to paste under
 * \usepackage{pgfplots}. Same curves, colours, dash patterns, bands, markers and residual panel as the screen.
 */
import { exactNumber } from '$lib/client/format';
import { GUIDE_STYLE, INK, INK_FILE, ORDER_COLOURS, guideStyle } from './palette';
import { layoutFigure, tolText } from './layout';
import type { FigureSpec } from './spec';
import { texForPgf } from './texlabel';

const colourName = (hex: string) =>
	hex === INK
		? 'bpink'
		: hex === GUIDE_STYLE.stroke
			? 'bpguide'
			: `bp${ORDER_COLOURS.indexOf(hex) >= 0 ? ORDER_COLOURS.indexOf(hex) : 'data'}`;
/** pgf's dash pattern from an SVG dash array (px → pt) */
function dash(d: string): string {
	if (!d) return 'solid';
	const v = d.split(/[ ,]+/).map((x) => Number(x) * 0.75);
	const pairs: string[] = [];
	for (let i = 0; i + 1 < v.length; i += 2) pairs.push(`on ${v[i]}pt off ${v[i + 1]}pt`);
	return `dash pattern=${pairs.join(' ')}`;
}
const ok = (x: number, log: boolean) => Number.isFinite(x) && (!log || x > 0);
const coords = (pts: [number, number][], logX: boolean, logY: boolean) => {
	const c = pts.filter(([x, y]) => ok(x, logX) && ok(y, logY)).map(([x, y]) => `(${exactNumber(x)},${exactNumber(y)})`);
	const lines: string[] = [];
	for (let j = 0; j < c.length; j += 6) lines.push('  ' + c.slice(j, j + 6).join(' '));
	return lines;
};
/** TeX comment text: ASCII only, one line */
const comment = (s: string) =>
	s
		.replace(/[^\x20-\x7e]/g, '?')
		.replace(/[\r\n]/g, ' ')
		.slice(0, 160);

export function figurePgf(f: FigureSpec, opts: { standalone?: boolean } = {}): string {
	const colours = new Map<string, string>();
	const use = (hex: string) => {
		const name = colourName(hex);
		colours.set(name, (hex === INK ? INK_FILE : hex).slice(1).toUpperCase());
		return name;
	};
	const res = f.residual && f.residual.points.some((p) => Number.isFinite(p[1])) ? f.residual : null;
	const body: string[] = [];
	// guides must not widen the axes (pgfplots fits every \addplot): with guides the main panel's range is the
	// screen layout's, and pgfplots clips the guides to it
	const guides = f.guides ?? [];
	const box = guides.length ? layoutFigure({ ...f, guides: [] }).panels[0] : undefined;
	const limits = box
		? [
				`xmin=${exactNumber(Math.min(...box.xs.domain))}, xmax=${exactNumber(Math.max(...box.xs.domain))}`,
				`ymin=${exactNumber(Math.min(...box.ys.domain))}, ymax=${exactNumber(Math.max(...box.ys.domain))}`
			]
		: [];
	const axisOpts = [
		res ? 'name=main, xticklabels={}' : `xlabel={${texForPgf(f.xlabel)}}`,
		`ylabel={${texForPgf(f.ylabel)}}`,
		f.logX ? 'xmode=log' : null,
		f.logY ? 'ymode=log' : null,
		f.integerX ? 'xtick distance=1' : null,
		'width=0.8\\linewidth, height=6cm',
		'legend pos=north west, legend cell align=left',
		'grid=major, grid style={black!10}',
		...limits
	].filter(Boolean);
	body.push(`\\begin{axis}[${axisOpts.join(', ')}]`);
	const legend: string[] = [];
	if (f.markers) {
		const c = use(f.markers.legend ? '#009E73' : '#009E73');
		const hasErr = !!f.markers.errors && !f.logY;
		body.push(`\\addplot[only marks, mark=diamond*, color=${c}${hasErr ? ', error bars/.cd, y dir=both, y explicit' : ''}] coordinates {`);
		const pts = f.markers.points
			.map((p, i) => ({ p, e: f.markers!.errors?.[i] }))
			.filter(({ p }) => ok(p[0], f.logX) && ok(p[1], f.logY))
			.map(({ p, e }) => `(${exactNumber(p[0])},${exactNumber(p[1])})${hasErr && Number.isFinite(e) ? ` +- (0,${exactNumber(e!)})` : ''}`);
		for (let j = 0; j < pts.length; j += 4) body.push('  ' + pts.slice(j, j + 4).join(' '));
		body.push('};');
		legend.push(texForPgf(f.markers.legend));
	}
	for (const c of f.curves) {
		const lines = coords(c.points, f.logX, f.logY);
		if (!lines.length) continue;
		body.push(
			`\\addplot[${dash(c.style.dash)}, line width=${(c.style.width * 0.5).toFixed(2)}pt, color=${use(c.style.stroke)}, no markers] coordinates {`,
			...lines,
			'};'
		);
		legend.push(texForPgf(c.legend));
	}
	for (const [i, g] of guides.entries()) {
		const lines = coords(g.points, f.logX, f.logY);
		if (!lines.length) continue;
		body.push(
			`\\addplot[${dash(guideStyle(i).dash)}, line width=${(GUIDE_STYLE.width * 0.5).toFixed(2)}pt, color=${use(GUIDE_STYLE.stroke)}, no markers] coordinates {`,
			...lines,
			'};'
		);
		legend.push(texForPgf(g.legend));
	}
	// validity: shaded to each order's l_max with a dashed edge, labelled at staggered heights so none overlap
	f.bands.forEach((b, k) => {
		if (!Number.isFinite(b.lmax) || (f.logX && b.lmax <= 0)) return;
		const c = use(b.style.stroke);
		const at = `{axis cs:${exactNumber(b.lmax)},1}`;
		body.push(`\\fill[${c}, opacity=0.06] ({rel axis cs:0,0}) rectangle (${at}|-{rel axis cs:0,1});`);
		body.push(
			`\\draw[${c}, densely dashed] (${at}|-{rel axis cs:0,0}) -- (${at}|-{rel axis cs:0,1}) node[pos=${(0.08 + 0.09 * k).toFixed(2)}, anchor=east, font=\\tiny] {${texForPgf(b.legend)}};`
		);
	});
	if (f.bands.length && f.tolerance !== undefined) {
		// the legend's note on the shading, in ASCII TeX: what the band means and the tolerance it was found with
		const tol = tolText(f.tolerance)
			.replace(/e(-?\d+)$/, (_, e) => `\\times 10^{${e}}`)
			.replace(/^1\\times /, '');
		body.push(
			`\\node[font=\\tiny, anchor=south east, fill=white, fill opacity=0.8, text opacity=1] at (rel axis cs:0.99,0.01) {shaded: series within $${tol}$ of exact (relative), $\\ell \\le \\ell_{\\max}$};`
		);
	}
	if (legend.length) body.push(`\\legend{${legend.map((l) => `{${l}}`).join(', ')}}`);
	body.push('\\end{axis}');
	if (res) {
		const resOpts = [
			'at={(main.south west)}, anchor=north west, yshift=-0.4cm',
			`xlabel={${texForPgf(f.xlabel)}}`,
			`ylabel={${texForPgf(res.label)}}`,
			f.logX ? 'xmode=log' : null,
			f.integerX ? 'xtick distance=1' : null,
			'width=0.8\\linewidth, height=3cm',
			'grid=major, grid style={black!10}'
		].filter(Boolean);
		const c = use('#009E73');
		const hasErr = !!res.errors;
		body.push(`\\begin{axis}[${resOpts.join(', ')}]`);
		body.push(`\\addplot[only marks, mark=diamond*, color=${c}${hasErr ? ', error bars/.cd, y dir=both, y explicit' : ''}] coordinates {`);
		const pts = res.points
			.map((p, i) => ({ p, e: res.errors?.[i] }))
			.filter(({ p }) => ok(p[0], f.logX) && Number.isFinite(p[1]))
			.map(({ p, e }) => `(${exactNumber(p[0])},${exactNumber(p[1])})${hasErr && Number.isFinite(e) ? ` +- (0,${exactNumber(e!)})` : ''}`);
		for (let j = 0; j < pts.length; j += 4) body.push('  ' + pts.slice(j, j + 4).join(' '));
		body.push('};', '\\draw[black!60, dashed] ({rel axis cs:0,0}|-{axis cs:0,0}) -- ({rel axis cs:1,0}|-{axis cs:0,0});', '\\end{axis}');
	}
	const defs = [...colours].map(([name, hex]) => `\\definecolor{${name}}{HTML}{${hex}}`);
	const picture = [`% ${comment(f.title)} (Bulkpad)`, ...defs, '\\begin{tikzpicture}', ...body, '\\end{tikzpicture}'];
	if (!opts.standalone) return ['% needs \\usepackage{pgfplots} and \\pgfplotsset{compat=1.16}', ...picture].join('\n') + '\n';
	return (
		[
			'\\documentclass{article}',
			'\\usepackage{pgfplots}',
			'\\pgfplotsset{compat=1.16}',
			'\\begin{document}',
			...picture,
			'\\end{document}'
		].join('\n') + '\n'
	);
}
