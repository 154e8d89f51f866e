/**
 * The words of the language, with no dependencies, so the parser, completion and help (which ship to the
 * browser) share one list without pulling in mathjs or zod.
 */
export const VERBS = [
	'zstar',
	'width',
	'area',
	'darea',
	'entropy',
	'dentropy',
	'energy',
	'tent',
	'mu',
	'firstlaw',
	'stress',
	'thermo',
	'coeffs',
	'validity',
	'mi',
	'resum',
	'phases'
] as const;
export type Verb = (typeof VERBS)[number];

export const BULKS = ['vacuum', 'brane', 'boosted', 'charged', 'dp', 'wave', 'soliton', 'metric'] as const;
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
	metric: ['d', 'f', 'h']
};
/** every key a bulk may take */
export const ALL_BULK_KEYS = ['d', 'zh', 'v', 'rapidity', 'q', 'p', 'zp', 'z0', 'f', 'h'] as const;

/** keys that are not bulk keys */
export const QUANTITY_KEYS = ['l', 'R', 'gap', 'o', 'zstar', 'tol', 'G', 'x', 'y', 'of', 'phase'] as const;

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

export function isVerb(s: string): s is Verb {
	return (VERBS as readonly string[]).includes(s);
}
export function isBulk(s: string): s is BulkName {
	return (BULKS as readonly string[]).includes(s);
}

export interface VerbForm {
	/** quantity keys this form takes (bulk keys are always allowed) */
	keys: readonly string[];
	required: readonly string[];
}

/**
 * Each verb's forms by subject; the first is the default when the line names none. `''` means the verb
 * takes no subject at all.
 */
export const VERB_FORMS: Record<Verb, Record<string, VerbForm>> = {
	zstar: { strip: { keys: ['l', 'phase'], required: ['l'] } },
	width: { strip: { keys: ['zstar'], required: ['zstar'] } },
	area: { strip: { keys: ['l', 'o', 'phase'], required: ['l'] }, ball: { keys: ['R', 'o'], required: ['R'] } },
	darea: { strip: { keys: ['l', 'o', 'phase'], required: ['l'] }, ball: { keys: ['R', 'o'], required: ['R'] } },
	entropy: { strip: { keys: ['l', 'o', 'G', 'phase'], required: ['l'] }, ball: { keys: ['R', 'o', 'G'], required: ['R'] } },
	dentropy: { strip: { keys: ['l', 'o', 'G', 'phase'], required: ['l'] }, ball: { keys: ['R', 'o', 'G'], required: ['R'] } },
	energy: { strip: { keys: ['l', 'G'], required: ['l'] }, ball: { keys: ['R', 'G'], required: ['R'] } },
	tent: { strip: { keys: ['l', 'o'], required: ['l'] }, ball: { keys: ['R', 'o'], required: ['R'] } },
	mu: { strip: { keys: ['l', 'o', 'of'], required: ['l'] } },
	firstlaw: { strip: { keys: ['l', 'o', 'tol', 'G'], required: ['l'] }, ball: { keys: ['R', 'o', 'tol', 'G'], required: ['R'] } },
	stress: { '': { keys: ['G'], required: [] } },
	thermo: { '': { keys: ['G'], required: [] } },
	coeffs: { darea: { keys: ['o'], required: ['o'] } },
	validity: { darea: { keys: ['o', 'tol'], required: ['o'] } },
	mi: { pair: { keys: ['l', 'gap', 'G'], required: ['l', 'gap'] } },
	resum: { strip: { keys: ['l', 'o'], required: ['l'] } },
	phases: { '': { keys: [], required: [] } }
};
