import katex from 'katex';

/**
 * KaTeX for formulas that anyone could have written (a transcript may come from an imported file): no
 * \href/\url/\includegraphics or HTML extensions (trust:false), bounded macro expansion and sizes, and a bad
 * formula renders as red source text instead of throwing.
 */
export function renderFormula(latex: string, displayMode = true): string {
	return katex.renderToString(latex, {
		displayMode,
		trust: false,
		maxExpand: 500,
		maxSize: 20,
		throwOnError: false,
		strict: 'ignore',
		output: 'htmlAndMathml'
	});
}

/** 10 significant digits, the engine's accuracy; null is how JSON stored a non-finite number. */
export function showNumber(v: unknown): string {
	if (v === null || v === undefined) return '—';
	if (typeof v !== 'number') return String(v);
	if (Number.isInteger(v) && Math.abs(v) < 1e15) return String(v);
	return Number.isFinite(v) ? String(Number(v.toPrecision(10))) : String(v);
}

/** A relative drift: three significant digits are plenty to judge it against the 1e-8 tolerance. */
export function showDelta(d: number): string {
	return d === 0 ? '0' : d.toExponential(2).replace('e', '×10^').replace('^+', '^');
}
