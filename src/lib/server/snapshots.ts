/**
 * Share snapshots: a link shows its pad as it was when the link was made (a referee needs the pad *as
 * submitted*, not the 59 steps it has grown to since). The steps' inputs and recorded results are copied into
 * the share's row, so nothing the owner does to the pad later — new steps, re-runs, hiding — reaches a reader.
 *
 * Links made before snapshots existed have no copy. They are frozen the first time anyone opens them: a
 * migration may only be what drizzle-kit generates from schema.ts (no data copy in SQL), and the first open is
 * the earliest moment a reader can see the content, so from then on every reader sees the same thing.
 */
import { and, eq, isNull } from 'drizzle-orm';
import { getDb, schema } from './db';
import { ApiFailure } from './http';
import { padSteps, type PadRow, type StepRow } from './pads';
import type { ReplayStep } from './eval/service';
import type { PadSource } from './export/schema';
import type { BulkState, LetValue, UnitsState } from '../lang/result';

/** One step as a snapshot keeps it: a step row's recorded fields, its name when it had one. */
export type SnapshotStep = Pick<StepRow, 'n' | 'input' | 'status' | 'results' | 'error' | 'ref' | 'bulkBefore'> & {
	name?: string | null;
	/** labels typed for the step's figures (branch paper): a fork keeps them */
	figureLabels?: StepRow['figureLabels'];
};
/** What a snapshot holds: the export document's source shape (typed), so exports of a snapshot need nothing new. */
export interface Snapshot extends PadSource {
	bulk: BulkState;
	units: UnitsState;
	lets: Record<string, LetValue>;
	steps: SnapshotStep[];
	/** the pad's validity tolerance when frozen (absent: the default); a fork and a replay of the link use it */
	validityTol?: number;
}

export type ShareRow = typeof schema.shares.$inferSelect;

export const gone = () => new ApiFailure(404, 'No such transcript (the link may have been revoked or have expired).');

export function isLive(share: ShareRow, now = Date.now()): boolean {
	return !share.revokedAt && (!share.expiresAt || share.expiresAt.getTime() > now);
}

/**
 * The pad as a reader should see it now. This is the one place that decides what a snapshot copies: steps
 * still being evaluated are left out (they have no result yet).
 */
export function freezePad(pad: PadRow, steps: StepRow[] = padSteps(pad.id)): Snapshot {
	return {
		title: pad.title,
		bulk: pad.bulk,
		units: pad.units,
		lets: pad.lets,
		...(pad.validityTol != null ? { validityTol: pad.validityTol } : {}),
		steps: steps
			.filter((s) => s.status !== 'pending')
			.map((s) => ({
				n: s.n,
				input: s.input,
				status: s.status,
				results: s.results ?? null,
				error: s.error ?? null,
				ref: s.ref ?? null,
				bulkBefore: s.bulkBefore ?? null,
				...(s.name ? { name: s.name } : {}),
				...(s.figureLabels ? { figureLabels: s.figureLabels } : {})
			}))
	};
}

export interface OpenedShare {
	share: ShareRow;
	pad: PadRow;
	snapshot: Snapshot;
	frozenAt: Date;
}

/** The live link's pad and its frozen content; a link from before snapshots is frozen here, once. */
export function openShare(slug: string): OpenedShare {
	const db = getDb();
	return db.transaction((tx) => {
		const share = tx.select().from(schema.shares).where(eq(schema.shares.slug, slug)).get();
		if (!share || !isLive(share)) throw gone();
		const pad = tx.select().from(schema.pads).where(eq(schema.pads.id, share.padId)).get();
		if (!pad) throw gone();
		if (share.snapshot) return { share, pad, snapshot: share.snapshot as Snapshot, frozenAt: share.frozenAt ?? share.createdAt };
		const snapshot = freezePad(pad);
		const frozenAt = new Date();
		tx.update(schema.shares)
			.set({ snapshot, frozenAt })
			.where(and(eq(schema.shares.slug, slug), isNull(schema.shares.snapshot)))
			.run();
		return { share: { ...share, snapshot, frozenAt }, pad, snapshot, frozenAt };
	});
}

/**
 * The snapshot's steps in the shape replay and drift marking read (a step row's fields they use). The pad
 * is the live one only for its id and owner: whose datasets a `compare` step may read.
 */
export function snapshotStepRows(snapshot: Snapshot): ReplayStep[] {
	return snapshot.steps.map((s) => ({
		n: s.n,
		input: s.input,
		status: s.status,
		results: s.results,
		error: s.error,
		bulkBefore: s.bulkBefore ?? null,
		name: s.name ?? null
	}));
}
