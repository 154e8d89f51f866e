/**
 * Recursive-descent parser for one console line (LANGUAGE.md). One method per production, the production
 * quoted above it. Spans are offsets into the typed line; every error is a LangError pointing at the token
 * that could not be read, worded "Expected X, found Y" where a token was expected.
 *
 * Decisions the spec leaves open, kept here so they are in one place:
 * - A bare name at the start of a statement is a verb if it is one; a name followed by a key (`dara l=1`) is a
 *   misspelled verb; anything else is arithmetic (`area_fin * 4`).
 * - After a verb, a word that is not followed by '=' is its subject: a shape (strip, ball, pair) or, for
 *   coeffs/validity/resum, the quantity (`coeffs darea o=4`).
 * - Keys are checked for duplicates here, alias-aware (`o` and `order` are one key; `v` and `rapidity`
 *   conflict), and the error points at the second one.
 */
import type * as A from './ast';
import { LangError, expected } from './errors';
import { lex } from './lexer';
import { type Limits, limitError, resolveLimits } from './limits';
import { didYouMean } from './suggest';
import { Tok, type Token, describeToken } from './token';
import {
	ALL_BULK_KEYS,
	BULKS,
	CONSTANTS,
	FUNCTIONS,
	KEYWORDS,
	KEY_CONFLICTS,
	SHAPES,
	SINKS,
	UNIT_SYSTEMS,
	verbNames,
	canonicalKey,
	isVerb
} from './vocab';

/** Parse one line into its statements. Throws LangError. */
export function parse(input: string, limits?: Partial<Limits>): A.Line {
	return new Parser(input, resolveLimits(limits)).parseLine();
}

/** Parse one arithmetic expression on its own (used for macro parameter defaults and tests). */
export function parseExpression(input: string, limits?: Partial<Limits>): A.Expr {
	const p = new Parser(input, resolveLimits(limits));
	const e = p.parseExpr();
	p.expectEnd();
	return e;
}

const RESERVED: ReadonlySet<string> = new Set<string>([...KEYWORDS, ...CONSTANTS, ...FUNCTIONS, ...ALL_BULK_KEYS, ...BULKS]);
/** Words a `let` may not name: the reserved ones and every registered verb (looked up now: the registry can grow). */
const isNotLetName = (name: string): boolean => RESERVED.has(name) || isVerb(name);

/** Keys that would reach Object.prototype when a line's keys become an object. */
const RESERVED_KEYS: ReadonlySet<string> = new Set(['__proto__', 'constructor', 'prototype']);

class Parser {
	private readonly tokens: Token[];
	private pos = 0;
	private depth = 0;

	constructor(
		private readonly input: string,
		private readonly limits: Limits
	) {
		this.tokens = lex(input, limits);
	}

	// ── helpers ───────────────────────────────────────────────────────────────
	private peek(ahead = 0): Token {
		return this.tokens[Math.min(this.pos + ahead, this.tokens.length - 1)]!;
	}
	private next(): Token {
		const t = this.peek();
		if (t.kind !== Tok.End) this.pos++;
		return t;
	}
	private at(kind: Tok, text?: string): boolean {
		const t = this.peek();
		return t.kind === kind && (text === undefined || t.text === text);
	}
	private expect(kind: Tok, what: string = kind): Token {
		const t = this.peek();
		if (t.kind !== kind) throw this.unexpected(what, t);
		return this.next();
	}
	private unexpected(what: string, t: Token = this.peek(), hint?: string): LangError {
		return expected(what, describeToken(t), t.start, Math.max(t.end, t.start + (t.kind === Tok.End ? 0 : 1)), hint);
	}
	private lastEnd(): number {
		return this.pos === 0 ? 0 : this.tokens[this.pos - 1]!.end;
	}
	private word(t: Token): A.Word {
		return { text: t.text, start: t.start, end: t.end };
	}
	/** Called once a whole expression has been read on its own. */
	expectEnd(): void {
		if (!this.at(Tok.End)) throw this.unexpected('end of expression');
	}

