/**
 * One evaluation in a worker thread. Runs the language on a line and a plain-JSON pad context; never throws,
 * so the pool can tell a language error (the user's) from a crash (ours).
 */
import type { MessagePort } from 'node:worker_threads';
import { runLine, LangError } from '../../lang';
import type { LineOutcome, PadContext } from '../../lang/result';

export interface EvalTask {
	input: string;
	ctx: PadContext;
	port?: MessagePort;
}

export type EvalAnswer =
	| { ok: true; outcome: LineOutcome }
	| { ok: false; error: { message: string; start: number; end: number; hint?: string; code: 'language' | 'limit' | 'internal' } };

export default function evaluateTask({ input, ctx, port }: EvalTask): EvalAnswer {
	// the time budget starts now, not while the task waited for a thread or a fresh thread booted
	port?.postMessage({ started: true });
	let last = 0;
	const onProgress = port
		? (done: number, total: number) => {
				const now = Date.now();
				if (now - last < 100 && done < total) return;
				last = now;
				port.postMessage({ done, total });
			}
		: undefined;
	try {
		return { ok: true, outcome: runLine(input, ctx, { onProgress }) };
	} catch (e) {
		if (e instanceof LangError) {
			return { ok: false, error: { message: e.message, start: e.start, end: e.end, hint: e.hint, code: e.code } };
		}
		const message = e instanceof Error ? e.message : String(e);
		return { ok: false, error: { message: `internal error: ${message}`, start: 0, end: input.length, code: 'internal' } };
	} finally {
		port?.close();
	}
}
