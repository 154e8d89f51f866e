/**
 * The one sandbox for every formula a user types: the language's arithmetic (src/lib/lang/arith.ts) and the
 * metric strings of `use metric f="…"` (bulks/sandbox.ts) both come here.
 *
 * mathjs only parses. The parse tree is walked against an allow-list BEFORE anything runs: number constants,
 * names bound by the caller (plus pi and e), + − × ÷ ^ and unary ±, brackets, and calls of the elementary
 * functions in FUNCTIONS by name — nothing else (no strings, matrices, ranges, objects, indexing, property
 * access, assignment, function definitions, conditionals, units). Text, node count and nesting are bounded.
 *
 * Why our own evaluator instead of mathjs's evaluate/compile: the checked tree is compiled into closures over
 * plain JS Math, so no string can ever reach `config`, `import`, `createUnit`, `compile`, `parser` or a matrix
 * constructor — those are not merely disabled, they are not reachable. The mathjs instance holds the parser
 * only (created from `parseDependencies`), is private to this module and never evaluates anything, and the
 * function table is frozen with no prototype: there is no state a formula could change for the next user,
 * and the numbers are IEEE doubles whatever anyone typed before.
 */
import { create, parseDependencies, type MathNode } from 'mathjs';
import { gamma } from './special/gamma';

const parser = create({ parseDependencies }, { number: 'number' });
const parseText: (text: string) => MathNode = parser.parse.bind(parser);

export type FormulaErrorCode = 'syntax' | 'refused' | 'limit' | 'complex';

export class FormulaError extends Error {
	constructor(
		message: string,
		public code: FormulaErrorCode
	) {
		super(message);
		this.name = 'FormulaError';
	}
}

export interface FormulaLimits {
	/** characters of text */
	maxLength: number;
	/** nodes of the parsed tree */
	maxNodes: number;
	/** nesting of brackets, operators and calls */
	maxDepth: number;
}

export const FORMULA_LIMITS: Readonly<FormulaLimits> = Object.freeze({ maxLength: 2000, maxNodes: 600, maxDepth: 64 });

type Real = (...xs: number[]) => number;
interface FunctionSpec {
	fn: Real;
	/** fewest and most arguments */
	min: number;
	max: number;
	/** a NaN from non-NaN arguments means the real result does not exist (mathjs would answer a complex) */
	domain?: boolean;
}

/** Half away from zero, as mathjs rounds (Math.round sends −2.5 to −2). */
const roundHalfAway = (x: number) => Math.sign(x) * Math.round(Math.abs(x));

/** The elementary functions a formula may call: the language's list (lang/vocab.ts FUNCTIONS). */
const FUNCTIONS: Readonly<Record<string, FunctionSpec>> = Object.freeze(
	Object.assign(Object.create(null), {
		sqrt: { fn: Math.sqrt, min: 1, max: 1, domain: true },
		cbrt: { fn: Math.cbrt, min: 1, max: 1 },
		exp: { fn: Math.exp, min: 1, max: 1 },
		log: { fn: (x: number, b?: number) => (b === undefined ? Math.log(x) : Math.log(x) / Math.log(b)), min: 1, max: 2, domain: true },
		log10: { fn: Math.log10, min: 1, max: 1, domain: true },
		log2: { fn: Math.log2, min: 1, max: 1, domain: true },
		sin: { fn: Math.sin, min: 1, max: 1 },
		cos: { fn: Math.cos, min: 1, max: 1 },
		tan: { fn: Math.tan, min: 1, max: 1 },
		asin: { fn: Math.asin, min: 1, max: 1, domain: true },
		acos: { fn: Math.acos, min: 1, max: 1, domain: true },
		atan: { fn: Math.atan, min: 1, max: 1 },
		sinh: { fn: Math.sinh, min: 1, max: 1 },
		cosh: { fn: Math.cosh, min: 1, max: 1 },
		tanh: { fn: Math.tanh, min: 1, max: 1 },
		asinh: { fn: Math.asinh, min: 1, max: 1 },
		acosh: { fn: Math.acosh, min: 1, max: 1, domain: true },
		atanh: { fn: Math.atanh, min: 1, max: 1, domain: true },
		abs: { fn: Math.abs, min: 1, max: 1 },
		gamma: { fn: gamma, min: 1, max: 1 },
		min: { fn: Math.min, min: 1, max: 16 },
		max: { fn: Math.max, min: 1, max: 16 },
		pow: { fn: Math.pow, min: 2, max: 2, domain: true },
		floor: { fn: Math.floor, min: 1, max: 1 },
		ceil: { fn: Math.ceil, min: 1, max: 1 },
		round: { fn: roundHalfAway, min: 1, max: 1 }
	} satisfies Record<string, FunctionSpec>)
);

