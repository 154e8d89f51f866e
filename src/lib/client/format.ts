/** Number display shared by results, tables, plots and exports. */

/** Short display: 6 significant figures, exponent form outside [1e-4, 1e6). */
export function formatNumber(x: number | string | null | undefined, digits = 6): string {
	if (x === null || x === undefined) return '—';
	if (typeof x === 'string') return x;
	if (Number.isNaN(x)) return 'NaN';
	if (!Number.isFinite(x)) return x > 0 ? '∞' : '−∞';
	if (x === 0) return '0';
	const a = Math.abs(x);
	const s = a >= 1e-4 && a < 1e6 ? String(Number(x.toPrecision(digits))) : x.toExponential(digits - 1).replace(/\.?0+e/, 'e');
	return s.replace('-', '−');
}

/** Full precision for copying: what a script reading the CSV needs (round-trips the double). */
export function exactNumber(x: number | string | null | undefined): string {
	if (x === null || x === undefined) return '';
	if (typeof x === 'string') return x;
	return String(x);
}

/** A column name as a reader expects it: `o3` → "order 3". */
export function columnTitle(name: string): string {
	const m = /^o(\d+)$/.exec(name);
	return m ? `order ${m[1]}` : name;
}

/** Badge text for a result's order. */
export function orderBadge(order: number | 'exact' | undefined): string | undefined {
	if (order === undefined) return undefined;
	return order === 'exact' ? 'exact' : `order ${order}`;
}
