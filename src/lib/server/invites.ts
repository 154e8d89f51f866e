import { desc, eq } from 'drizzle-orm';
import { getDb, schema } from './db';
import { env } from './env';
import { ApiFailure } from './http';
import type { AppUser } from './auth/guards';
import type { PadRow } from './pads';
import { createRateLimiter } from './rate-limit';
import { sendMail, type OutboxRow } from './mail/send';
import { inviteMessage } from './mail/templates';
import { liveShareOf, shareUrl } from './transcripts';

/** Invitations send real mail: a member cannot turn Bulkpad into a mailer. */
const perInviter = createRateLimiter(30, 60 * 60_000);

/**
 * Gives `email` read access to the pad (idempotent) and mails the invitation: a link to the pad's read-only
 * view for the account with that address, plus the public transcript when the pad has a live link.
 */
export async function invitePerson(pad: PadRow, inviter: AppUser, email: string): Promise<OutboxRow> {
	if (email === inviter.email) throw new ApiFailure(400, 'That is your own address; invite a collaborator.');
	if (!perInviter.take(inviter.id)) throw new ApiFailure(429, 'Too many invitations this hour; try again later.');
	const db = getDb();
	db.insert(schema.padAccess).values({ padId: pad.id, email }).onConflictDoNothing().run();
	const hasAccount = !!db.select({ id: schema.users.id }).from(schema.users).where(eq(schema.users.email, email)).get();
	const share = liveShareOf(pad);
	return sendMail(
		inviteMessage({
			to: email,
			inviter: inviter.name,
			title: pad.title,
			padUrl: `${env.origin}/shared/${pad.id}`,
			signupUrl: hasAccount ? undefined : `${env.origin}/signup`,
			transcriptUrl: share && shareUrl(share.slug)
		})
	);
}

/** Pads other people invited this user to, newest first. */
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
