/**
 * Arithmetic through the one formula sandbox (holo/formula.ts) that metric strings use too: the tree the
 * language's parser built is printed as text, parsed again by mathjs, checked against the sandbox's
 * allow-list and evaluated by its own walker over plain JS Math — mathjs never evaluates anything, so no
 * line can change state another user's line would see.
 *
 * Defence in depth: the language's own parser already admits only numbers, names bound by us, step
 * references and a whitelist of functions; the sandbox checks the same again on what mathjs parsed. The
 * killable evaluation process with a time budget lives in the server (src/lib/server/eval).
 */
import { compileFormula, evaluateFormula, FormulaError } from '../holo/formula';
import type * as A from './ast';
import { LangError } from './errors';
import { getOwn } from './own';
import { printMathjs, refIdentifier } from './printer';

/**
 * Evaluate raw text in the sandbox with a scope of numbers (strict: no complex results). Exported for the
 * security tests; the language itself goes through `evaluateExpr`.
 */
export function sandboxEvaluate(text: string, scope: Map<string, number> = new Map()): number {
	return evaluateFormula(text, scope, { strict: true });
}

/** Resolves a name or step reference to a number, or throws a LangError pointing at it. */
export type Resolver = (node: A.NameExpr | A.RefExpr) => number;

const LANG_FORMULA_LIMITS = { maxDepth: 1000, maxNodes: 4000 };

const BUILTIN_CONSTANTS: Record<string, number> = { pi: Math.PI, e: Math.E };

/** Evaluate one arithmetic tree to a finite real number. Throws LangError spanning the expression. */
export function evaluateExpr(expr: A.Expr, resolve: Resolver): number {
	if (expr.type === 'number') return expr.value; // the common case needs no mathjs at all
	const scope = new Map<string, number>();
	bind(expr, resolve, scope);
	let out: number;
	try {
		// printMathjs brackets every operation, so a long sum nests deeply; the parser's token limit bounds it
		const formula = compileFormula(printMathjs(expr), [...scope.keys()], { strict: true, limits: LANG_FORMULA_LIMITS });
		out = formula.evaluate([...scope.values()]);
	} catch (e) {
		if (e instanceof FormulaError && e.code === 'complex') throw new LangError('arithmetic gives a complex number', expr.start, expr.end);
		throw new LangError(`cannot evaluate: ${e instanceof Error ? e.message : String(e)}`, expr.start, expr.end);
	}
	if (!Number.isFinite(out)) {
		throw new LangError('arithmetic gives no finite number', expr.start, expr.end, { hint: 'division by zero?' });
	}
	return out;
}

/** Binds every name and reference of the tree in the scope, so mathjs never falls back to its own symbols. */
function bind(e: A.Expr, resolve: Resolver, scope: Map<string, number>): void {
	switch (e.type) {
		case 'number':
			return;
		case 'name': {
			if (scope.has(e.name)) return;
			const c = getOwn(BUILTIN_CONSTANTS, e.name);
			scope.set(e.name, c ?? resolve(e));
			return;
		}
		case 'ref':
			scope.set(refIdentifier(e.step, e.field, e.name), resolve(e));
			return;
		case 'unary':
			return bind(e.arg, resolve, scope);
		case 'paren':
			return bind(e.inner, resolve, scope);
		case 'binary':
			bind(e.left, resolve, scope);
			return bind(e.right, resolve, scope);
		case 'call':
			for (const a of e.args) bind(a, resolve, scope);
			return;
	}
}
