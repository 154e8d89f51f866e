/**
 * Pad invitations. The mailed link carries a single-use token (stored as its sha-256); nothing is granted when
 * the invitation is sent. Whoever opens the link signed in with a confirmed address — or makes an account
 * through it and confirms that account's address — reads the pad. Owners see every invitation of a pad and can
 * revoke it, pending or accepted (revoking an accepted one takes the reader's access away).
 */
import { and, desc, eq } from 'drizzle-orm';
import { getDb, schema } from './db';
import { env } from './env';
import { failure } from './http';
import type { AppUser } from './auth/guards';
import { hashToken, newToken } from './auth/tokens';
import { mailLimits, takeOrThrow } from './auth/limits';
import { newId } from './auth/accounts';
import type { PadRow } from './pads';
import { sendMail, wasSent } from './mail/send';
import { inviteMessage } from './mail/templates';
import { liveShareOf, shareUrl } from './transcripts';

const VALID_DAYS = 14;

export type InvitationRow = typeof schema.invitations.$inferSelect;

/** Records a pending invitation and mails its link; the answer says whether the mail went out. */
export async function invitePerson(pad: PadRow, inviter: AppUser, email: string, clientAddress: string) {
	if (email === inviter.email) failure(400, 'That is your own address; invite a collaborator.');
	takeOrThrow(
		'Too many invitations.',
		[mailLimits.invitePerInviter, inviter.id],
		[mailLimits.invitePerAddress, clientAddress],
		[mailLimits.invitePerEmail, email]
	);
	const token = newToken();
	const outboxId = newId();
	const row = {
		id: newId(),
		padId: pad.id,
		email,
		tokenHash: hashToken(token),
		invitedBy: inviter.id,
		expiresAt: new Date(Date.now() + VALID_DAYS * 86_400_000),
		outboxId
	};
	getDb().insert(schema.invitations).values(row).run();
	const share = liveShareOf(pad);
	const mail = await sendMail(
		inviteMessage({
			to: email,
			inviter: inviter.name,
			title: pad.title,
			acceptUrl: `${env.origin}/invite/${token}`,
			validDays: VALID_DAYS,
			transcriptUrl: share && shareUrl(share.slug)
		}),
		outboxId
	);
	return { invitation: { id: row.id, email, state: 'pending' as const }, mail };
}

/** The invitation a token opens: pending, not expired, and its mail really went out — else null. */
export function findLiveInvitation(token: string): InvitationRow | null {
	const row = getDb()
		.select()
		.from(schema.invitations)
		.where(eq(schema.invitations.tokenHash, hashToken(token)))
		.get();
	return row && isLive(row) ? row : null;
}

function isLive(row: InvitationRow): boolean {
	return row.state === 'pending' && row.expiresAt.getTime() > Date.now() && wasSent(row.outboxId);
}

/** What the invitation page shows before anyone accepts: the pad's title and who invited. */
export function describeInvitation(token: string) {
	const row = findLiveInvitation(token);
	if (!row) return null;
	const db = getDb();
	const pad = db.select({ title: schema.pads.title }).from(schema.pads).where(eq(schema.pads.id, row.padId)).get();
	const inviter = db.select({ name: schema.users.name }).from(schema.users).where(eq(schema.users.id, row.invitedBy)).get();
	return pad && inviter ? { padId: row.padId, title: pad.title, inviter: inviter.name, email: row.email } : null;
}

const GONE = 'This invitation is invalid, used, revoked or expired; ask the pad owner for a new one.';

function grant(row: InvitationRow, user: { id: string; email: string }): string {
	const db = getDb();
	const pad = db.select({ ownerId: schema.pads.ownerId }).from(schema.pads).where(eq(schema.pads.id, row.padId)).get();
	if (!pad) failure(404, GONE);
	if (pad.ownerId === user.id) failure(400, 'This is your own pad.');
	db.transaction((tx) => {
		// the state check inside the transaction makes a token single-use even when two requests race
		const taken = tx
			.update(schema.invitations)
			.set({ state: 'accepted', acceptedBy: user.id, acceptedAt: new Date() })
			.where(and(eq(schema.invitations.id, row.id), eq(schema.invitations.state, 'pending')))
			.run();
		if (taken.changes === 0) failure(404, GONE);
		tx.insert(schema.padAccess).values({ padId: row.padId, email: user.email }).onConflictDoNothing().run();
	});
	return row.padId;
}

