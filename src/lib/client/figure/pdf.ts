/**
 * A laid-out figure as a one-page vector PDF (PDF 1.4), written here rather than through a PDF library: the
 * figure is only lines, filled shapes and short labels, and this file is loaded on demand when the PDF button
 * is pressed, so the pad page carries none of it. Text uses the standard Helvetica and Symbol fonts (no
 * embedding needed): Latin-1 in Helvetica (WinAnsi), Greek letters and a few signs in Symbol, ℓ as an italic l.
 * One SVG unit is 0.75 pt, so the PDF has the physical size a 96-dpi screen shows.
 */
import { INK, INK_FILE } from './palette';
import type { Prim, Scene } from './layout';
import type { LabelRun } from './texlabel';

const K = 0.75;
/** Unicode → Symbol font code (Adobe's Symbol encoding). */
const SYMBOL: Record<string, number> = {
	α: 0x61,
	β: 0x62,
	γ: 0x67,
	δ: 0x64,
	ε: 0x65,
	ζ: 0x7a,
	η: 0x68,
	θ: 0x71,
	κ: 0x6b,
	λ: 0x6c,
	μ: 0x6d,
	ν: 0x6e,
	ξ: 0x78,
	π: 0x70,
	ρ: 0x72,
	σ: 0x73,
	τ: 0x74,
	φ: 0x66,
	χ: 0x63,
	ψ: 0x79,
	ω: 0x77,
	Γ: 0x47,
	Δ: 0x44,
	Θ: 0x51,
	Λ: 0x4c,
	Π: 0x50,
	Σ: 0x53,
	Φ: 0x46,
	Ψ: 0x59,
	Ω: 0x57,
	'∂': 0xb6,
	'∞': 0xa5,
	'≤': 0xa3,
	'≥': 0xb3,
	'≈': 0xbb,
	'→': 0xae,
	'∝': 0xb5,
	'−': 0x2d,
	'×': 0xb4,
	'∼': 0x7e,
	'⟨': 0xe1,
	'⟩': 0xf1
};
/** Helvetica advance widths (per 1000 em) for the characters a figure uses; others count as 556. */
const HELV: Record<string, number> = {
	' ': 278,
	'.': 278,
	',': 278,
	'-': 333,
	':': 278,
	'(': 333,
	')': 333,
	i: 222,
	l: 222,
	j: 222,
	f: 278,
	t: 278,
	r: 333,
	m: 833,
	w: 722,
	I: 278,
	W: 944,
	M: 833
};
const width = (ch: string, font: string) => (font === 'F2' ? 600 : (HELV[ch] ?? (/[A-Z]/.test(ch) ? 667 : 556))) / 1000;

function rgb(hex: string): string {
	const h = hex === INK ? INK_FILE : hex;
	return [1, 3, 5].map((i) => (parseInt(h.slice(i, i + 2), 16) / 255).toFixed(3)).join(' ');
}
const n = (v: number) => (Number.isFinite(v) ? Number(v.toFixed(2)) : 0).toString();
const pdfString = (bytes: number[]) =>
	'(' +
	bytes
		.map((b) =>
			b === 0x28 || b === 0x29 || b === 0x5c
				? '\\' + String.fromCharCode(b)
				: b < 32 || b > 126
					? '\\' + b.toString(8).padStart(3, '0')
					: String.fromCharCode(b)
		)
		.join('') +
	')';

/** Splits a run into pieces per font: F1 Helvetica, F3 Helvetica-Oblique, F2 Symbol. */
function pieces(r: LabelRun): { font: string; bytes: number[]; w: number }[] {
	const out: { font: string; bytes: number[]; w: number }[] = [];
	for (const ch of r.text) {
		let font = r.italic ? 'F3' : 'F1';
		let code = ch.codePointAt(0)!;
		if (ch === 'ℓ') {
			font = 'F3';
			code = 0x6c;
		} else if (ch in SYMBOL) {
			font = 'F2';
			code = SYMBOL[ch]!;
		} else if (ch === '·') code = 0xb7;
		else if (code > 0xff) code = 0x3f;
		const last = out[out.length - 1];
		const w = width(String.fromCharCode(code), font);
		if (last && last.font === font) {
			last.bytes.push(code);
			last.w += w;
		} else out.push({ font, bytes: [code], w });
	}
	return out;
}

function textOps(p: Extract<Prim, { t: 'text' }>, H: number): string[] {
	const parts = p.runs.map((r) => ({ r, size: r.shift ? p.size * 0.72 : p.size, ps: pieces(r) }));
	const total = parts.reduce((s, q) => s + q.ps.reduce((a, b) => a + b.w, 0) * q.size, 0);
	const start = p.anchor === 'start' ? 0 : p.anchor === 'middle' ? -total / 2 : -total;
	const x = p.x * K;
	const y = (H - p.y) * K;
	const ops = ['BT', `${rgb(p.fill)} rg`];
	ops.push(p.rotate ? `0 1 -1 0 ${n(x)} ${n(y)} Tm` : `1 0 0 1 ${n(x)} ${n(y)} Tm`);
	ops.push(`${n(start * K)} 0 Td`);
	for (const q of parts) {
		ops.push(`${n(q.r.shift * p.size * 0.35 * K)} Ts`);
		for (const pc of q.ps) ops.push(`/${pc.font} ${n(q.size * K)} Tf ${pdfString(pc.bytes)} Tj`);
	}
	ops.push('0 Ts', 'ET');
	return ops;
}