	// ── statements ────────────────────────────────────────────────────────────
	/** Line := [Statement] (';' [Statement])* End */
	parseLine(): A.Line {
		const statements: A.Statement[] = [];
		for (;;) {
			if (!this.at(Tok.Semi) && !this.at(Tok.End)) {
				if (statements.length >= this.limits.maxStatements) {
					const t = this.peek();
					throw limitError(
						'maxStatements',
						`more than ${this.limits.maxStatements} statements on one line`,
						t.start,
						this.input.length,
						this.limits
					);
				}
				statements.push(this.parseStatement());
				if (!this.at(Tok.Semi) && !this.at(Tok.End)) {
					throw this.unexpected("';' or end of line", this.peek(), this.endHint(statements[statements.length - 1]!));
				}
			}
			if (this.at(Tok.End)) break;
			this.expect(Tok.Semi);
		}
		return { type: 'line', statements, start: 0, end: this.input.length };
	}

	private endHint(s: A.Statement): string | undefined {
		if (s.type === 'arith' && this.at(Tok.Equals) && s.expr.type === 'name') {
			return `to keep a value write: let ${s.expr.name} = …`;
		}
		if (s.type === 'arith' && this.at(Tok.Name)) return 'keys belong after a verb: <verb> key=value …';
		return undefined;
	}

	/** Statement := UseStmt | UnitsStmt | LetStmt | CompareStmt | MacroStmt | VerbStmt | ArithStmt */
	private parseStatement(): A.Statement {
		const t = this.peek();
		if (t.kind === Tok.Macro) return this.parseMacro();
		if (t.kind === Tok.Name) {
			switch (t.text) {
				case 'use':
					return this.parseUse();
				case 'units':
					return this.parseUnits();
				case 'let':
					return this.parseLet();
				case 'compare':
					return this.parseCompare();
				case 'sweep':
					return this.parseVerb();
			}
			if (isVerb(t.text)) return this.parseVerb();
			const after = this.peek(1);
			if (after.kind === Tok.Name || after.kind === Tok.Pipe) {
				throw new LangError(`unknown verb '${t.text}'${didYouMean(t.text, verbNames())}`, t.start, t.end, {
					hint: `verbs: ${verbNames().join(', ')}`
				});
			}
		}
		return this.parseArith();
	}

	/** UseStmt := 'use' Bulk KeyValue* */
	private parseUse(): A.UseStmt {
		const kw = this.next();
		const b = this.peek();
		if (b.kind !== Tok.Name) throw this.unexpected('a bulk name', b, `bulks: ${BULKS.join(', ')}`);
		this.next();
		if (!(BULKS as readonly string[]).includes(b.text)) {
			throw new LangError(`unknown bulk '${b.text}'${didYouMean(b.text, BULKS)}`, b.start, b.end, {
				hint: `bulks: ${BULKS.join(', ')}`
			});
		}
		const keys = this.parseKeyValues();
		return { type: 'use', bulk: this.word(b), keys, start: kw.start, end: this.lastEnd() };
	}

	/** UnitsStmt := 'units' ('geo' | 'cft' | 'sym') KeyValue* */
	private parseUnits(): A.UnitsStmt {
		const kw = this.next();
		const s = this.peek();
		if (s.kind !== Tok.Name) throw this.unexpected('a unit system (geo, cft or sym)', s);
		this.next();
		if (!(UNIT_SYSTEMS as readonly string[]).includes(s.text)) {
			throw new LangError(`unknown unit system '${s.text}'${didYouMean(s.text, UNIT_SYSTEMS)}`, s.start, s.end, {
				hint: 'units geo G=…, units cft c=…, units sym N=…'
			});
		}
		const keys = this.parseKeyValues();
		return { type: 'units', system: this.word(s), keys, start: kw.start, end: this.lastEnd() };
	}

