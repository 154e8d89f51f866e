import { api, ok } from '$lib/server/http';
import { requireUser } from '$lib/server/auth/guards';
import { findReadablePad, padSteps } from '$lib/server/pads';
import { replayAnswer, takeReplay } from '$lib/server/replay';
import { clientGone } from '$lib/server/eval/disconnect';

/** POST: replays a pad for its owner or an invited person (the /shared view); same answer as a transcript's. */
export const POST = api(async (event) => {
	const user = requireUser(event);
	takeReplay(event.getClientAddress());
	const pad = findReadablePad(user, event.params.id!);
	const gone = clientGone(event);
	try {
		return ok(await replayAnswer(pad, padSteps(pad.id), { owner: user.id, signal: gone.signal, limitTranscript: false }));
	} finally {
		gone.done();
	}
});