function dashOp(dash?: string): string {
	return dash
		? `[${dash
				.split(/[ ,]+/)
				.map((v) => n(Number(v) * K))
				.join(' ')}] 0 d`
		: '[] 0 d';
}

/** The PDF file's bytes. */
export function scenePdf(s: Scene, title: string): Uint8Array<ArrayBuffer> {
	const H = s.height;
	const ops: string[] = ['1 1 1 rg', `0 0 ${n(s.width * K)} ${n(H * K)} re f`, '1 J 1 j'];
	const clip = (i: number) => {
		const p = s.panels[i];
		return p ? `${n(p.x * K)} ${n((H - p.y - p.h) * K)} ${n(p.w * K)} ${n(p.h * K)} re W n` : '';
	};
	const gs = new Set<number>();
	for (const p of s.prims) {
		switch (p.t) {
			case 'line': {
				const a = p.opacity ?? 1;
				if (a < 1) gs.add(Math.round(a * 100));
				ops.push('q', a < 1 ? `/A${Math.round(a * 100)} gs` : '', `${rgb(p.stroke)} RG ${n(p.width * K)} w ${dashOp(p.dash)}`);
				ops.push(`${n(p.x1 * K)} ${n((H - p.y1) * K)} m ${n(p.x2 * K)} ${n((H - p.y2) * K)} l S`, 'Q');
				break;
			}
			case 'path':
				ops.push('q', clip(p.clip), `${rgb(p.stroke)} RG ${n(p.width * K)} w ${dashOp(p.dash)}`);
				for (const seg of p.segs) ops.push(seg.map(([x, y], i) => `${n(x * K)} ${n((H - y) * K)} ${i ? 'l' : 'm'}`).join(' ') + ' S');
				ops.push('Q');
				break;
			case 'rect':
				gs.add(Math.round(p.opacity * 100));
				ops.push(
					'q',
					`/A${Math.round(p.opacity * 100)} gs`,
					`${rgb(p.fill)} rg ${n(p.x * K)} ${n((H - p.y - p.h) * K)} ${n(p.w * K)} ${n(p.h * K)} re f`,
					'Q'
				);
				break;
			case 'marker': {
				const r = p.r * 1.3 * K;
				const x = p.x * K;
				const y = (H - p.y) * K;
				ops.push(
					'q',
					p.clip >= 0 ? clip(p.clip) : '',
					`${rgb(p.fill)} rg`,
					`${n(x)} ${n(y + r)} m ${n(x + r)} ${n(y)} l ${n(x)} ${n(y - r)} l ${n(x - r)} ${n(y)} l h f`,
					'Q'
				);
				break;
			}
			case 'text':
				ops.push(...textOps(p, H));
		}
	}
	const content = ops.filter(Boolean).join('\n');
	const alphas = [...gs].map((a) => `/A${a} << /Type /ExtGState /CA ${a / 100} /ca ${a / 100} >>`).join(' ');
	const objects = [
		'<< /Type /Catalog /Pages 2 0 R >>',
		'<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
		`<< /Type /Page /Parent 2 0 R /MediaBox [0 0 ${n(s.width * K)} ${n(H * K)}] /Resources << /Font << /F1 4 0 R /F2 5 0 R /F3 6 0 R >> /ExtGState << ${alphas} >> >> /Contents 7 0 R >>`,
		'<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica /Encoding /WinAnsiEncoding >>',
		'<< /Type /Font /Subtype /Type1 /BaseFont /Symbol >>',
		'<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica-Oblique /Encoding /WinAnsiEncoding >>',
		`<< /Length ${content.length} >>\nstream\n${content}\nendstream`,
		`<< /Title ${pdfString([...title.slice(0, 120)].map((c) => (c.codePointAt(0)! <= 0xff ? c.codePointAt(0)! : 0x3f)))} /Producer (Bulkpad) >>`
	];
	let out = '%PDF-1.4\n%\xe2\xe3\xcf\xd3\n';
	const offsets: number[] = [];
	objects.forEach((o, i) => {
		offsets.push(out.length);
		out += `${i + 1} 0 obj\n${o}\nendobj\n`;
	});
	const xref = out.length;
	out += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n` + offsets.map((o) => `${String(o).padStart(10, '0')} 00000 n \n`).join('');
	out += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R /Info ${objects.length} 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
	// every character above is one byte (Latin-1 at most), so offsets counted in characters are byte offsets
	return Uint8Array.from(out, (c) => c.charCodeAt(0) & 0xff);
}