	/** LetStmt := 'let' Name '=' (VerbStmt | CompareStmt | MacroStmt | ArithStmt) */
	private parseLet(): A.LetStmt {
		const kw = this.next();
		const n = this.expect(Tok.Name, 'a name to keep the value under');
		if (isNotLetName(n.text)) {
			throw new LangError(`'${n.text}' is a word of the language and cannot be a let-name`, n.start, n.end, {
				hint: 'pick another name, e.g. area_fin'
			});
		}
		this.expect(Tok.Equals);
		const t = this.peek();
		if (t.kind === Tok.Name && (t.text === 'use' || t.text === 'units' || t.text === 'let')) {
			throw new LangError(`'${t.text}' gives no value to keep`, t.start, t.end, {
				hint: 'let keeps a verb result or arithmetic'
			});
		}
		const s = this.parseStatement();
		if (s.type === 'use' || s.type === 'units' || s.type === 'let') throw new LangError('nothing to keep', s.start, s.end);
		const body: A.LetStmt['body'] = s;
		return { type: 'let', name: this.word(n), body, start: kw.start, end: this.lastEnd() };
	}

	/** VerbStmt := ['sweep'] Verb [Subject] KeyValue* Sinks */
	private parseVerb(): A.VerbStmt {
		const first = this.next();
		let sweep: A.Span | undefined;
		let v = first;
		if (first.text === 'sweep') {
			sweep = { start: first.start, end: first.end };
			v = this.peek();
			if (v.kind !== Tok.Name) throw this.unexpected("a verb after 'sweep'", v, `verbs: ${verbNames().join(', ')}`);
			if (!isVerb(v.text)) {
				throw new LangError(`unknown verb '${v.text}'${didYouMean(v.text, verbNames())}`, v.start, v.end, {
					hint: `verbs: ${verbNames().join(', ')}`
				});
			}
			this.next();
		}
		const subject = this.parseSubject();
		const keys = this.parseKeyValues();
		const sinks = this.parseSinks();
		const stmt: A.VerbStmt = { type: 'verb', verb: this.word(v), keys, sinks, start: first.start, end: this.lastEnd() };
		if (sweep) stmt.sweep = sweep;
		if (subject) stmt.subject = subject;
		return stmt;
	}

	/** Subject := 'strip' | 'ball' | 'pair' | Verb   (a word not followed by '=') */
	private parseSubject(): A.Word | undefined {
		const t = this.peek();
		if (t.kind !== Tok.Name || this.peek(1).kind === Tok.Equals) return undefined;
		if ((SHAPES as readonly string[]).includes(t.text) || isVerb(t.text)) return this.word(this.next());
		const guess = didYouMean(t.text, [...SHAPES, ...verbNames()]);
		if (guess) throw new LangError(`unknown shape or quantity '${t.text}'${guess}`, t.start, t.end);
		this.next();
		throw this.unexpected(`'=' after key '${t.text}'`);
	}

	/** CompareStmt := 'compare' (Name | String) [Verb] KeyValue* Sinks */
	private parseCompare(): A.CompareStmt {
		const kw = this.next();
		const d = this.peek();
		if (d.kind !== Tok.Name && d.kind !== Tok.String) throw this.unexpected('a dataset name', d);
		this.next();
		let verb: A.Word | undefined;
		const t = this.peek();
		if (t.kind === Tok.Name && this.peek(1).kind !== Tok.Equals) {
			if (!isVerb(t.text)) {
				throw new LangError(`unknown verb '${t.text}'${didYouMean(t.text, verbNames())}`, t.start, t.end);
			}
			verb = this.word(this.next());
		}
		const keys = this.parseKeyValues();
		const sinks = this.parseSinks();
		const stmt: A.CompareStmt = { type: 'compare', dataset: this.word(d), keys, sinks, start: kw.start, end: this.lastEnd() };
		if (verb) stmt.verb = verb;
		return stmt;
	}

	/** MacroStmt := '@' Name KeyValue* */
	private parseMacro(): A.MacroStmt {
		const m = this.next();
		const keys = this.parseKeyValues();
		return { type: 'macro', name: this.word(m), keys, start: m.start, end: this.lastEnd() };
	}

	/** ArithStmt := Expr Sinks */
	private parseArith(): A.ArithStmt {
		const start = this.peek().start;
		const expr = this.parseExpr();
		const sinks = this.parseSinks();
		return { type: 'arith', expr, sinks, start, end: this.lastEnd() };
	}

