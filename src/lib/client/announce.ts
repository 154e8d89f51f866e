/**
 * What a screen reader hears when a line finishes: the step it became and its first results in words, or why
 * it failed. Short on purpose: the full results are in the page, one Tab or arrow away.
 */
import type { Result } from '$lib/lang/result';
import { formatNumber } from './format';

function orderText(o: number | 'exact' | undefined): string {
	if (o === undefined) return '';
	return o === 'exact' ? ', exact' : `, order ${o}`;
}

export function describeResult(r: Result): string {
	switch (r.kind) {
		case 'scalar':
			return `${r.label} = ${formatNumber(r.value, 6)}${orderText(r.order)}${r.warning ? ` (warning: ${r.warning})` : ''}`;
		case 'record':
			return `${r.label}: ${Object.entries(r.fields)
				.slice(0, 4)
				.map(([k, v]) => `${k} = ${formatNumber(v, 6)}`)
				.join(', ')}`;
		case 'table':
			return `${r.label}: a table of ${r.rows.length} rows, columns ${r.columns.join(', ')}`;
		case 'series':
			return `${r.label}: a series of ${r.terms.length} terms`;
		case 'check':
			return `${r.label}: ${r.pass ? 'holds' : 'fails'}, residual ${formatNumber(r.residual, 3)}`;
		case 'figure':
			return `${r.label}: a figure of steps ${r.steps.map((n) => `#${n}`).join(', ')}`;
		case 'note':
			return r.text;
	}
}

/** "Step 4 (btz): ΔA = 0.0123, order 3." — at most three results, then how many more. */
export function announceStep(n: number | null, name: string | null | undefined, results: Result[]): string {
	const head = n === null ? 'Done' : `Step ${n}${name ? ` (${name})` : ''}`;
	const said = results.slice(0, 3).map(describeResult);
	const more = results.length > 3 ? ` and ${results.length - 3} more results` : '';
	return `${head}: ${said.join('; ') || 'no results'}${more}.`;
}

export function announceFailure(message: string): string {
	return `Not evaluated, kept as an attempt: ${message}. The line is selected in the input.`;
}
