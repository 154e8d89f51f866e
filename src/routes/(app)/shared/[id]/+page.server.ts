import { error, fail, redirect, type RequestEvent } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { z } from 'zod';
import { ApiFailure, orPageError } from '$lib/server/http';
import { emailSchema } from '$lib/server/auth/accounts';
import { findOwnPad, findReadablePad, padSteps } from '$lib/server/pads';
import { NOTE_MAX, createShare, listShares, revokeShare, transcriptOf } from '$lib/server/transcripts';
import { invitePerson, listInvitations, revokeInvitation } from '$lib/server/invites';

/**
 * The read-only view of a pad for the people invited to it; its owner also manages snapshots and invitations
 * here (the SharePanel, through the JSON API). The form actions below do the same for a browser without
 * JavaScript and for scripts, through the same server functions.
 */
export const load: PageServerLoad = ({ params, locals, url }) => {
	if (!locals.user) redirect(303, `/signin?next=/shared/${encodeURIComponent(params.id)}`);
	const user = locals.user;
	const pad = orPageError(() => findReadablePad(user, params.id));
	const isOwner = pad.ownerId === user.id;
	return {
		id: pad.id,
		transcript: transcriptOf(pad, padSteps(pad.id)),
		isOwner,
		// the sharing panel's first paint; it reads the JSON API after each change
		sharing: isOwner ? { shares: listShares(pad, url.origin), invitations: listInvitations(pad) } : undefined
	};
};

/** Each action re-checks that the caller owns the pad: the hidden form is no guard. */
function ownPad(event: RequestEvent) {
	const user = event.locals.user;
	if (!user) redirect(303, '/signin');
	if (user.role === 'reader') error(403, 'Readers cannot share pads.');
	return { user, pad: orPageError(() => findOwnPad(user, event.params.id!)) };
}

const shareForm = z.object({
	days: z.union([z.literal(''), z.coerce.number().int().min(1).max(365)]),
	note: z.string().max(NOTE_MAX)
});

export const actions: Actions = {
	share: async (event) => {
		const { user, pad } = ownPad(event);
		const data = await event.request.formData();
		const parsed = shareForm.safeParse({ days: String(data.get('days') ?? ''), note: String(data.get('note') ?? '') });
		if (!parsed.success) return fail(400, { message: 'Expiry is a whole number of days from 1 to 365, or empty for none.' });
		createShare(pad, user, parsed.data.days === '' ? undefined : parsed.data.days, parsed.data.note);
		return { message: 'Shared the current state as a new snapshot.' };
	},
	revoke: async (event) => {
		const { pad } = ownPad(event);
		const slug = String((await event.request.formData()).get('slug') ?? '');
		orPageError(() => revokeShare(pad, slug));
		return { message: 'Revoked; that link now answers “not found”.' };
	},
	uninvite: async (event) => {
		const { pad } = ownPad(event);
		const id = String((await event.request.formData()).get('invitation') ?? '');
		orPageError(() => revokeInvitation(pad, id));
		return { message: 'Revoked; that invitation gives no access any more.' };
	},
	invite: async (event) => {
		const { user, pad } = ownPad(event);
		const email = emailSchema.safeParse(String((await event.request.formData()).get('email') ?? ''));
		if (!email.success) return fail(400, { message: 'Enter a valid e-mail address.' });
		try {
			const { mail } = await invitePerson(pad, user, email.data, event.getClientAddress());
			return {
				message:
					mail.status === 'sent'
						? `Invited ${email.data}; the e-mail with a single-use link is on its way.`
						: `The e-mail to ${email.data} failed (${mail.error}); its link will not work, invite again.`
			};
		} catch (e) {
			if (e instanceof ApiFailure) return fail(e.status, { message: e.message });
			throw e;
		}
	}
};