	/** Sinks := ('|' ('table' | 'plot' | 'tex' | 'csv'))* */
	private parseSinks(): A.Word[] {
		const sinks: A.Word[] = [];
		while (this.at(Tok.Pipe)) {
			this.next();
			const s = this.peek();
			if (s.kind !== Tok.Name) throw this.unexpected('a sink (table, plot, tex or csv)', s);
			this.next();
			if (!(SINKS as readonly string[]).includes(s.text)) {
				throw new LangError(`unknown sink '${s.text}'${didYouMean(s.text, SINKS)}`, s.start, s.end, {
					hint: 'sinks: table, plot, tex, csv'
				});
			}
			if (sinks.some((x) => x.text === s.text)) throw new LangError(`sink '${s.text}' is given twice`, s.start, s.end);
			sinks.push(this.word(s));
		}
		return sinks;
	}

	/** KeyValues := KeyValue*   — no key twice (aliases count as the same key) */
	private parseKeyValues(): A.KeyValue[] {
		const keys: A.KeyValue[] = [];
		const seen = new Map<string, A.KeyValue>();
		while (this.at(Tok.Name)) {
			const kv = this.parseKeyValue();
			const canon = canonicalKey(kv.key);
			const prior = seen.get(canon);
			if (prior) {
				const also = prior.key === kv.key ? '' : ` (also given as '${prior.key}')`;
				throw new LangError(`key '${kv.key}' is given twice${also}`, kv.start, kv.end, {
					hint: 'give each key once; a key on a verb line overrides the bulk for that line'
				});
			}
			for (const [a, b] of KEY_CONFLICTS) {
				const other = canon === a ? b : canon === b ? a : undefined;
				if (other !== undefined && seen.has(other)) {
					throw new LangError(`give either '${a}' or '${b}', not both`, kv.start, kv.end);
				}
			}
			seen.set(canon, kv);
			keys.push(kv);
		}
		const t = this.peek();
		if (t.kind !== Tok.End && t.kind !== Tok.Semi && t.kind !== Tok.Pipe) {
			throw this.unexpected('key=value', t);
		}
		return keys;
	}

	/** KeyValue := Name '=' Value */
	private parseKeyValue(): A.KeyValue {
		const k = this.next();
		if (RESERVED_KEYS.has(k.text)) throw new LangError(`'${k.text}' cannot be a key`, k.start, k.end);
		if (!this.at(Tok.Equals)) throw this.unexpected(`'=' after key '${k.text}'`);
		this.next();
		const value = this.parseValue();
		return { type: 'kv', key: k.text, keySpan: { start: k.start, end: k.end }, value, start: k.start, end: value.end };
	}

	/** Value := Item [ '..' Expr [':' Expr] | (',' Item)+ ] */
	private parseValue(): A.Value {
		const first = this.parseItem();
		if (this.at(Tok.DotDot)) {
			if (first.type === 'exact' || first.type === 'string') throw this.unexpected("a number before '..'", this.peek());
			this.next();
			const to = this.parseExpr();
			const range: A.RangeValue = { type: 'range', from: first, to, start: first.start, end: to.end };
			if (this.at(Tok.Colon)) {
				this.next();
				range.points = this.parseExpr();
				range.end = range.points.end;
			}
			return range;
		}
		if (this.at(Tok.Comma)) {
			const items: A.Item[] = [first];
			while (this.at(Tok.Comma)) {
				this.next();
				items.push(this.parseItem());
				if (items.length > this.limits.maxPoints) {
					const last = items[items.length - 1]!;
					throw limitError('maxPoints', `list has more than ${this.limits.maxPoints} items`, last.start, last.end, this.limits);
				}
			}
			return { type: 'list', items, start: first.start, end: items[items.length - 1]!.end };
		}
		return first;
	}

	/** Item := 'exact' | String | Expr */
	private parseItem(): A.Item {
		const t = this.peek();
		if (t.kind === Tok.Name && t.text === 'exact') {
			this.next();
			return { type: 'exact', start: t.start, end: t.end };
		}
		if (t.kind === Tok.String) {
			this.next();
			return { type: 'string', value: t.text, start: t.start, end: t.end };
		}
		if (!startsExpr(t)) throw this.unexpected('a value', t, 'values: 0.3, 1/3, pi, 0.1..1:50, 1,2,exact, #4, "…"');
		return this.parseExpr();
	}

