import { and, count, desc, eq } from 'drizzle-orm';
import { randomBytes } from 'node:crypto';
import { getDb, schema } from './db';
import { env } from './env';
import { ApiFailure } from './http';
import { newId } from './auth/accounts';
import type { AppUser } from './auth/guards';
import { padSteps, type PadRow, type StepRow } from './pads';
import { freezePad, gone, isLive, type OpenedShare, type ShareRow, type Snapshot } from './snapshots';
import { copyDatasetsForFork, type ForkedDatasets } from './datasets';

export type { ShareRow } from './snapshots';

const DAY_MS = 24 * 60 * 60 * 1000;
export const NOTE_MAX = 200;

/**
 * A link's address. Answers to the owner use the origin they reached us on; mailed links use the configured
 * origin only, never a request's Host header (which a sender could forge to mail a lookalike link).
 */
export function shareUrl(slug: string, origin = env.origin): string {
	return `${origin}/t/${slug}`;
}

/**
 * A new read-only link to the pad as it is now (a snapshot: later steps never reach it); 96 random bits, so
 * links cannot be guessed. `note` is the owner's label, e.g. "as submitted v2".
 */
export function createShare(pad: PadRow, user: AppUser, expiresInDays?: number, note?: string): ShareRow {
	const now = new Date();
	const row: ShareRow = {
		slug: randomBytes(12).toString('base64url'),
		padId: pad.id,
		createdBy: user.id,
		expiresAt: expiresInDays ? new Date(Date.now() + expiresInDays * DAY_MS) : null,
		revokedAt: null,
		createdAt: now,
		note: note?.trim() ? note.trim().slice(0, NOTE_MAX) : null,
		snapshot: freezePad(pad),
		frozenAt: now
	};
	getDb().insert(schema.shares).values(row).run();
	return row;
}

/** A pad's share links, newest first. */
function sharesOf(pad: PadRow): ShareRow[] {
	return getDb().select().from(schema.shares).where(eq(schema.shares.padId, pad.id)).orderBy(desc(schema.shares.createdAt)).all();
}

/** How many comments each of a pad's snapshots has, by slug. */
function commentCounts(pad: PadRow): Map<string, number> {
	const rows = getDb()
		.select({ slug: schema.snapshotComments.slug, n: count() })
		.from(schema.snapshotComments)
		.innerJoin(schema.shares, eq(schema.shares.slug, schema.snapshotComments.slug))
		.where(eq(schema.shares.padId, pad.id))
		.groupBy(schema.snapshotComments.slug)
		.all();
	return new Map(rows.map((r) => [r.slug, r.n]));
}

/** Every snapshot of the pad, newest first: its link, note, when it was frozen, its size and comments. */
export function listShares(pad: PadRow, origin?: string) {
	const now = Date.now();
	const comments = commentCounts(pad);
	return sharesOf(pad).map((s) => ({
		slug: s.slug,
		url: shareUrl(s.slug, origin),
		note: s.note,
		createdAt: s.createdAt,
		/** null: a link from before snapshots that nobody has opened yet (it freezes on its first open) */
		frozenAt: s.snapshot ? (s.frozenAt ?? s.createdAt) : null,
		steps: s.snapshot ? (s.snapshot as Snapshot).steps.length : null,
		comments: comments.get(s.slug) ?? 0,
		expiresAt: s.expiresAt,
		revokedAt: s.revokedAt,
		live: isLive(s, now)
	}));
}

/** The newest live link of a pad, if any (for invitation e-mails). */
export function liveShareOf(pad: PadRow): ShareRow | undefined {
	return sharesOf(pad).find((s) => isLive(s));
}

/** Revoking keeps the row (the owner sees it listed as revoked); the transcript answers 404 from now on. */
export function revokeShare(pad: PadRow, slug: string) {
	const db = getDb();
	const share = db
		.select()
		.from(schema.shares)
		.where(and(eq(schema.shares.slug, slug), eq(schema.shares.padId, pad.id)))
		.get();
	if (!share) throw new ApiFailure(404, 'No such link on this pad.');
	if (!share.revokedAt) db.update(schema.shares).set({ revokedAt: new Date() }).where(eq(schema.shares.slug, slug)).run();
}

