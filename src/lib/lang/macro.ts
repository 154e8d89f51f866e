/**
 * `@name k=v …` runs an approved macro from the library: each body line, with `{param}` replaced by the
 * text given on the call (or the parameter's default), runs in the pad's evolving state and its results are
 * appended in order. Errors inside a body point at the call and say which body line failed; macros calling
 * macros stop at the macro-depth limit.
 */
import type * as A from './ast';
import type { LineEnv, StatementOut } from './env';
import { LangError } from './errors';
import { limitError } from './limits';
import type { Result, StepRef } from './result';
import { didYouMean } from './suggest';

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
		values[kv.key] = input.slice(kv.value.start, kv.value.end);
	}
	for (const [k, v] of Object.entries(values)) {
		if (v.trim() === '') throw new LangError(`@${name} needs ${k}=…`, s.name.start, s.name.end);
	}

	const results: Result[] = [];
	let ref: StepRef | undefined;
	env.macroDepth++;
	try {
		m.body.forEach((raw, i) => {
			const text = raw.replace(/\{(\w+)\}/g, (_whole, p: string) => {
				if (!Object.prototype.hasOwnProperty.call(values, p)) {
					throw new LangError(`macro '@${name}' line ${i + 1} uses {${p}}, which is not one of its parameters`, s.start, s.end);
				}
				return values[p]!;
			});
			try {
				const out = runText(text, env);
				results.push(...out.results);
				if (out.ref) ref = out.ref;
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
		env.macroDepth--;
	}
	return { results, ...(ref ? { ref } : {}) };
}
