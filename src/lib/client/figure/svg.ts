/**
 * A laid-out figure as SVG text: the same string is shown on the page (ink = currentColor, so dark mode works)
 * and saved as a file (ink = a fixed dark colour on white, the font named, no page CSS needed).
 */
import { INK, INK_FILE } from './palette';
import type { Prim, Scene } from './layout';
import type { LabelRun } from './texlabel';

const esc = (s: string) => s.replace(/[&<>"]/g, (c) => `&#${c.charCodeAt(0)};`);
const f2 = (v: number) => (Number.isFinite(v) ? Number(v.toFixed(2)) : 0);

function runsSvg(runs: LabelRun[], size: number): string {
	let shift = 0;
	return runs
		.map((r) => {
			const target = r.shift * size * 0.35;
			const dy = -(target - shift);
			shift = target;
			const attrs = [
				dy ? `dy="${f2(dy)}"` : '',
				r.shift ? `font-size="${f2(size * 0.72)}"` : '',
				r.italic ? 'font-style="italic"' : ''
			].filter(Boolean);
			return `<tspan${attrs.length ? ' ' + attrs.join(' ') : ''}>${esc(r.text)}</tspan>`;
		})
		.join('');
}

function prim(p: Prim, ink: string, clipId: (i: number) => string): string {
	const col = (c: string) => (c === INK ? ink : c);
	const cls = 'cls' in p && p.cls ? ` class="${p.cls}"` : '';
	const dataCol = 'col' in p && p.col ? ` data-col="${esc(p.col)}"` : '';
	switch (p.t) {
		case 'line':
			return `<line${cls} x1="${f2(p.x1)}" y1="${f2(p.y1)}" x2="${f2(p.x2)}" y2="${f2(p.y2)}" stroke="${col(p.stroke)}" stroke-width="${p.width}"${p.dash ? ` stroke-dasharray="${p.dash}"` : ''}${p.opacity !== undefined ? ` stroke-opacity="${p.opacity}"` : ''}/>`;
		case 'path': {
			const d = p.segs.map((s) => s.map(([x, y], i) => `${i ? 'L' : 'M'}${f2(x)},${f2(y)}`).join('')).join('');
			return `<path${cls}${dataCol} d="${d}" fill="none" stroke="${col(p.stroke)}" stroke-width="${p.width}" stroke-linejoin="round"${p.dash ? ` stroke-dasharray="${p.dash}"` : ''} clip-path="url(#${clipId(p.clip)})"/>`;
		}
		case 'rect':
			return `<rect${cls}${dataCol} x="${f2(p.x)}" y="${f2(p.y)}" width="${f2(p.w)}" height="${f2(p.h)}" fill="${col(p.fill)}" fill-opacity="${p.opacity}"/>`;
		case 'marker': {
			// a diamond: shape as well as colour marks the data
			const r = p.r * 1.3;
			return `<path class="data-marker" d="M${f2(p.x)},${f2(p.y - r)}L${f2(p.x + r)},${f2(p.y)}L${f2(p.x)},${f2(p.y + r)}L${f2(p.x - r)},${f2(p.y)}Z" fill="${col(p.fill)}" stroke="${col(p.stroke)}"${p.clip >= 0 ? ` clip-path="url(#${clipId(p.clip)})"` : ''}/>`;
		}
		case 'text': {
			const anchor = p.anchor === 'start' ? '' : ` text-anchor="${p.anchor}"`;
			const rot = p.rotate ? ` transform="rotate(-90 ${f2(p.x)} ${f2(p.y)})"` : '';
			return `<text${cls} x="${f2(p.x)}" y="${f2(p.y)}" font-size="${p.size}"${anchor} fill="${col(p.fill)}"${rot}>${runsSvg(p.runs, p.size)}</text>`;
		}
	}
}

/** The figure's SVG. `file`: standalone (namespace, size, white background, fixed ink, font family). */
export function sceneSvg(s: Scene, opts: { file: boolean; id: string; label: string }): string {
	const ink = opts.file ? INK_FILE : 'currentColor';
	const clipId = (i: number) => `${opts.id}-clip${i}`;
	const clips = s.panels.map(
		(p, i) => `<clipPath id="${clipId(i)}"><rect x="${f2(p.x)}" y="${f2(p.y)}" width="${f2(p.w)}" height="${f2(p.h)}"/></clipPath>`
	);
	const head = opts.file
		? `<svg xmlns="http://www.w3.org/2000/svg" width="${s.width}" height="${s.height}" viewBox="0 0 ${s.width} ${s.height}" font-family="IBM Plex Mono, DejaVu Sans Mono, monospace">` +
			`<rect width="100%" height="100%" fill="#ffffff"/>`
		: `<svg viewBox="0 0 ${s.width} ${s.height}" role="img" aria-label="${esc(opts.label)}" class="figure-svg">`;
	return `${head}<title>${esc(opts.label)}</title><defs>${clips.join('')}</defs>${s.prims.map((p) => prim(p, ink, clipId)).join('')}</svg>`;
}
