import { eq } from 'drizzle-orm';
import { getDb, schema } from '../db';
import { newId } from '../auth/accounts';
import type { AppUser } from '../auth/guards';
import { createPad, type PadRow } from '../pads';
import type { BulkState, LetValue, Result, StepError, StepRef, UnitsState } from '../../lang/result';
import type { PadDocument } from './schema';

/**
 * Creates a pad of the user's with the document's steps recorded as they were (nothing is re-evaluated:
 * a replay shows whether they still reproduce). A step exported while still running is recorded as an error,
 * so nothing waits for an evaluation that will never come.
 */
export function importPad(user: AppUser, doc: PadDocument): PadRow {
	const db = getDb();
	return db.transaction(() => {
		const pad = createPad(user.id, doc.title, {
			bulk: doc.bulk as BulkState,
			units: doc.units as UnitsState,
			lets: (doc.lets ?? {}) as Record<string, LetValue>
		});
		// Up/Down recall works in the imported pad as it did in the original (pads.ts keeps the newest 200)
		const history = doc.steps.map((s) => s.input).slice(-200);
		db.update(schema.pads).set({ history }).where(eq(schema.pads.id, pad.id)).run();
		for (const s of doc.steps) {
			const pending = s.status === 'pending';
			db.insert(schema.steps)
				.values({
					id: newId(),
					padId: pad.id,
					n: s.n,
					input: s.input,
					status: pending ? 'error' : s.status,
					// the document's schema (schema.ts) has checked these shapes; extra fields are kept as they came
					results: s.status === 'ok' ? (s.results as Result[]) : null,
					error: pending
						? { message: 'was still being evaluated when the pad was exported', start: 0, end: s.input.length }
						: s.status === 'error'
							? (s.error as StepError)
							: null,
					ref: s.status === 'ok' ? ((s.ref as StepRef | undefined) ?? null) : null,
					bulkBefore: (s.bulkBefore as BulkState | undefined) ?? null
				})
				.run();
		}
		return { ...pad, history };
	});
}
