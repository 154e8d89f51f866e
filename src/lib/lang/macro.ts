/**
 * `@name k=v …` runs an approved macro from the library: each body line, with `{param}` replaced by the
 * text given on the call (or the parameter's default), runs and its results are appended in order. Errors
 * inside a body point at the call and say which body line failed; macros calling macros stop at the
 * macro-depth limit.
 *
 * A macro runs in its own scope, so it cannot surprise the pad it runs in (a published check once read the
 * host pad's #3 and answered −0.1515 instead of 0): inside the body `#k` is the macro's own line k, names are
 * only the ones the body `let`s itself (plus the bulk keys and pi, e), and the pad's lets are invisible. It
 * starts in the pad's bulk and units; afterwards they are put back unless the header's `effects` declares
 * 'bulk' or 'units'. Its own lets never reach the pad. library/check.ts refuses, before a macro is stored,
 * any body that refers to something outside this scope.
 */
import type * as A from './ast';
import type { LineEnv, StatementOut } from './env';
import { LangError } from './errors';
import { limitError } from './limits';
import type { MacroEffect, Result, StepRef } from './result';
import { didYouMean } from './suggest';
import { evaluateExpr } from './arith';
import { resolverFor } from './values';

export type RunText = (text: string, env: LineEnv) => StatementOut;

export function runMacro(s: A.MacroStmt, input: string, env: LineEnv, runText: RunText): StatementOut {
	const name = s.name.text;
	const macros = env.ctx.macros ?? {};
	const m = Object.prototype.hasOwnProperty.call(macros, name) ? macros[name] : undefined;
	if (!m) {
		throw new LangError(`unknown macro '@${name}'${didYouMean(name, Object.keys(macros)).replace(" '", " '@")}`, s.name.start, s.name.end, {
			hint: Object.keys(macros).length
				? `approved macros: ${Object.keys(macros)
						.map((k) => `@${k}`)
						.join(', ')}`
				: 'the library has no approved macros yet'
		});
	}
	if (env.macroDepth + 1 > env.limits.maxMacroDepth) {
		throw limitError('maxMacroDepth', `macros nest more than ${env.limits.maxMacroDepth} deep`, s.start, s.end, env.limits);
	}
	const values: Record<string, string> = { ...m.params };
	for (const kv of s.keys) {
		if (!Object.prototype.hasOwnProperty.call(m.params, kv.key)) {
			const names = Object.keys(m.params);
			throw new LangError(`macro '@${name}' has no parameter '${kv.key}'${didYouMean(kv.key, names)}`, kv.keySpan.start, kv.keySpan.end, {
				hint: names.length ? `parameters: ${names.join(', ')}` : `@${name} takes no parameters`
			});
		}
		values[kv.key] = callValueText(kv.value, input, env);
	}
	for (const [k, v] of Object.entries(values)) {
		if (v.trim() === '') throw new LangError(`@${name} needs ${k}=…`, s.name.start, s.name.end);
	}

	const results: Result[] = [];
	let ref: StepRef | undefined;
	// the macro's own scope: its lines are its steps, its lets its own; bulk and units start as the pad's
	const ownRefs: Record<number, StepRef> = {};
	const scope: LineEnv = {
		...env,
		ctx: { ...env.ctx, refs: ownRefs, lets: {} },
		bulk: { name: env.bulk.name, params: { ...env.bulk.params } },
		units: { ...env.units },
		lets: {},
		macroDepth: env.macroDepth + 1
	};
	try {
		m.body.forEach((raw, i) => {
			const text = raw.replace(/\{(\w+)\}/g, (_whole, p: string) => {
				if (!Object.prototype.hasOwnProperty.call(values, p)) {
					throw new LangError(`macro '@${name}' line ${i + 1} uses {${p}}, which is not one of its parameters`, s.start, s.end);
				}
				return values[p]!;
			});
			try {
				const out = runText(text, scope);
				results.push(...out.results);
				if (out.ref) {
					ref = out.ref;
					ownRefs[i + 1] = out.ref;
				}
			} catch (e) {
				if (!(e instanceof LangError)) throw e;
				// the span of a body line means nothing in the typed line: point at the call instead
				throw new LangError(`in @${name}, line ${i + 1}: ${e.message}`, s.start, s.end, {
					code: e.code,
					hint: e.code === 'limit' && e.hint ? e.hint : `@${name} line ${i + 1}: ${text}`
				});
			}
		});
	} finally {
		// sweep points count against the whole line, inside a macro or not
		env.pointsUsed = scope.pointsUsed;
	}
	const effects = m.effects ?? [];
	if (effects.includes('bulk')) env.bulk = scope.bulk;
	if (effects.includes('units')) env.units = scope.units;
	const kept = restoredNote(name, effects, env, scope);
	if (kept) results.push(kept);
	return { results, ...(ref ? { ref } : {}) };
}

/** Whether a call's value reads the caller's steps or names (`l=#3`, `l=zh/2`, `l=w`). */
function readsCaller(v: A.Value | A.Expr): boolean {
	switch (v.type) {
		case 'ref':
			return true;
		case 'name':
			return v.name !== 'pi' && v.name !== 'e';
		case 'unary':
			return readsCaller(v.arg);
		case 'paren':
			return readsCaller(v.inner);
		case 'binary':
			return readsCaller(v.left) || readsCaller(v.right);
		case 'call':
			return v.args.some(readsCaller);
		case 'list':
			return v.items.some(readsCaller);
		case 'range':
			return readsCaller(v.from) || readsCaller(v.to) || (!!v.points && readsCaller(v.points));
		default:
			return false;
	}
}

/**
 * A call's key value as text for the body. `#3` or a let-name on the call line means the caller's, but the
 * body runs in the macro's scope, where `#3` is its own line 3: such values are evaluated here, in the
 * caller's scope, and go in as numbers.
 */
function callValueText(v: A.Value, input: string, env: LineEnv): string {
	if (!readsCaller(v)) return input.slice(v.start, v.end);
	const resolve = resolverFor({ ctx: env.ctx, lets: env.lets, bulk: env.bulk.params });
	const num = (e: A.Expr) => String(evaluateExpr(e, resolve));
	const item = (it: A.Item) => (it.type === 'exact' || it.type === 'string' ? input.slice(it.start, it.end) : num(it));
	if (v.type === 'list') return v.items.map(item).join(',');
	if (v.type === 'range') return `${num(v.from)}..${num(v.to)}${v.points ? `:${num(v.points)}` : ''}`;
	return item(v);
}

/** Says so when the macro changed the bulk or units and they were put back (its header did not declare them). */
function restoredNote(name: string, effects: readonly MacroEffect[], env: LineEnv, scope: LineEnv): Result | null {
	const put: string[] = [];
	if (!effects.includes('bulk') && JSON.stringify(scope.bulk) !== JSON.stringify(env.bulk)) put.push('bulk');
	if (!effects.includes('units') && JSON.stringify(scope.units) !== JSON.stringify(env.units)) put.push('units');
	if (put.length === 0) return null;
	return { kind: 'note', text: `@${name} ran in its own scope: the pad's ${put.join(' and ')} ${put.length > 1 ? 'are' : 'is'} as before` };
}
