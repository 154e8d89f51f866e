/**
 * Curve colours and dash patterns. Colours are from the Okabe–Ito colour-blind-safe set (Okabe & Ito,
 * "Color Universal Design", 2008), keeping only those whose contrast is at least 3:1 (WCAG 2.1's figure for
 * graphical objects) against both the exported white page and the dark-mode plot background — the set's
 * orange, sky blue and yellow fall under it on white and are left out. Every order also has its own dash
 * pattern, so colour is never the only thing telling curves apart (grey-scale prints, colour-blind readers).
 * `ink` is the text colour: `currentColor` on screen (dark or light), a fixed dark ink in files.
 */
export interface CurveStyle {
	stroke: string;
	/** SVG dash array in px ('' = solid) */
	dash: string;
	width: number;
}

export const INK = 'ink';
export const INK_FILE = '#1c2230';
/** the page's dark plot background (tailwind night-deep) and the file's white */
export const BACKGROUNDS = { light: '#ffffff', dark: '#0b0f0e' } as const;

/** vermillion, blue, reddish purple, bluish green, and a dark-mode-safe amber and grey-blue for orders 5–6 */
export const ORDER_COLOURS = ['#D55E00', '#0072B2', '#CC79A7', '#009E73', '#B07D00', '#6A7FA8'];
export const ORDER_DASHES = ['6 3', '2 2', '8 3 2 3', '1 3', '10 4', '4 2 1 2'];
export const DATASET_COLOUR = '#009E73';
/**
 * Reference curves (plot guides) are reading aids, not data: thin dashed neutral grey, 3.3:1 against white and
 * 6:1 against the dark background (WCAG 2.1 relative luminance, computed), so they show and never compete.
 */
export const GUIDE_STYLE: CurveStyle = { stroke: '#8C8C8C', dash: '5 3', width: 1 };
/** one dash pattern per guide of a figure (thermal value, early law, linear growth…), so their legend lines differ */
export const GUIDE_DASHES = ['5 3', '1 3', '9 3 2 3'];

export function guideStyle(index: number): CurveStyle {
	return { ...GUIDE_STYLE, dash: GUIDE_DASHES[index % GUIDE_DASHES.length]! };
}

export function curveStyle(column: string, index: number, overlay: boolean): CurveStyle {
	if (overlay) {
		// in an overlay every curve gets its own colour and dash by position; the first stays solid ink
		if (index === 0) return { stroke: INK, dash: '', width: 2 };
		const i = (index - 1) % ORDER_COLOURS.length;
		return { stroke: ORDER_COLOURS[i]!, dash: ORDER_DASHES[i]!, width: 1.8 };
	}
	if (column === 'exact' || column === 'engine') return { stroke: INK, dash: '', width: 2 };
	const m = /^o(\d+)$/.exec(column);
	const k = m ? Number(m[1]) - 1 : index;
	const i = ((k % ORDER_COLOURS.length) + ORDER_COLOURS.length) % ORDER_COLOURS.length;
	return { stroke: ORDER_COLOURS[i]!, dash: ORDER_DASHES[i]!, width: 1.7 };
}

/** WCAG relative luminance of #rrggbb. */
export function luminance(hex: string): number {
	const c = [1, 3, 5]
		.map((i) => parseInt(hex.slice(i, i + 2), 16) / 255)
		.map((v) => (v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
	return 0.2126 * c[0]! + 0.7152 * c[1]! + 0.0722 * c[2]!;
}

export function contrast(a: string, b: string): number {
	const [x, y] = [luminance(a), luminance(b)].sort((p, q) => q - p) as [number, number];
	return (x + 0.05) / (y + 0.05);
}
