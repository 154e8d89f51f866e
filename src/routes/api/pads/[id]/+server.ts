import { api, ok, readBody } from '$lib/server/http';
import { requireUser, requireWriter } from '$lib/server/auth/guards';
import { deletePad, findOwnPad, findReadablePad, padSteps, renamePad, setValidityTol } from '$lib/server/pads';
import { attemptView, padView, stepView } from '$lib/server/pad-view';
import { padAttempts } from '$lib/server/steps';
import { padChangeSchema } from '$lib/server/api-schemas';

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

/**
 * PATCH {title?, validityTol?}: owner only; an invited person gets 404, as if the pad were not there to change.
 * validityTol is the pad's relative validity tolerance (series warnings, `validity`, plot shading); null clears
 * it back to the default 1e-3. Lines already evaluated keep what they said; new lines and replays use it.
 */
export const PATCH = api(async (event) => {
	const user = requireWriter(event);
	const pad = findOwnPad(user, event.params.id!);
	const body = await readBody(event, padChangeSchema);
	let next = pad;
	if (body.title !== undefined) {
		renamePad(pad, body.title);
		next = { ...next, title: body.title };
	}
	if (body.validityTol !== undefined) {
		setValidityTol(pad, body.validityTol);
		next = { ...next, validityTol: body.validityTol };
	}
	return ok({ pad: padView({ ...next, updatedAt: new Date() }, user.name) });
});

export const DELETE = api((event) => {
	const user = requireWriter(event);
	deletePad(findOwnPad(user, event.params.id!));
	return ok({});
});
