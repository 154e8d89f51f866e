/**
 * What a macro body may refer to: its own earlier lines (`#k`, k below the line's number), the names it `let`s
 * itself on earlier lines, the keys it gives on its own `use` lines, the bulk keys and pi, e — and, through
 * `{param}`, its parameters. Anything else would read the host pad (its #3, its lets), which is how a
 * published check once answered −0.1515 instead of 0 in somebody else's pad. Pure (the AST only), so the
 * server and the library page's editor refuse the same bodies with the same words.
 */
import type * as A from '../lang/ast';
import { ALL_BULK_KEYS } from '../lang/vocab';

const ALWAYS = new Set<string>(['pi', 'e', ...ALL_BULK_KEYS]);

export interface ScopeProblem {
	message: string;
	start: number;
	end: number;
}

function exprProblem(e: A.Expr, line: number, names: Set<string>): ScopeProblem | null {
	switch (e.type) {
		case 'number':
			return null;
		case 'ref':
			if (e.step >= 1 && e.step < line) return null;
			return {
				message:
					line === 1
						? `#${e.step} points outside this macro: line 1 has no earlier lines, and a body may refer only to its own earlier lines and its parameters`
						: `#${e.step} points outside this macro: a body may refer only to its own earlier lines (#1…#${line - 1}) and its parameters`,
				start: e.start,
				end: e.end
			};
		case 'name':
			if (ALWAYS.has(e.name) || names.has(e.name)) return null;
			return {
				message: `'${e.name}' is not defined in this macro: a body may use its parameters ({name}), names it lets on earlier lines, the bulk keys and pi, e`,
				start: e.start,
				end: e.end
			};
		case 'unary':
			return exprProblem(e.arg, line, names);
		case 'paren':
			return exprProblem(e.inner, line, names);
		case 'binary':
			return exprProblem(e.left, line, names) ?? exprProblem(e.right, line, names);
		case 'call':
			for (const a of e.args) {
				const p = exprProblem(a, line, names);
				if (p) return p;
			}
			return null;
	}
}

function valueProblem(v: A.Value, line: number, names: Set<string>): ScopeProblem | null {
	if (v.type === 'exact' || v.type === 'string') return null;
	if (v.type === 'list') {
		for (const it of v.items) {
			const p = valueProblem(it, line, names);
			if (p) return p;
		}
		return null;
	}
	if (v.type === 'range') {
		return exprProblem(v.from, line, names) ?? exprProblem(v.to, line, names) ?? (v.points ? exprProblem(v.points, line, names) : null);
	}
	return exprProblem(v, line, names);
}

function keysProblem(keys: A.KeyValue[], line: number, names: Set<string>): ScopeProblem | null {
	for (const kv of keys) {
		const p = valueProblem(kv.value, line, names);
		if (p) return p;
	}
	return null;
}

function statementProblem(s: A.Statement, line: number, names: Set<string>): ScopeProblem | null {
	switch (s.type) {
		case 'use': {
			const p = keysProblem(s.keys, line, names);
			// a custom metric's extra keys become names for the lines after
			for (const kv of s.keys) names.add(kv.key);
			return p;
		}
		case 'units':
		case 'verb':
		case 'compare':
		case 'macro':
			return keysProblem(s.keys, line, names);
		case 'arith':
			return exprProblem(s.expr, line, names);
		case 'plot':
			// `plot #9 #35` draws earlier steps: inside a macro only its own earlier lines
			for (const r of s.refs) {
				const p = exprProblem(r, line, names);
				if (p) return p;
			}
			return keysProblem(s.keys, line, names);
		case 'help':
			return null;
		case 'let': {
			const p = statementProblem(s.body, line, names);
			names.add(s.name.text);
			return p;
		}
	}
}

/**
 * The first reference of a parsed body line (1-based `line`) that leaves the macro's scope, or null. `names`
 * holds what earlier lines defined and gains this line's `let`s and `use` keys.
 */
export function scopeProblem(parsed: A.Line, line: number, names: Set<string>): ScopeProblem | null {
	for (const s of parsed.statements) {
		const p = statementProblem(s, line, names);
		if (p) return p;
	}
	return null;
}
