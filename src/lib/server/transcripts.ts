import { and, desc, eq } from 'drizzle-orm';
import { randomBytes } from 'node:crypto';
import { getDb, schema } from './db';
import { env } from './env';
import { ApiFailure } from './http';
import { newId } from './auth/accounts';
import type { AppUser } from './auth/guards';
import { padSteps, type PadRow, type StepRow } from './pads';

export type ShareRow = typeof schema.shares.$inferSelect;

const DAY_MS = 24 * 60 * 60 * 1000;
const gone = () => new ApiFailure(404, 'No such transcript (the link may have been revoked or have expired).');

/**
 * A link's address. Answers to the owner use the origin they reached us on; mailed links use the configured
 * origin only, never a request's Host header (which a sender could forge to mail a lookalike link).
 */
export function shareUrl(slug: string, origin = env.origin): string {
	return `${origin}/t/${slug}`;
}

function isLive(share: ShareRow, now = Date.now()): boolean {
	return !share.revokedAt && (!share.expiresAt || share.expiresAt.getTime() > now);
}

/** A new read-only link to the pad; 96 random bits, so links cannot be guessed. */
export function createShare(pad: PadRow, user: AppUser, expiresInDays?: number): ShareRow {
	const row: ShareRow = {
		slug: randomBytes(12).toString('base64url'),
		padId: pad.id,
		createdBy: user.id,
		expiresAt: expiresInDays ? new Date(Date.now() + expiresInDays * DAY_MS) : null,
		revokedAt: null,
		createdAt: new Date()
	};
	getDb().insert(schema.shares).values(row).run();
	return row;
}

/** A pad's share links, newest first. */
function sharesOf(pad: PadRow): ShareRow[] {
	return getDb().select().from(schema.shares).where(eq(schema.shares.padId, pad.id)).orderBy(desc(schema.shares.createdAt)).all();
}

export function listShares(pad: PadRow, origin?: string) {
	const now = Date.now();
	return sharesOf(pad).map((s) => ({
		slug: s.slug,
		url: shareUrl(s.slug, origin),
		createdAt: s.createdAt,
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

/** The pad behind a live link; revoked, expired and unknown links are the same 404. */
export function findSharedPad(slug: string): PadRow {
	const db = getDb();
	const share = db.select().from(schema.shares).where(eq(schema.shares.slug, slug)).get();
	if (!share || !isLive(share)) throw gone();
	const pad = db.select().from(schema.pads).where(eq(schema.pads.id, share.padId)).get();
	if (!pad) throw gone();
	return pad;
}

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

/**
 * A new pad of the caller's with the same steps (recorded answers, references and starting bulks) and the
 * same state after the last step, so the fork continues exactly where the original stopped.
 */
export function forkPad(source: PadRow, user: AppUser): PadRow {
	const db = getDb();
	return db.transaction((tx) => {
		const now = new Date();
		const pad: PadRow = {
			id: newId(),
			ownerId: user.id,
			title: `${source.title} (fork)`.slice(0, 200),
			bulk: source.bulk,
			units: source.units,
			lets: source.lets,
			history: source.history,
			createdAt: now,
			updatedAt: now
		};
		tx.insert(schema.pads).values(pad).run();
		for (const s of padSteps(source.id))
			tx.insert(schema.steps)
				.values({ ...s, id: newId(), padId: pad.id, createdAt: now })
				.run();
		return pad;
	});
}
