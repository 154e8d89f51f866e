/**
 * Limits against hostile or accidental huge input. Exceeding one is a LangError with code 'limit' (HTTP 422)
 * whose message names the limit, so the user knows which knob they hit.
 */
import { MAX_ASKED_ORDER } from '../holo/limits';
import { LangError } from './errors';

export interface Limits {
	/** characters in one input line */
	maxInput: number;
	/** tokens in one input line (after the character limit; a cheap guard for the parser) */
	maxTokens: number;
	/** nesting depth of parentheses and unary operators in arithmetic */
	maxDepth: number;
	/** statements separated by ';' on one line */
	maxStatements: number;
	/** evaluation points of one line: swept values × orders, summed over its statements */
	maxPoints: number;
	/** highest perturbative order */
	maxOrder: number;
	/** macros calling macros */
	maxMacroDepth: number;
}

export const DEFAULT_LIMITS: Readonly<Limits> = Object.freeze({
	maxInput: 2000,
	maxTokens: 600,
	maxDepth: 32,
	maxStatements: 20,
	maxPoints: 2000,
	maxOrder: MAX_ASKED_ORDER,
	maxMacroDepth: 4
});

/** What each limit is called in a message. */
export const LIMIT_NAMES: Record<keyof Limits, string> = {
	maxInput: 'input length',
	maxTokens: 'tokens per line',
	maxDepth: 'nesting depth',
	maxStatements: 'statements per line',
	maxPoints: 'sweep points',
	maxOrder: 'order',
	maxMacroDepth: 'macro depth'
};

export function resolveLimits(partial?: Partial<Limits>): Limits {
	return { ...DEFAULT_LIMITS, ...(partial ?? {}) };
}

export function limitError(which: keyof Limits, message: string, start: number, end: number, limits: Limits): LangError {
	return new LangError(message, start, end, {
		code: 'limit',
		hint: `the ${LIMIT_NAMES[which]} limit is ${limits[which]}`
	});
}
