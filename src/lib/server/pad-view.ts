import { z } from 'zod';
import type { PadRow, StepRow } from './pads';
import { ownerName } from './transcripts';

/** A pad title: one line, so it is safe in a mail subject, a file name and a page title. */
export const titleSchema = z
	.string()
	.trim()
	.min(1, 'Give the pad a title.')
	.max(200, 'Keep the title under 200 characters.')
	.regex(/^[^\r\n\t]*$/, 'A title is one line.');

/** GET /api/pads/[id]'s shape (API.md). */
export function padView(pad: PadRow, owner = ownerName(pad)) {
	return {
		id: pad.id,
		title: pad.title,
		bulk: pad.bulk,
		units: pad.units,
		lets: pad.lets,
		history: pad.history,
		createdAt: pad.createdAt,
		updatedAt: pad.updatedAt,
		owner: { name: owner }
	};
}

export function stepView(s: StepRow) {
	return { id: s.id, n: s.n, input: s.input, status: s.status, results: s.results, error: s.error, ms: s.ms };
}
