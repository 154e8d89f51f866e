/**
 * The state one line carries from statement to statement, and the mapping of engine errors back onto the
 * characters of the line.
 */
import type * as A from './ast';
import { LangError } from './errors';
import type { Limits } from './limits';
import type { BulkState, LetValue, PadContext, Result, StepRef, UnitsState } from './result';
import { ALL_BULK_KEYS, canonicalKey } from './vocab';
import { isHoloError } from './engine';

export interface LineEnv {
	ctx: PadContext;
	limits: Limits;
	bulk: BulkState;
	units: UnitsState;
	lets: Record<string, LetValue>;
	/** evaluation points used so far by this line (and the macros it runs) */
	pointsUsed: number;
	macroDepth: number;
	onProgress?: (done: number, total: number) => void;
}

/** What one statement answers: its results and what `#n` of the step would expose. */
export interface StatementOut {
	results: Result[];
	ref?: StepRef;
}

/** The key=value of a statement that an engine error names, by canonical key. */
export function findKey(keys: A.KeyValue[], key: string | undefined): A.KeyValue | undefined {
	if (key === undefined) return undefined;
	const k = canonicalKey(key);
	return keys.find((kv) => canonicalKey(kv.key) === k);
}

/**
 * Run engine work and turn its errors into LangErrors: a HoloError with a key points at that key's value on
 * the line (or at `fallback` — usually the verb — when the key came from the pad's bulk). Anything else is a
 * bug and propagates unchanged.
 */
export function withEngine<T>(keys: A.KeyValue[], fallback: A.Span, where: string, work: () => T): T {
	try {
		return work();
	} catch (e) {
		if (e instanceof LangError) throw e;
		if (isHoloError(e)) {
			const kv = findKey(keys, e.key);
			const span = kv ? kv.value : fallback;
			const suffix = where ? ` (${where})` : '';
			const fromPad = !kv && e.key !== undefined && (ALL_BULK_KEYS as readonly string[]).includes(e.key) ? " in the pad's bulk" : '';
			throw new LangError(`${e.message}${fromPad}${suffix}`, span.start, span.end, e.hint ? { hint: e.hint } : {});
		}
		throw e;
	}
}