	// ── arithmetic ────────────────────────────────────────────────────────────
	/** Expr := Term (('+' | '-') Term)* */
	parseExpr(): A.Expr {
		let left = this.parseTerm();
		while (this.at(Tok.Plus) || this.at(Tok.Minus)) {
			const op = this.next().text as '+' | '-';
			const right = this.parseTerm();
			left = { type: 'binary', op, left, right, start: left.start, end: right.end };
		}
		return left;
	}

	/** Term := Unary (('*' | '/') Unary)* */
	private parseTerm(): A.Expr {
		let left = this.parseUnary();
		while (this.at(Tok.Star) || this.at(Tok.Slash)) {
			const op = this.next().text as '*' | '/';
			const right = this.parseUnary();
			left = { type: 'binary', op, left, right, start: left.start, end: right.end };
		}
		return left;
	}

	/** Unary := ('-' | '+') Unary | Power   — the depth guard lives here: every nesting passes through it */
	private parseUnary(): A.Expr {
		if (++this.depth > this.limits.maxDepth) {
			const t = this.peek();
			throw limitError('maxDepth', `arithmetic is nested more than ${this.limits.maxDepth} deep`, t.start, t.end, this.limits);
		}
		try {
			if (this.at(Tok.Minus) || this.at(Tok.Plus)) {
				const t = this.next();
				const arg = this.parseUnary();
				return { type: 'unary', op: t.text as '-' | '+', arg, start: t.start, end: arg.end };
			}
			return this.parsePower();
		} finally {
			this.depth--;
		}
	}

	/** Power := Primary ['^' Unary]   (right-associative; -2^2 = -(2^2)) */
	private parsePower(): A.Expr {
		const base = this.parsePrimary();
		if (!this.at(Tok.Caret)) return base;
		this.next();
		const exp = this.parseUnary();
		return { type: 'binary', op: '^', left: base, right: exp, start: base.start, end: exp.end };
	}

	/** Primary := Number | Ref | Call | Name | '(' Expr ')' */
	private parsePrimary(): A.Expr {
		const t = this.peek();
		switch (t.kind) {
			case Tok.Number:
				this.next();
				return { type: 'number', value: t.num!, raw: t.text, start: t.start, end: t.end };
			case Tok.Ref: {
				this.next();
				const r: A.RefExpr = { type: 'ref', step: t.step!, start: t.start, end: t.end };
				if (t.field !== undefined) r.field = t.field;
				return r;
			}
			case Tok.Name:
				if (this.peek(1).kind === Tok.LParen) return this.parseCall();
				if (t.text === 'exact') throw new LangError("'exact' is an order, not a number", t.start, t.end);
				this.next();
				return { type: 'name', name: t.text, start: t.start, end: t.end };
			case Tok.LParen: {
				this.next();
				const inner = this.parseExpr();
				const close = this.expect(Tok.RParen);
				return { type: 'paren', inner, start: t.start, end: close.end };
			}
			default:
				throw this.unexpected("a number, name or '('", t);
		}
	}

	/** Call := Function '(' [Expr (',' Expr)*] ')' */
	private parseCall(): A.CallExpr {
		const f = this.next();
		if (!(FUNCTIONS as readonly string[]).includes(f.text)) {
			throw new LangError(`unknown function '${f.text}'${didYouMean(f.text, FUNCTIONS)}`, f.start, f.end, {
				hint: `functions: ${FUNCTIONS.join(', ')}`
			});
		}
		this.next(); // '('
		const args: A.Expr[] = [];
		if (!this.at(Tok.RParen)) {
			args.push(this.parseExpr());
			while (this.at(Tok.Comma)) {
				this.next();
				args.push(this.parseExpr());
			}
		}
		const close = this.expect(Tok.RParen, "')' or ','");
		return { type: 'call', fn: f.text, fnSpan: { start: f.start, end: f.end }, args, start: f.start, end: close.end };
	}
}

function startsExpr(t: Token): boolean {
	return (
		t.kind === Tok.Number ||
		t.kind === Tok.Name ||
		t.kind === Tok.Ref ||
		t.kind === Tok.LParen ||
		t.kind === Tok.Minus ||
		t.kind === Tok.Plus
	);
}
