import { api, ok } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { trialMacro } from '$lib/server/macro-trial';
import { clientGone } from '$lib/server/eval/disconnect';

/**
 * POST: runs the macro on its example parameters in a fresh pad (nothing stored) → {trial: {input, ok,
 * results | error, before, after, effects}}. For the curator's review; members may try what they can see.
 */
export const POST = api(async (event) => {
	const user = requireWriter(event);
	const gone = clientGone(event);
	try {
		return ok({ trial: await trialMacro(user, event.params.id!, gone.signal) });
	} finally {
		gone.done();
	}
});
