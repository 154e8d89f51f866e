import { json } from '@sveltejs/kit';
import { api, readBody } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { findOwnPad } from '$lib/server/pads';
import { evaluateInPad, evaluateStateless, evaluateStatelessFast, type EvalOptions, type EvalReply } from '$lib/server/eval/service';
import { clientGone } from '$lib/server/eval/disconnect';
import { evalBodySchema } from '$lib/server/api-schemas';

/**
 * POST /api/eval. With `Accept: application/x-ndjson` the answer streams: `{"progress":{done,total}}` lines
 * while a sweep runs, then `{"reply":{status, body}}`. A client that hangs up cancels its line, waiting or
 * running, in either form. A line refused by the queue answers 503 (busy) or 429 (too many waiting) with
 * Retry-After.
 */
export const POST = api(async (event) => {
	const user = requireWriter(event);
	const { input, pad } = await readBody(event, evalBodySchema);
	const padOf = pad ? () => findOwnPad(user, pad) : undefined;
	padOf?.(); // 404 before anything runs
	const streamed = (event.request.headers.get('accept') ?? '').includes('application/x-ndjson');
	// a light stateless line is answered before any of the queued path's set-up (the hang-up signal, the stream)
	const quick = pad ? undefined : evaluateStatelessFast(input);
	if (quick)
		return streamed ? ndjson(JSON.stringify({ reply: quick }) + '\n') : json(quick.body, { status: quick.status, headers: quick.headers });
	const run = (opts: EvalOptions): Promise<EvalReply> =>
		padOf ? evaluateInPad(padOf, input, opts) : evaluateStateless(input, user.id, opts);

	const gone = clientGone(event);
	const signal = gone.signal;
	if (!streamed) {
		try {
			const r = await run({ signal });
			return json(r.body, { status: r.status, headers: r.headers });
		} finally {
			gone.done();
		}
	}

	const encoder = new TextEncoder();
	const stream = new ReadableStream<Uint8Array>({
		cancel: () => gone.abort(),
		async start(controller) {
			const send = (o: unknown) => {
				try {
					controller.enqueue(encoder.encode(JSON.stringify(o) + '\n'));
				} catch {
					/* the client went away */
				}
			};
			const r = await run({ signal, onProgress: (progress) => send({ progress }) }).finally(gone.done);
			send({ reply: r });
			try {
				controller.close();
			} catch {
				/* already closed */
			}
		}
	});
	// the stream's own cancel (the browser dropping the response) cancels the line too
	return ndjson(stream);
});

function ndjson(body: BodyInit): Response {
	return new Response(body, { headers: { 'content-type': 'application/x-ndjson', 'cache-control': 'no-store' } });
}
