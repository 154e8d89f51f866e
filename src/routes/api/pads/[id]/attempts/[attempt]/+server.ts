import { api, ok, readBody } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { findOwnPad } from '$lib/server/pads';
import { attemptView } from '$lib/server/pad-view';
import { dismissAttempt } from '$lib/server/steps';
import { attemptDismissSchema } from '$lib/server/api-schemas';

/** PATCH {dismissed}: fold a failed line away, or bring it back. Attempts are kept, never deleted. */
export const PATCH = api(async (event) => {
	const user = requireWriter(event);
	const pad = findOwnPad(user, event.params.id!);
	const { dismissed } = await readBody(event, attemptDismissSchema);
	return ok({ attempt: attemptView(dismissAttempt(pad, event.params.attempt!, dismissed)) });
});