/** Accepts with the link's token for a signed-in user with a confirmed address; returns the pad's id. */
export function acceptInvitation(user: AppUser, token: string): string {
	const row = findLiveInvitation(token);
	if (!row) failure(404, GONE);
	const me = getDb().select({ confirmed: schema.users.emailConfirmedAt }).from(schema.users).where(eq(schema.users.id, user.id)).get();
	if (!me?.confirmed) failure(403, 'Confirm your address first.');
	return grant(row, user);
}

/** Accepts the invitation an account was made through, when its address is confirmed (null when gone). */
export function acceptInvitationById(user: { id: string; email: string }, id: string): string | null {
	const row = getDb().select().from(schema.invitations).where(eq(schema.invitations.id, id)).get();
	if (!row || !isLive(row)) return null;
	try {
		return grant(row, user);
	} catch {
		return null;
	}
}

/** Every invitation of the owner's pad, newest first, with who accepted and how the mail went. */
export function listInvitations(pad: PadRow) {
	const db = getDb();
	return db
		.select({
			id: schema.invitations.id,
			email: schema.invitations.email,
			state: schema.invitations.state,
			createdAt: schema.invitations.createdAt,
			expiresAt: schema.invitations.expiresAt,
			acceptedAt: schema.invitations.acceptedAt,
			revokedAt: schema.invitations.revokedAt,
			acceptedBy: schema.invitations.acceptedBy,
			mail: schema.outbox.status
		})
		.from(schema.invitations)
		.leftJoin(schema.outbox, eq(schema.outbox.id, schema.invitations.outboxId))
		.where(eq(schema.invitations.padId, pad.id))
		.orderBy(desc(schema.invitations.createdAt))
		.all()
		.map(({ acceptedBy, ...r }) => {
			const who = acceptedBy
				? db.select({ name: schema.users.name, email: schema.users.email }).from(schema.users).where(eq(schema.users.id, acceptedBy)).get()
				: undefined;
			const expired = r.state === 'pending' && r.expiresAt.getTime() <= Date.now();
			return { ...r, mail: r.mail ?? 'failed', expired, acceptedBy: who ?? null };
		});
}

/**
 * Revokes one invitation of the owner's pad. A pending one can no longer be accepted; an accepted one also
 * takes the reader's access away (with every other accepted invitation of theirs to this pad).
 */
export function revokeInvitation(pad: PadRow, id: string): void {
	const db = getDb();
	db.transaction((tx) => {
		const row = tx
			.select()
			.from(schema.invitations)
			.where(and(eq(schema.invitations.id, id), eq(schema.invitations.padId, pad.id)))
			.get();
		if (!row) failure(404, 'No such invitation.');
		if (row.state === 'revoked') return;
		const now = new Date();
		tx.update(schema.invitations).set({ state: 'revoked', revokedAt: now }).where(eq(schema.invitations.id, id)).run();
		if (row.state !== 'accepted' || !row.acceptedBy) return;
		const reader = tx.select({ email: schema.users.email }).from(schema.users).where(eq(schema.users.id, row.acceptedBy)).get();
		if (reader)
			tx.delete(schema.padAccess)
				.where(and(eq(schema.padAccess.padId, pad.id), eq(schema.padAccess.email, reader.email)))
				.run();
		tx.update(schema.invitations)
			.set({ state: 'revoked', revokedAt: now })
			.where(
				and(
					eq(schema.invitations.padId, pad.id),
					eq(schema.invitations.acceptedBy, row.acceptedBy),
					eq(schema.invitations.state, 'accepted')
				)
			)
			.run();
	});
}

/** Pads other people invited this user to (and the user accepted), newest first. */
export function listSharedWith(user: AppUser) {
	return getDb()
		.select({
			id: schema.pads.id,
			title: schema.pads.title,
			bulk: schema.pads.bulk,
			updatedAt: schema.pads.updatedAt,
			owner: schema.users.name,
			invitedAt: schema.padAccess.createdAt
		})
		.from(schema.padAccess)
		.innerJoin(schema.pads, eq(schema.pads.id, schema.padAccess.padId))
		.innerJoin(schema.users, eq(schema.users.id, schema.pads.ownerId))
		.where(eq(schema.padAccess.email, user.email))
		.orderBy(desc(schema.padAccess.createdAt))
		.all()
		.map((r) => ({ ...r, owner: { name: r.owner } }));
}
