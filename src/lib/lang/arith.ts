/**
 * Arithmetic through a separate, restricted mathjs instance, following mathjs's guidance for untrusted
 * expressions: keep a private reference to `evaluate`, then override `import`, `createUnit`, `reviver`,
 * `evaluate`, `parse`, `simplify`, `derivative` and `resolve` (and a few more entry points to the parser) with
 * functions that throw, and evaluate with a fresh `Map` scope. The shared default mathjs instance — which the
 * engine may use — is never touched.
 *
 * Defence in depth: the language's own parser already admits only numbers, names bound by us, step
 * references and a whitelist of functions; mathjs only ever sees text printed from that tree. The killable
 * worker with a time budget lives in the server (src/lib/server/eval).
 */
import { all, create } from 'mathjs';
import type * as A from './ast';
import { LangError } from './errors';
import { getOwn } from './own';
import { printMathjs, refIdentifier } from './printer';

const math = create(all!, { number: 'number' });
/** The private reference; after the import below, `math.evaluate` itself throws. */
const limitedEvaluate = math.evaluate;

const DISABLED = [
	'import',
	'createUnit',
	'reviver',
	'evaluate',
	'parse',
	'simplify',
	'derivative',
	'resolve',
	'compile',
	'parser',
	'config'
] as const;

function disabled(name: string): () => never {
	return () => {
		throw new Error(`Function ${name} is disabled`);
	};
}
math.import(Object.fromEntries(DISABLED.map((n) => [n, disabled(n)])), { override: true });

/**
 * Evaluate raw text in the restricted instance with a fresh Map scope. Exported for the security tests;
 * the language itself goes through `evaluateExpr`.
 */
export function sandboxEvaluate(text: string, scope: Map<string, unknown> = new Map()): unknown {
	return limitedEvaluate(text, scope);
}

/** Resolves a name or step reference to a number, or throws a LangError pointing at it. */
export type Resolver = (node: A.NameExpr | A.RefExpr) => number;

const BUILTIN_CONSTANTS: Record<string, number> = { pi: Math.PI, e: Math.E };

/** Evaluate one arithmetic tree to a finite real number. Throws LangError spanning the expression. */
export function evaluateExpr(expr: A.Expr, resolve: Resolver): number {
	if (expr.type === 'number') return expr.value; // the common case needs no mathjs at all
	const scope = new Map<string, unknown>();
	bind(expr, resolve, scope);
	let out: unknown;
	try {
		out = limitedEvaluate(printMathjs(expr), scope);
	} catch (e) {
		throw new LangError(`cannot evaluate: ${e instanceof Error ? e.message : String(e)}`, expr.start, expr.end);
	}
	return toReal(out, expr);
}

/** Binds every name and reference of the tree in the scope, so mathjs never falls back to its own symbols. */
function bind(e: A.Expr, resolve: Resolver, scope: Map<string, unknown>): void {
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
			scope.set(refIdentifier(e.step, e.field), resolve(e));
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

function toReal(out: unknown, expr: A.Expr): number {
	let v: number | undefined;
	if (typeof out === 'number') v = out;
	else if (math.isComplex(out)) {
		const c = out as { re: number; im: number };
		if (c.im === 0) v = c.re;
		else throw new LangError('arithmetic gives a complex number', expr.start, expr.end);
	} else if (math.isBigNumber(out) || math.isFraction(out)) v = math.number(out as never) as number;
	if (v === undefined) throw new LangError('arithmetic must give a number', expr.start, expr.end);
	if (!Number.isFinite(v)) {
		throw new LangError('arithmetic gives no finite number', expr.start, expr.end, { hint: 'division by zero?' });
	}
	return v;
}
