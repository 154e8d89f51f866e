import { api, ok, readBody } from '$lib/server/http';
import { requireUser, requireWriter } from '$lib/server/auth/guards';
import { deletePad, findOwnPad, findReadablePad, padSteps, renamePad } from '$lib/server/pads';
import { attemptView, padView, stepView } from '$lib/server/pad-view';
import { padAttempts } from '$lib/server/steps';
import { padRenameSchema } from '$lib/server/api-schemas';

/**
 * GET: the owner, or a reader or member invited by e-mail. Anyone else gets the same 404 as a missing id.
 * Attempts (failed lines) are the owner's working notes: only the owner sees them.
 */
export const GET = api((event) => {
	const user = requireUser(event);
	const pad = findReadablePad(user, event.params.id!);
	const attempts = pad.ownerId === user.id ? padAttempts(pad.id).map(attemptView) : [];
	return ok({ pad: padView(pad), steps: padSteps(pad.id).map(stepView), attempts });
});

/** PATCH {title}: owner only; an invited person gets 404, as if the pad were not there to change. */
export const PATCH = api(async (event) => {
	const user = requireWriter(event);
	const pad = findOwnPad(user, event.params.id!);
	const { title } = await readBody(event, padRenameSchema);
	renamePad(pad, title);
	return ok({ pad: padView({ ...pad, title, updatedAt: new Date() }, user.name) });
});

export const DELETE = api((event) => {
	const user = requireWriter(event);
	deletePad(findOwnPad(user, event.params.id!));
	return ok({});
});