export const FORMULA_FUNCTIONS: readonly string[] = Object.freeze(Object.keys(FUNCTIONS));

const CONSTANTS: Readonly<Record<string, number>> = Object.freeze(Object.assign(Object.create(null), { pi: Math.PI, e: Math.E }));

const OPERATORS: Readonly<Record<string, Real>> = Object.freeze(
	Object.assign(Object.create(null), {
		add: (a: number, b: number) => a + b,
		subtract: (a: number, b: number) => a - b,
		multiply: (a: number, b: number) => a * b,
		divide: (a: number, b: number) => a / b,
		pow: Math.pow,
		unaryMinus: (a: number) => -a,
		unaryPlus: (a: number) => a
	})
);

/** What each refused node type is, in a user's words. */
const REFUSED: Readonly<Record<string, string>> = Object.freeze(
	Object.assign(Object.create(null), {
		AssignmentNode: 'assignment is not allowed',
		FunctionAssignmentNode: 'function definitions are not allowed',
		ArrayNode: 'matrices and lists are not allowed',
		RangeNode: 'ranges are not allowed',
		IndexNode: 'indexing is not allowed',
		AccessorNode: 'properties and indexing are not allowed',
		ObjectNode: 'objects are not allowed',
		BlockNode: "one formula only (no ';' or line breaks)",
		ConditionalNode: 'conditionals are not allowed',
		RelationalNode: 'comparisons are not allowed'
	})
);

/** A checked formula: evaluate with the values of `names`, in that order. Frozen. */
export interface Formula {
	readonly names: readonly string[];
	evaluate(values: readonly number[]): number;
}

type Compiled = (v: readonly number[]) => number;

/** Cheap bracket scan before mathjs's recursive parser sees hostile nesting. */
function bracketDepth(text: string): number {
	let depth = 0;
	let worst = 0;
	for (const ch of text) {
		if (ch === '(' || ch === '[' || ch === '{') worst = Math.max(worst, ++depth);
		else if (ch === ')' || ch === ']' || ch === '}') depth--;
	}
	return worst;
}

/**
 * Parses and checks `text` against the allow-list, then compiles it. `names` are the variables it may use.
 * With `strict`, a function or power with no real value (sqrt(−1), log(−1), (−8)^(1/3)) throws 'complex'
 * instead of giving NaN — the language wants the error, a metric scan wants the NaN.
 */
