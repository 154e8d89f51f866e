/**
 * Readers' comments on the steps of a snapshot — the referee's main need. Whoever holds a live link and is
 * signed in reads and writes them (a comment carries its author's name, so an anonymous link holder sees
 * none); the owner reads them from the sharing panel, for live and revoked snapshots alike. Bodies are plain
 * text, stored as typed and always rendered as text, never as HTML.
 */
import { asc, count, eq } from 'drizzle-orm';
import { z } from 'zod';
import { getDb, schema } from './db';
import { newId } from './auth/accounts';
import type { AppUser } from './auth/guards';
import { failure } from './http';
import { createRateLimiter } from './rate-limit';
import type { OpenedShare, Snapshot } from './snapshots';

export const COMMENT_MAX = 2000;
export const COMMENTS_PER_MINUTE = 6;
const PER_SNAPSHOT_MAX = 500;

/** per author: a burst of comments is a script, not a referee */
export const commentLimiter = createRateLimiter(COMMENTS_PER_MINUTE, 60_000);

/** control characters other than newline and tab have no place in a comment and can hide text */
function hasControl(s: string): boolean {
	for (let i = 0; i < s.length; i++) {
		const c = s.charCodeAt(i);
		if ((c < 0x20 && c !== 0x0a && c !== 0x09) || c === 0x7f) return true;
	}
	return false;
}

export const commentSchema = z.object({
	step: z.number().int().min(1),
	body: z
		.string()
		.trim()
		.min(1, 'Write something first.')
		.max(COMMENT_MAX, `A comment has at most ${COMMENT_MAX} characters.`)
		.refine((s) => !hasControl(s), 'A comment may not contain control characters.')
});

/** A snapshot's comments, oldest first, with their authors' names. */
export function listComments(slug: string, viewer?: AppUser) {
	return getDb()
		.select({ c: schema.snapshotComments, name: schema.users.name })
		.from(schema.snapshotComments)
		.leftJoin(schema.users, eq(schema.users.id, schema.snapshotComments.authorId))
		.where(eq(schema.snapshotComments.slug, slug))
		.orderBy(asc(schema.snapshotComments.createdAt))
		.all()
		.map(({ c, name }) => ({
			id: c.id,
			step: c.stepN,
			body: c.body,
			author: { name: name ?? 'a removed account' },
			mine: viewer ? c.authorId === viewer.id : false,
			createdAt: c.createdAt
		}));
}

/** A comment on step `step` of the opened snapshot; the step must be one the snapshot holds. */
export function addComment({ share, snapshot }: OpenedShare, user: AppUser, input: z.infer<typeof commentSchema>) {
	if (!(snapshot as Snapshot).steps.some((s) => s.n === input.step)) failure(400, `This snapshot has no step #${input.step}.`);
	if (!commentLimiter.take(user.id)) {
		const wait = commentLimiter.retryAfterSeconds(user.id);
		failure(429, `Too many comments at once; try again in ${wait} s.`, { retryAfter: wait });
	}
	const db = getDb();
	const held = db.select({ n: count() }).from(schema.snapshotComments).where(eq(schema.snapshotComments.slug, share.slug)).get()?.n ?? 0;
	if (held >= PER_SNAPSHOT_MAX) failure(409, `This snapshot holds ${PER_SNAPSHOT_MAX} comments already.`);
	const row = { id: newId(), slug: share.slug, stepN: input.step, authorId: user.id, body: input.body, createdAt: new Date() };
	db.insert(schema.snapshotComments).values(row).run();
	return { id: row.id, step: row.stepN, body: row.body, author: { name: user.name }, mine: true, createdAt: row.createdAt };
}
