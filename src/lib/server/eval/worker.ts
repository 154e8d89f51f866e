/**
 * One evaluation: runs the language on a line and a plain-JSON pad context. Never throws, so the pool can tell
 * a language error (the user's) from a crash (ours). Runs inside an evaluation process (child.ts); a line that
 * exhausts memory or time takes only that process down.
 */
import { runLine, LangError } from '../../lang';
import type { LineOutcome, PadContext } from '../../lang/result';

export interface EvalTask {
	input: string;
	ctx: PadContext;
}

/**
 * 'busy' (503) means the line never started because the queue was too long for too long; 'throttled' (429)
 * means its author already has too many lines waiting. Neither is a verdict on the line itself.
 */
export type EvalErrorCode = 'language' | 'limit' | 'internal' | 'busy' | 'throttled';

export type EvalAnswer =
	| { ok: true; outcome: LineOutcome }
	| { ok: false; error: { message: string; start: number; end: number; hint?: string; code: EvalErrorCode; retryAfter?: number } };

export function evaluateTask({ input, ctx }: EvalTask, onProgress?: (done: number, total: number) => void): EvalAnswer {
	try {
		return { ok: true, outcome: runLine(input, ctx, { onProgress }) };
	} catch (e) {
		if (e instanceof LangError) {
			return { ok: false, error: { message: e.message, start: e.start, end: e.end, hint: e.hint, code: e.code } };
		}
		const message = e instanceof Error ? e.message : String(e);
		return { ok: false, error: { message: `internal error: ${message}`, start: 0, end: input.length, code: 'internal' } };
	}
}
