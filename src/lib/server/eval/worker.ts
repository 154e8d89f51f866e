/**
 * One evaluation: runs the language on a line and a plain-JSON pad context. Never throws, so the pool can tell
 * a language error (the user's) from a crash (ours). Runs inside an evaluation process (child.ts); a line that
 * exhausts memory or time takes only that process down.
 */
import { runLine, LangError } from '../../lang';
import type { EvalError, LineOutcome, PadContext } from '../../lang/result';

export interface EvalTask {
	input: string;
	ctx: PadContext;
}

// the error's codes and their statuses are declared once, in lang/result.ts
export type { EvalErrorCode } from '../../lang/result';

export type EvalAnswer = { ok: true; outcome: LineOutcome } | { ok: false; error: EvalError };

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