export function compileFormula(
	text: string,
	names: readonly string[],
	opts: { strict?: boolean; limits?: Partial<FormulaLimits> } = {}
): Formula {
	const limits = { ...FORMULA_LIMITS, ...(opts.limits ?? {}) };
	if (typeof text !== 'string') throw new FormulaError('a formula must be text', 'refused');
	if (text.length > limits.maxLength) throw new FormulaError(`is longer than ${limits.maxLength} characters`, 'limit');
	if (bracketDepth(text) > limits.maxDepth) throw new FormulaError(`is nested more than ${limits.maxDepth} deep`, 'limit');
	let root: MathNode;
	try {
		root = parseText(text);
	} catch (e) {
		if (e instanceof RangeError) throw new FormulaError(`is nested more than ${limits.maxDepth} deep`, 'limit');
		throw new FormulaError(`does not parse: ${(e as Error).message}`, 'syntax');
	}
	const index = new Map<string, number>();
	names.forEach((n, i) => index.set(n, i));
	let nodes = 0;
	const strict = opts.strict === true;

	const walk = (node: MathNode, depth: number): Compiled => {
		if (++nodes > limits.maxNodes) throw new FormulaError(`has more than ${limits.maxNodes} parts`, 'limit');
		if (depth > limits.maxDepth) throw new FormulaError(`is nested more than ${limits.maxDepth} deep`, 'limit');
		const n = node as MathNode & Record<string, unknown>;
		switch (node.type) {
			case 'ConstantNode': {
				const value = n.value;
				if (typeof value !== 'number') {
					throw new FormulaError(
						typeof value === 'string' ? 'strings are not allowed' : `only numbers are allowed (got ${String(value)})`,
						'refused'
					);
				}
				return () => value;
			}
			case 'SymbolNode': {
				const name = n.name as string;
				const i = index.get(name);
				if (i !== undefined) return (v) => v[i]!;
				const c = CONSTANTS[name];
				if (c !== undefined) return () => c;
				if (FUNCTIONS[name]) throw new FormulaError(`'${name}' is a function: call it, e.g. ${name}(z)`, 'refused');
				throw new FormulaError(`unknown name '${name}'`, 'refused');
			}
			case 'ParenthesisNode':
				return walk(n.content as MathNode, depth + 1);
			case 'OperatorNode': {
				const op = OPERATORS[n.fn as string];
				if (!op) throw new FormulaError(`operator '${n.op as string}' is not allowed`, 'refused');
				const args = (n.args as MathNode[]).map((a) => walk(a, depth + 1));
				if (args.length === 1) {
					const [a] = args as [Compiled];
					return (v) => op(a(v));
				}
				const [a, b] = args as [Compiled, Compiled];
				if (strict && n.fn === 'pow') return checked('^', op, args);
				return (v) => op(a(v), b(v));
			}
			case 'FunctionNode': {
				const target = n.fn as MathNode & { name?: string };
				if (target.type !== 'SymbolNode') throw new FormulaError('only named functions can be called', 'refused');
				const name = target.name!;
				const spec = FUNCTIONS[name];
				if (!spec) throw new FormulaError(`function '${name}' is not allowed`, 'refused');
				const argNodes = n.args as MathNode[];
				if (argNodes.length < spec.min || argNodes.length > spec.max) {
					const want = spec.min === spec.max ? `${spec.min}` : `${spec.min} to ${spec.max}`;
					throw new FormulaError(`${name} takes ${want} argument${spec.max === 1 ? '' : 's'}, got ${argNodes.length}`, 'refused');
				}
				const args = argNodes.map((a) => walk(a, depth + 1));
				if (strict && spec.domain) return checked(`${name}()`, spec.fn, args);
				if (args.length === 1) {
					const [a] = args as [Compiled];
					return (v) => spec.fn(a(v));
				}
				return (v) => spec.fn(...args.map((a) => a(v)));
			}
			default:
				throw new FormulaError(REFUSED[node.type] ?? `${node.type} is not allowed`, 'refused');
		}
	};

	const body = walk(root, 0);
	return Object.freeze({
		names: Object.freeze([...names]),
		evaluate(values: readonly number[]): number {
			if (values.length !== names.length) throw new FormulaError(`needs ${names.length} values, got ${values.length}`, 'refused');
			return body(values);
		}
	});
}

/** A function or power whose NaN from numbers means "no real value". */
function checked(what: string, fn: Real, args: Compiled[]): Compiled {
	return (v) => {
		const xs = args.map((a) => a(v));
		const r = fn(...xs);
		if (Number.isNaN(r) && !xs.some(Number.isNaN)) throw new FormulaError(`${what} has no real value here`, 'complex');
		return r;
	};
}

/** One-off evaluation with a scope of numbers (the language's arithmetic, the security tests). */
export function evaluateFormula(
	text: string,
	scope: ReadonlyMap<string, number> | Record<string, number> = {},
	opts: { strict?: boolean; limits?: Partial<FormulaLimits> } = {}
): number {
	const entries = scope instanceof Map ? [...scope.entries()] : Object.entries(scope);
	const f = compileFormula(
		text,
		entries.map(([k]) => k),
		opts
	);
	return f.evaluate(entries.map(([, v]) => v));
}

/**
 * A checked formula as a plain tree, for code that reads its structure rather than its values (the metric's
 * Taylor coefficients, holo/metric/). Refused exactly as compileFormula refuses (it runs first), so the tree
 * holds only numbers, the bound names and constants, + − × ÷ ^, unary ± and the allowed function calls.
 */
export type FormulaTree =
	| { kind: 'num'; value: number }
	| { kind: 'name'; name: string }
	| { kind: 'op'; op: 'add' | 'subtract' | 'multiply' | 'divide' | 'pow' | 'unaryMinus' | 'unaryPlus'; args: FormulaTree[] }
	| { kind: 'call'; name: string; args: FormulaTree[] };

export function readFormulaTree(text: string, names: readonly string[], opts: { limits?: Partial<FormulaLimits> } = {}): FormulaTree {
	compileFormula(text, names, opts);
	const toTree = (node: MathNode): FormulaTree => {
		const n = node as MathNode & Record<string, unknown>;
		switch (node.type) {
			case 'ConstantNode':
				return { kind: 'num', value: n.value as number };
			case 'SymbolNode':
				return { kind: 'name', name: n.name as string };
			case 'ParenthesisNode':
				return toTree(n.content as MathNode);
			case 'OperatorNode':
				return { kind: 'op', op: n.fn as 'add', args: (n.args as MathNode[]).map(toTree) };
			default:
				return { kind: 'call', name: (n.fn as { name: string }).name, args: (n.args as MathNode[]).map(toTree) };
		}
	};
	return toTree(parseText(text));
}
