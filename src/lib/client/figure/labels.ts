/**
 * Where a figure finds the labels typed for it before and where it keeps new ones: the step that shows it
 * provides both (StepView, from the step's stored figureLabels), and the result around it says which of the
 * step's results the figure is (ResultView). A figure with no provider (a transcript, an old embed) keeps its
 * edits for the page's lifetime only.
 */
import { getContext, setContext } from 'svelte';
import type { LabelEdits } from './spec';

const STORE = Symbol('bulkpad-figure-labels');
const INDEX = Symbol('bulkpad-result-index');

export interface FigureLabelStore {
	get(index: number): LabelEdits | undefined;
	/** absent when the reader may not change the pad */
	save?: (index: number, labels: LabelEdits | null) => Promise<string | null>;
}

export function provideFigureLabels(store: FigureLabelStore) {
	setContext(STORE, store);
}
export function provideResultIndex(index: number) {
	setContext(INDEX, index);
}

/** The labels store and this figure's result index, when the figure sits in a step that keeps labels. */
export function figureLabelSlot(): { store: FigureLabelStore; index: number } | undefined {
	const store = getContext<FigureLabelStore | undefined>(STORE);
	const index = getContext<number | undefined>(INDEX);
	return store && index !== undefined ? { store, index } : undefined;
}

/** Edits with blanks dropped (a blank means the default), or null when nothing is left to keep. */
export function keptLabels(e: LabelEdits): LabelEdits | null {
	const out: LabelEdits = {};
	if (e.xlabel?.trim()) out.xlabel = e.xlabel.trim();
	if (e.ylabel?.trim()) out.ylabel = e.ylabel.trim();
	const legends = Object.fromEntries(
		Object.entries(e.legends ?? {})
			.filter(([, v]) => v?.trim())
			.map(([k, v]) => [k, v.trim()])
	);
	if (Object.keys(legends).length) out.legends = legends;
	return Object.keys(out).length ? out : null;
}
