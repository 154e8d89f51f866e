/** Number formatting shared by the Markdown and LaTeX exports: 10 significant digits, the engine's accuracy. */

export function formatNumber(v: unknown): string {
	if (v === null || v === undefined) return '—';
	if (typeof v === 'string') return v;
	if (typeof v !== 'number') return String(v);
	if (Number.isNaN(v)) return 'NaN';
	if (!Number.isFinite(v)) return v > 0 ? '∞' : '−∞';
	if (Number.isInteger(v) && Math.abs(v) < 1e15) return String(v);
	return String(Number(v.toPrecision(10)));
}

/** The same number for LaTeX math mode: `1.5e-7` → `1.5\times10^{-7}`. */
export function latexNumber(v: unknown): string {
	if (typeof v === 'number' && !Number.isFinite(v)) return Number.isNaN(v) ? '\\mathrm{NaN}' : v > 0 ? '\\infty' : '-\\infty';
	// only numbers reach math mode: anything else in a stored result (an imported file sets them) is a dash
	if (typeof v !== 'number') return '\\text{---}';
	const s = formatNumber(v);
	const m = /^(-?[\d.]+)e([+-]?\d+)$/.exec(s);
	if (!m) return s;
	return `${m[1]}\\times10^{${Number(m[2])}}`;
}

export function orderText(order: unknown): string {
	return order === 'exact' ? 'exact' : `order ${String(order)}`;
}
