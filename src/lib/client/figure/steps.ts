/**
 * Where a `figure` result finds the tables of the steps it overlays: the console and the transcript page put
 * their steps in a Svelte context, and the figure reads each step's first plottable table from it. A figure
 * shown with no provider (an old embed) says so instead of drawing nothing.
 */
import { getContext, setContext } from 'svelte';
import type { Result, TableResult } from '$lib/lang/result';

const KEY = Symbol('bulkpad-figure-steps');
export type StepSource = () => { n: number | null; results: unknown }[];

export function provideSteps(source: StepSource) {
	setContext(KEY, source);
}

export function stepSource(): StepSource | undefined {
	return getContext<StepSource | undefined>(KEY);
}

/** The first table of a step with at least two numeric columns and more than one row (what a plot can draw). */
export function plottableTable(results: unknown): TableResult | undefined {
	if (!Array.isArray(results)) return undefined;
	return (results as Result[]).find(
		(r): r is TableResult =>
			r?.kind === 'table' &&
			Array.isArray(r.rows) &&
			r.rows.length > 1 &&
			r.columns.filter((_, i) => r.rows.some((row) => typeof row[i] === 'number')).length >= 2
	);
}
