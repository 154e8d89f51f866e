import { error, fail, redirect, type RequestEvent } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { z } from 'zod';
import { ApiFailure, orPageError } from '$lib/server/http';
import { emailSchema } from '$lib/server/auth/accounts';
import { findOwnPad, findReadablePad, padSteps } from '$lib/server/pads';
import { createShare, listShares, revokeShare, transcriptOf } from '$lib/server/transcripts';
import { invitePerson, listInvitations, revokeInvitation } from '$lib/server/invites';

/** The read-only view of a pad for the people invited to it; its owner also manages links and invitations here. */
export const load: PageServerLoad = ({ params, locals, url }) => {
	if (!locals.user) redirect(303, `/signin?next=/shared/${encodeURIComponent(params.id)}`);
	const user = locals.user;
	const pad = orPageError(() => findReadablePad(user, params.id));
	const isOwner = pad.ownerId === user.id;
	return {
		id: pad.id,
		transcript: transcriptOf(pad, padSteps(pad.id)),
		isOwner,
		shares: isOwner ? listShares(pad, url.origin) : [],
		invitations: isOwner ? listInvitations(pad) : []
	};
};

/** Each action re-checks that the caller owns the pad: the hidden form is no guard. */
function ownPad(event: RequestEvent) {
	const user = event.locals.user;
	if (!user) redirect(303, '/signin');
	if (user.role === 'reader') error(403, 'Readers cannot share pads.');
	return { user, pad: orPageError(() => findOwnPad(user, event.params.id!)) };
}

const shareForm = z.object({ days: z.union([z.literal(''), z.coerce.number().int().min(1).max(365)]) });

export const actions: Actions = {
	share: async (event) => {
		const { user, pad } = ownPad(event);
		const parsed = shareForm.safeParse({ days: String((await event.request.formData()).get('days') ?? '') });
		if (!parsed.success) return fail(400, { message: 'Expiry is a whole number of days from 1 to 365, or empty for none.' });
		createShare(pad, user, parsed.data.days === '' ? undefined : parsed.data.days);
		return { message: 'Made a new read-only link.' };
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
