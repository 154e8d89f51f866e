/**
 * Labels typed in a figure's label editor, kept with the step (steps.figure_labels) by result index, so a
 * reload, another reader of the pad and a snapshot show the figure as its owner labelled it. The labels are
 * LaTeX over the figure's defaults; an empty set of edits removes the entry.
 */
import { eq } from 'drizzle-orm';
import { z } from 'zod';
import { getDb, schema } from './db';
import type { FigureLabels } from './db/schema';
import type { StepRow } from './pads';

const label = z.string().max(200);
export const figureLabelsSchema = z
	.object({
		xlabel: label.optional(),
		ylabel: label.optional(),
		legends: z
			.record(z.string().max(100), label)
			.refine((r) => Object.keys(r).length <= 64, 'at most 64 legend labels')
			.optional()
	})
	.strict();

/** `{ "<result index>": labels | null }`: null (or nothing left after trimming) clears that figure's labels. */
export const figureLabelsPatchSchema = z
	.record(z.string().regex(/^\d{1,3}$/, 'a result index'), figureLabelsSchema.nullable())
	.refine((r) => Object.keys(r).length <= 32, 'at most 32 figures');

/** Edits with the blanks left out (a blank field means the default), or null when nothing is left. */
function tidy(l: FigureLabels | null): FigureLabels | null {
	if (!l) return null;
	const out: FigureLabels = {};
	if (l.xlabel?.trim()) out.xlabel = l.xlabel.trim();
	if (l.ylabel?.trim()) out.ylabel = l.ylabel.trim();
	const legends = Object.fromEntries(
		Object.entries(l.legends ?? {})
			.filter(([, v]) => v.trim())
			.map(([k, v]) => [k, v.trim()])
	);
	if (Object.keys(legends).length) out.legends = legends;
	return Object.keys(out).length ? out : null;
}

/** Merges the patch into the step's labels and stores them; answers the step as it is now. */
export function setFigureLabels(step: StepRow, patch: Record<string, FigureLabels | null>): StepRow {
	const next: Record<string, FigureLabels> = { ...(step.figureLabels ?? {}) };
	for (const [i, l] of Object.entries(patch)) {
		const t = tidy(l);
		if (t) next[i] = t;
		else delete next[i];
	}
	const figureLabels = Object.keys(next).length ? next : null;
	getDb().update(schema.steps).set({ figureLabels }).where(eq(schema.steps.id, step.id)).run();
	return { ...step, figureLabels };
}
