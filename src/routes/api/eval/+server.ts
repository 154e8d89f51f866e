import { json } from '@sveltejs/kit';
import { z } from 'zod';
import { api, readBody } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { findOwnPad } from '$lib/server/pads';
import { evaluateInPad, evaluateStateless, type EvalReply } from '$lib/server/eval/service';
import type { EvalOptions } from '$lib/server/eval/pool';

const bodySchema = z.object({
	input: z.string().max(100_000, 'input is far over the 2000-character limit'),
	pad: z.string().min(1).max(64).optional()
});

/**
 * POST /api/eval. With `Accept: application/x-ndjson` the answer streams: `{"progress":{done,total}}` lines
 * while a sweep runs, then `{"reply":{status, body}}`; closing the request cancels the evaluation.
 */
export const POST = api(async (event) => {
	const user = requireWriter(event);
	const { input, pad } = await readBody(event, bodySchema);
	const padOf = pad ? () => findOwnPad(user, pad) : undefined;
	padOf?.(); // 404 before anything runs
	const run = (opts: EvalOptions): Promise<EvalReply> =>
		padOf ? evaluateInPad(padOf, input, opts) : evaluateStateless(input, user.id, opts);

	if (!(event.request.headers.get('accept') ?? '').includes('application/x-ndjson')) {
		const r = await run({});
		return json(r.body, { status: r.status });
	}

	const encoder = new TextEncoder();
	const signal = event.request.signal;
	const stream = new ReadableStream<Uint8Array>({
		async start(controller) {
			const send = (o: unknown) => {
				try {
					controller.enqueue(encoder.encode(JSON.stringify(o) + '\n'));
				} catch {
					/* the client went away */
				}
			};
			const r = await run({ signal, onProgress: (progress) => send({ progress }) });
			send({ reply: r });
			try {
				controller.close();
			} catch {
				/* already closed */
			}
		}
	});
	return new Response(stream, { headers: { 'content-type': 'application/x-ndjson', 'cache-control': 'no-store' } });
});
