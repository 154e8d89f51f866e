/**
 * Checks a macro before it enters the library: its name, its parameters and every body line. Pure (the
 * parser only), so the server's POST/PATCH and the library page's live validation give the same answer.
 */
import { parse } from '../lang/parser';
import type { Line } from '../lang/ast';
import { scopeProblem } from './scope';

/** `@btz-check`: lower case, digits, `_`, and single inner hyphens, as the seeded library names them. */
export const MACRO_NAME = /^[a-z][a-z0-9_]*(?:-[a-z0-9_]+)*$/;
export const MACRO_NAME_MAX = 40;
/** parameter names become `key=value` keys at the call site, so they follow the language's name rule */
export const PARAM_NAME = /^[A-Za-z_][A-Za-z0-9_]*$/;
export const PARAMS_MAX = 12;
export const PARAM_DEFAULT_MAX = 100;
export const BODY_LINES_MAX = 20;
export const BODY_LINE_MAX = 300;

const PLACEHOLDER = /\{([^{}]*)\}/g;

export interface MacroProblem {
	message: string;
	/** 1-based body line the problem is on */
	line?: number;
	/** span into that line after substitution, when the parser gave one */
	start?: number;
	end?: number;
	hint?: string;
}

/** Every `{param}` replaced by its default, so the line can be parsed as it would run with no keys given. */
export function substituteDefaults(line: string, params: Record<string, string>): string {
	return line.replace(PLACEHOLDER, (whole, name: string) => (name in params ? params[name]! : whole));
}

/** The placeholders a body line uses. */
export function placeholdersOf(line: string): string[] {
	return [...line.matchAll(PLACEHOLDER)].map((m) => m[1]!);
}

export function checkMacroName(name: string): MacroProblem | null {
	if (name.length === 0) return { message: 'Give the macro a name.' };
	if (name.length > MACRO_NAME_MAX) return { message: `A macro name has at most ${MACRO_NAME_MAX} characters.` };
	if (!MACRO_NAME.test(name)) {
		return {
			message: `'${name}' is not a macro name: use lower-case letters, digits, '_' and inner '-', starting with a letter (e.g. btz-check).`
		};
	}
	return null;
}

export function checkParams(params: Record<string, string>): MacroProblem | null {
	const names = Object.keys(params);
	if (names.length > PARAMS_MAX) return { message: `A macro has at most ${PARAMS_MAX} parameters.` };
	for (const p of names) {
		if (!PARAM_NAME.test(p)) return { message: `Parameter '${p}' is not a name: letters, digits and '_', not starting with a digit.` };
		const value = params[p]!;
		if (value.trim().length === 0) return { message: `Parameter '${p}' needs a default value.` };
		if (value.length > PARAM_DEFAULT_MAX) return { message: `The default of '${p}' has more than ${PARAM_DEFAULT_MAX} characters.` };
		if (/[{}]/.test(value)) return { message: `The default of '${p}' may not contain '{' or '}'.` };
	}
	return null;
}

/**
 * Every body line must name only declared parameters, with the defaults put in, parse, and refer only to the
 * macro's own scope (library/scope.ts: its earlier lines and lets, never the host pad's steps or names). The
 * first problem wins, numbered from line 1, so the message can point at the line to fix.
 */
export function checkBody(body: string[], params: Record<string, string>): MacroProblem | null {
	if (body.length === 0) return { message: 'A macro needs at least one body line.' };
	if (body.length > BODY_LINES_MAX) return { message: `A macro has at most ${BODY_LINES_MAX} body lines.` };
	const names = new Set<string>();
	for (let i = 0; i < body.length; i++) {
		const line = body[i]!;
		const n = i + 1;
		if (line.trim().length === 0) return { line: n, message: `line ${n} is empty.` };
		if (line.length > BODY_LINE_MAX)
			return { line: n, message: `line ${n} has ${line.length} characters; at most ${BODY_LINE_MAX} are allowed.` };
		const unknown = placeholdersOf(line).find((p) => !(p in params));
		if (unknown !== undefined) {
			return {
				line: n,
				message: `line ${n}: {${unknown}} is not a parameter of this macro.`,
				hint: `declare ${unknown || 'it'} with a default`
			};
		}
		const text = substituteDefaults(line, params);
		let parsed: Line;
		try {
			parsed = parse(text);
		} catch (e) {
			const err = e as { message?: string; start?: number; end?: number; hint?: string };
			const problem: MacroProblem = { line: n, message: `line ${n}: ${err.message ?? String(e)}` };
			if (typeof err.start === 'number') problem.start = err.start;
			if (typeof err.end === 'number') problem.end = err.end;
			if (err.hint) problem.hint = err.hint;
			return problem;
		}
		const outside = scopeProblem(parsed, n, names);
		if (outside) return { line: n, message: `line ${n}: ${outside.message}.`, start: outside.start, end: outside.end };
	}
	return null;
}

/** Name, parameters and body together; null when the macro may be proposed. */
export function checkMacro(m: { name?: string; params: Record<string, string>; body: string[] }): MacroProblem | null {
	return (m.name === undefined ? null : checkMacroName(m.name)) ?? checkParams(m.params) ?? checkBody(m.body, m.params);
}
