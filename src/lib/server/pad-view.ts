import { z } from 'zod';
import type { PadRow, StepRow } from './pads';
import type { AttemptRow, StepVersionRow } from './steps';
import { ownerName } from './transcripts';

/**
 * Control characters (C0, DEL, C1), line and paragraph separators, and bidirectional overrides and isolates,
 * which can make a title read differently from what it is (a reversed file name in a list or a mail subject).
 */
const HIDDEN_CHARACTERS = /[\p{Cc}\u2028\u2029\u202a-\u202e\u2066-\u2069]/u;
export const MAX_TITLE_LENGTH = 200;

/** A pad title: one line of visible text, so it is safe in a mail subject, a file name and a page title. */
export const titleSchema = z
	.string()
	.trim()
	.min(1, 'Give the pad a title.')
	.max(MAX_TITLE_LENGTH, `Keep the title under ${MAX_TITLE_LENGTH} characters.`)
	.regex(/^[^\r\n\t]*$/, 'A title is one line.')
	.refine((t) => !HIDDEN_CHARACTERS.test(t), 'A title may not contain control characters or direction overrides.');

/**
 * A pad's validity tolerance: relative, strictly between 0 and 1 as the engine's validity demands; below
 * 1e-12 the bisection (1e-6 relative in l) and double precision say nothing finer.
 */
export const validityTolSchema = z
	.number({ error: 'The validity tolerance is a number, e.g. 1e-3.' })
	.min(1e-12, 'Keep the validity tolerance at least 1e-12.')
	.max(0.5, 'Keep the validity tolerance at most 0.5 (it is relative).');

/** GET /api/pads/[id]'s shape (API.md). */
export function padView(pad: PadRow, owner = ownerName(pad)) {
	return {
		id: pad.id,
		title: pad.title,
		bulk: pad.bulk,
		units: pad.units,
		lets: pad.lets,
		history: pad.history,
		/** null: the default validity tolerance (1e-3 relative) */
		validityTol: pad.validityTol ?? null,
		createdAt: pad.createdAt,
		updatedAt: pad.updatedAt,
		owner: { name: owner }
	};
}

export function stepView(s: StepRow) {
	return {
		id: s.id,
		n: s.n,
		input: s.input,
		status: s.status,
		results: s.results,
		error: s.error,
		ms: s.ms,
		name: s.name,
		hidden: s.hiddenAt !== null,
		version: s.version,
		/** labels typed for the step's figures, by result index (null: the defaults) */
		figureLabels: s.figureLabels ?? null
	};
}

/** An earlier version of a step (the step itself holds the newest). */
export function versionView(v: StepVersionRow) {
	return {
		version: v.version,
		input: v.input,
		status: v.status,
		results: v.results,
		error: v.error,
		ms: v.ms,
		createdAt: v.createdAt,
		replacedAt: v.replacedAt
	};
}

/** A failed line: no number, never exported or shared; `afterN` places it in the pad, `forN` when it re-ran a step. */
export function attemptView(a: AttemptRow) {
	return {
		id: a.id,
		input: a.input,
		status: a.status,
		error: a.error,
		afterN: a.afterN,
		forN: a.forN,
		dismissed: a.dismissedAt !== null,
		createdAt: a.createdAt
	};
}