/** One snapshot of the pad by its slug, live or not (the owner's panel reads its comments); else 404. */
export function findShareOf(pad: PadRow, slug: string): ShareRow {
	const share = getDb()
		.select()
		.from(schema.shares)
		.where(and(eq(schema.shares.slug, slug), eq(schema.shares.padId, pad.id)))
		.get();
	if (!share) throw new ApiFailure(404, 'No such link on this pad.');
	return share;
}

export { gone };

export function ownerName(pad: PadRow): string {
	return getDb().select({ name: schema.users.name }).from(schema.users).where(eq(schema.users.id, pad.ownerId)).get()?.name ?? '';
}

/** The read-only view: inputs and recorded answers only — no history, lets or internal refs. */
export function transcriptOf(pad: PadRow, steps: StepRow[] = padSteps(pad.id)) {
	return {
		title: pad.title,
		owner: { name: ownerName(pad) },
		bulk: pad.bulk,
		steps: steps.map((s) => ({ n: s.n, input: s.input, status: s.status, results: s.results, error: s.error }))
	};
}

/** A snapshot's read-only view: what the link showed when it was made, with its note and date. */
export function snapshotTranscript({ pad, share, snapshot, frozenAt }: OpenedShare) {
	return {
		title: snapshot.title,
		owner: { name: ownerName(pad) },
		bulk: snapshot.bulk,
		note: share.note,
		frozenAt,
		steps: snapshot.steps.map((s) => ({ n: s.n, input: s.input, status: s.status, results: s.results, error: s.error }))
	};
}

/**
 * A new pad of the caller's holding a snapshot's steps and the state it had then (the fork of a link), with
 * copies of the datasets its steps compare against, attributed to their owner, so the fork replays for the
 * forker (see copyDatasetsForFork).
 */
export function forkSnapshot(opened: OpenedShare, user: AppUser): PadRow & { datasets: ForkedDatasets } {
	const { snapshot } = opened;
	const db = getDb();
	const owner = ownerName(opened.pad);
	const names = datasetWords(snapshot.steps.map((s) => s.input));
	return db.transaction((tx) => {
		const now = new Date();
		const pad: PadRow = {
			id: newId(),
			ownerId: user.id,
			title: `${snapshot.title} (fork)`.slice(0, 200),
			bulk: snapshot.bulk,
			units: snapshot.units,
			lets: snapshot.lets ?? {},
			validityTol: snapshot.validityTol ?? null,
			history: snapshot.steps.map((s) => s.input).slice(-200),
			createdAt: now,
			updatedAt: now
		};
		tx.insert(schema.pads).values(pad).run();
		for (const s of snapshot.steps)
			tx.insert(schema.steps)
				.values({
					id: newId(),
					padId: pad.id,
					n: s.n,
					input: s.input,
					status: s.status,
					results: s.results,
					error: s.error,
					ref: s.ref ?? null,
					bulkBefore: s.bulkBefore ?? null,
					name: s.name ?? null,
					figureLabels: s.figureLabels ?? null,
					createdAt: now
				})
				.run();
		const datasets = copyDatasetsForFork(tx, opened.pad.ownerId, user.id, names, (name) =>
			`${name} of ${owner || 'another member'}, copied when forking '${snapshot.title}'`.slice(0, 500)
		);
		return { ...pad, datasets };
	});
}

/** Words of the lines that compare: a superset of the dataset names they use (as eval/plan.ts's reachableWords). */
function datasetWords(inputs: string[]): Set<string> {
	const words = new Set<string>();
	for (const input of inputs) {
		if (!/\bcompare\b/i.test(input)) continue;
		for (const w of input.toLowerCase().match(/[a-z][a-z0-9_]*/g) ?? []) words.add(w);
	}
	return words;
}
