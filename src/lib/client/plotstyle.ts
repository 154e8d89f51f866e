/**
 * How each column of a sweep is drawn. Colours are literal hex (not CSS variables) so an exported SVG or
 * PNG looks the same outside the page; orders also differ by dash pattern, so a grey-scale print still
 * tells them apart.
 */
export interface SeriesStyle {
	stroke: string;
	dash: string;
	width: number;
}

const ORDER_COLOURS = ['#e0a050', '#c9731f', '#94500f', '#c2411c', '#7a2f19', '#5a3a7a', '#3a5a8a'];
const ORDER_DASHES = ['2 3', '7 3', '11 3 2 3', '4 2', '1 2', '9 2 2 2 2 2', '5 5'];

export const EXACT_STYLE: SeriesStyle = { stroke: '#1e7470', dash: '', width: 2.2 };
export const DATASET_COLOUR = '#3f7d3a';
export const INK = '#1c2230';

export function seriesStyle(column: string, index: number): SeriesStyle {
	if (column === 'exact') return EXACT_STYLE;
	const m = /^o(\d+)$/.exec(column);
	const k = m ? Number(m[1]) - 1 : index;
	const i = ((k % ORDER_COLOURS.length) + ORDER_COLOURS.length) % ORDER_COLOURS.length;
	return { stroke: ORDER_COLOURS[i]!, dash: ORDER_DASHES[i]!, width: 1.6 };
}
