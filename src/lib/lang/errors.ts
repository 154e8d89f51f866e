/**
 * The one error the language throws. It always carries a span into the typed line so the console can
 * underline the offending characters, and a code the server maps to an HTTP status (language → 400, limit → 422).
 */
import type { LineErrorShape } from './result';

export type LangErrorCode = 'language' | 'limit';

export class LangError extends Error implements LineErrorShape {
	readonly start: number;
	readonly end: number;
	readonly hint?: string;
	readonly code: LangErrorCode;

	constructor(message: string, start: number, end: number, opts: { hint?: string; code?: LangErrorCode } = {}) {
		super(message);
		this.name = 'LangError';
		this.start = Math.max(0, start);
		this.end = Math.max(this.start, end);
		if (opts.hint !== undefined) this.hint = opts.hint;
		this.code = opts.code ?? 'language';
	}

	/** The plain JSON the API answers with. */
	toJSON(): LineErrorShape {
		const out: LineErrorShape = { message: this.message, start: this.start, end: this.end, code: this.code };
		if (this.hint !== undefined) out.hint = this.hint;
		return out;
	}
}

export function isLangError(e: unknown): e is LangError {
	return e instanceof LangError;
}

/** "Expected X, found Y" — the shape of every syntax error. */
export function expected(what: string, found: string, start: number, end: number, hint?: string): LangError {
	return new LangError(`Expected ${what}, found ${found}`, start, end, hint === undefined ? {} : { hint });
}

/**
 * The line with a caret under the span, for logs and the CLI-style test failure output:
 *   darea l=0.3 l=0.4
 *               ^^^^^
 */
export function codeFrame(input: string, e: Pick<LineErrorShape, 'start' | 'end' | 'message'>): string {
	const width = Math.max(1, e.end - e.start);
	return `${input}\n${' '.repeat(e.start)}${'^'.repeat(width)} ${e.message}`;
}
