/**
 * POST /api/eval from the browser. Asks for the NDJSON stream so a long sweep can report progress, and
 * takes an AbortSignal: aborting closes the request, which the server takes as "cancel this evaluation".
 */
import type { BulkState, Result, UnitsState } from '$lib/lang/result';

export interface EvalError {
	message: string;
	start: number;
	end: number;
	hint?: string;
	code?: string;
}

export interface EvalBody {
	ok: boolean;
	step?: { id: string; n: number; version?: number };
	/** a failed line in a pad: kept as an attempt (no step number) */
	attempt?: { id: string };
	bulk?: BulkState;
	units?: UnitsState;
	ms?: number;
	results?: Result[];
	error?: EvalError;
}

export interface EvalReply {
	status: number;
	body: EvalBody;
}

export interface Progress {
	done: number;
	total: number;
}

/**
 * Splits a byte stream into JSON lines. Kept apart from fetch so it can be tested with hand-made chunks
 * (a line may arrive split across chunks, or several lines in one).
 */
export function createLineSplitter(onLine: (value: unknown) => void) {
	let buffer = '';
	return {
		push(text: string) {
			buffer += text;
			let i: number;
			while ((i = buffer.indexOf('\n')) >= 0) {
				const line = buffer.slice(0, i).trim();
				buffer = buffer.slice(i + 1);
				if (line) onLine(JSON.parse(line));
			}
		},
		end() {
			const line = buffer.trim();
			buffer = '';
			if (line) onLine(JSON.parse(line));
		}
	};
}

/** Reads an NDJSON eval stream: progress lines go to `onProgress`, the final `reply` line is returned. */
export async function readEvalStream(body: ReadableStream<Uint8Array>, onProgress?: (p: Progress) => void): Promise<EvalReply> {
	const decoder = new TextDecoder();
	let reply: EvalReply | undefined;
	const split = createLineSplitter((o) => {
		const msg = o as { progress?: Progress; reply?: EvalReply };
		if (msg.progress) onProgress?.(msg.progress);
		if (msg.reply) reply = msg.reply;
	});
	const reader = body.getReader();
	for (;;) {
		const { done, value } = await reader.read();
		if (done) break;
		split.push(decoder.decode(value, { stream: true }));
	}
	split.push(decoder.decode());
	split.end();
	if (!reply) throw new Error('The evaluation stream ended without an answer.');
	return reply;
}

export async function evaluateLine(
	input: string,
	pad: string | undefined,
	opts: { signal?: AbortSignal; onProgress?: (p: Progress) => void; fetch?: typeof fetch } = {}
): Promise<EvalReply> {
	const f = opts.fetch ?? fetch;
	const res = await f('/api/eval', {
		method: 'POST',
		headers: { 'content-type': 'application/json', accept: 'application/x-ndjson' },
		body: JSON.stringify(pad ? { input, pad } : { input }),
		signal: opts.signal
	});
	const type = res.headers.get('content-type') ?? '';
	// validation failures and 404s answer plain JSON before any stream starts
	if (type.includes('application/x-ndjson') && res.body) return readEvalStream(res.body, opts.onProgress);
	let body: EvalBody;
	try {
		body = (await res.json()) as EvalBody;
	} catch {
		body = { ok: false, error: { message: `The server answered ${res.status}.`, start: 0, end: 0 } };
	}
	return { status: res.status, body };
}
