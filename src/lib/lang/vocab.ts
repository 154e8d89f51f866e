/**
 * The words of the language, with no heavy dependencies, so the parser, completion and help (which ship to
 * the browser) share one list without pulling in mathjs or zod. Verbs come from the registry.
 */
// the verbs live in the registry (./verbs/index.ts): one module per verb
export { isVerb, verbNames, verbSpec, type Verb } from './verbs/index';

export const BULKS = ['vacuum', 'brane', 'boosted', 'charged', 'dp', 'wave', 'soliton', 'metric', 'vaidya'] as const;
export type BulkName = (typeof BULKS)[number];

export const SHAPES = ['strip', 'ball', 'pair'] as const;
export type Shape = (typeof SHAPES)[number];

export const SINKS = ['table', 'plot', 'tex', 'csv'] as const;
export type Sink = (typeof SINKS)[number];

export const UNIT_SYSTEMS = ['geo', 'cft', 'sym'] as const;

/** statement keywords; none may be used as a let-name */
export const KEYWORDS = ['use', 'units', 'let', 'sweep', 'compare', 'exact'] as const;

/** keys of each bulk, as LANGUAGE.md's table lists them */
export const BULK_KEYS: Record<BulkName, readonly string[]> = {
	vacuum: ['d'],
	brane: ['d', 'zh'],
	boosted: ['d', 'zh', 'v', 'rapidity'],
	charged: ['d', 'zh', 'q'],
	dp: ['p', 'zh'],
	wave: ['d', 'zp'],
	soliton: ['d', 'z0'],
	metric: ['d', 'f', 'g', 'h', 'params'],
	vaidya: ['d', 'zh']
};
/** every key a bulk may take */
export const ALL_BULK_KEYS = ['d', 'zh', 'v', 'rapidity', 'q', 'p', 'zp', 'z0', 'f', 'h'] as const;

/** keys that are not bulk keys */
export const QUANTITY_KEYS = ['l', 'R', 'gap', 'o', 'zstar', 'tol', 'G', 'x', 'y', 'of', 'phase', 't', 'along'] as const;

/** keys whose value is a word (`of=charge`, `phase=rt`), not a number: a bare name there is that word */
export const WORD_KEYS: Record<string, readonly string[]> = {
	of: ['charge', 'momentum'],
	phase: ['rt', 'connected', 'disconnected']
};

/** two spellings of one key: giving both on one line is a duplicate */
export const KEY_ALIASES: Record<string, string> = { order: 'o' };
/** keys that say the same thing differently: giving both is a conflict */
export const KEY_CONFLICTS: [string, string][] = [['v', 'rapidity']];

export const CONSTANTS = ['pi', 'e'] as const;

/** functions arithmetic may call; anything else is refused before mathjs sees it */
export const FUNCTIONS = [
	'sqrt',
	'cbrt',
	'exp',
	'log',
	'log10',
	'log2',
	'sin',
	'cos',
	'tan',
	'asin',
	'acos',
	'atan',
	'sinh',
	'cosh',
	'tanh',
	'asinh',
	'acosh',
	'atanh',
	'abs',
	'gamma',
	'min',
	'max',
	'pow',
	'floor',
	'ceil',
	'round'
] as const;

/** the canonical spelling of a key */
export function canonicalKey(key: string): string {
	return Object.prototype.hasOwnProperty.call(KEY_ALIASES, key) ? KEY_ALIASES[key]! : key;
}

export function isBulk(s: string): s is BulkName {
	return (BULKS as readonly string[]).includes(s);
}
