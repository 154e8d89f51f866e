/**
 * Hand-written lexer for one console line. It never backtracks and stops at the token limit, so a hostile
 * line costs at most O(maxInput) work before the parser sees it.
 */
import { LangError, expected } from './errors';
import { type Limits, limitError } from './limits';
import { Tok, type Token } from './token';

const SINGLE: Record<string, Tok> = {
	';': Tok.Semi,
	'|': Tok.Pipe,
	'=': Tok.Equals,
	',': Tok.Comma,
	':': Tok.Colon,
	'+': Tok.Plus,
	'-': Tok.Minus,
	'*': Tok.Star,
	'/': Tok.Slash,
	'^': Tok.Caret,
	'(': Tok.LParen,
	')': Tok.RParen,
	'?': Tok.Question
};

const isDigit = (c: string | undefined): boolean => c !== undefined && c >= '0' && c <= '9';
const isNameStart = (c: string | undefined): boolean => c !== undefined && ((c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || c === '_');
const isNameChar = (c: string | undefined): boolean => isNameStart(c) || isDigit(c);

/** Split a line into tokens; the last token is always End. */
export function lex(input: string, limits: Limits): Token[] {
	if (input.length > limits.maxInput) {
		throw limitError(
			'maxInput',
			`input is ${input.length} characters long; at most ${limits.maxInput} are allowed`,
			limits.maxInput,
			input.length,
			limits
		);
	}
	const tokens: Token[] = [];
	let i = 0;
	const push = (t: Token): void => {
		if (tokens.length >= limits.maxTokens) {
			throw limitError('maxTokens', `line has more than ${limits.maxTokens} tokens`, t.start, input.length, limits);
		}
		tokens.push(t);
	};
	while (i < input.length) {
		const c = input[i]!;
		if (c === ' ' || c === '\t' || c === '\r' || c === '\n') {
			i++;
			continue;
		}
		if (c === '/' && input[i + 1] === '/') break; // a comment runs to the end of the line
		const start = i;
		if (isDigit(c) || (c === '.' && isDigit(input[i + 1]))) {
			i = scanNumber(input, i);
			const text = input.slice(start, i);
			const num = Number(text);
			if (!Number.isFinite(num)) throw new LangError(`number ${text} is out of range`, start, i);
			push({ kind: Tok.Number, text, start, end: i, num });
			continue;
		}
		if (c === '.') {
			if (input[i + 1] === '.') {
				push({ kind: Tok.DotDot, text: '..', start, end: i + 2 });
				i += 2;
				continue;
			}
			throw expected('a name, number or operator', "'.'", start, start + 1);
		}
		if (isNameStart(c)) {
			while (isNameChar(input[i])) i++;
			push({ kind: Tok.Name, text: input.slice(start, i), start, end: i });
			continue;
		}
		if (c === '"') {
			const { value, end } = scanString(input, i);
			i = end;
			push({ kind: Tok.String, text: value, start, end });
			continue;
		}
		if (c === '#') {
			push(scanRef(input, i));
			i = tokens[tokens.length - 1]!.end;
			continue;
		}
		if (c === '@') {
			i++;
			if (!isNameStart(input[i])) {
				throw expected("a macro name after '@'", describeChar(input[i]), i, Math.min(i + 1, input.length));
			}
			// library names may join words with '-' (btz-check); a '-' counts only between name characters
			while (isNameChar(input[i]) || (input[i] === '-' && isNameChar(input[i + 1]))) i++;
			push({ kind: Tok.Macro, text: input.slice(start + 1, i), start, end: i });
			continue;
		}
		const single = SINGLE[c];
		if (single !== undefined) {
			push({ kind: single, text: c, start, end: i + 1 });
			i++;
			continue;
		}
		throw expected('a name, number or operator', describeChar(c), start, start + 1);
	}
	tokens.push({ kind: Tok.End, text: '', start: input.length, end: input.length });
	return tokens;
}

function describeChar(c: string | undefined): string {
	if (c === undefined) return 'end of line';
	return `'${c}'`;
}

/** digits ['.' digits] [('e'|'E') ['+'|'-'] digits] — a '.' followed by '.' belongs to a range. */
function scanNumber(input: string, i: number): number {
	while (isDigit(input[i])) i++;
	if (input[i] === '.' && input[i + 1] !== '.') {
		i++;
		while (isDigit(input[i])) i++;
	}
	if (input[i] === 'e' || input[i] === 'E') {
		let j = i + 1;
		if (input[j] === '+' || input[j] === '-') j++;
		if (isDigit(input[j])) {
			while (isDigit(input[j])) j++;
			i = j;
		}
	}
	return i;
}

/** '"' chars '"' with \" and \\ escapes; strings never span statements. */
function scanString(input: string, i: number): { value: string; end: number } {
	const start = i;
	i++;
	let value = '';
	while (i < input.length && input[i] !== '"') {
		if (input[i] === '\\' && (input[i + 1] === '"' || input[i + 1] === '\\')) {
			value += input[i + 1];
			i += 2;
			continue;
		}
		value += input[i];
		i++;
	}
	if (i >= input.length) {
		throw new LangError("unterminated string: add the closing '\"'", start, input.length, {
			hint: 'strings are written "…" on one line'
		});
	}
	return { value, end: i + 1 };
}

/** '#' (digits | name) ['.' name] */
function scanRef(input: string, start: number): Token {
	let i = start + 1;
	let step = 0;
	let name: string | undefined;
	if (isNameStart(input[i])) {
		while (isNameChar(input[i])) i++;
		name = input.slice(start + 1, i);
	} else if (!isDigit(input[i])) {
		throw expected(
			"a step number or name after '#'",
			describeChar(input[i]),
			start,
			Math.min(i + 1, input.length),
			'write #4, #4.T or a step name like #btz'
		);
	} else {
		while (isDigit(input[i])) i++;
		step = Number(input.slice(start + 1, i));
		if (!Number.isSafeInteger(step)) throw new LangError(`step number ${input.slice(start, i)} is out of range`, start, i);
	}
	let field: string | undefined;
	if (input[i] === '.' && isNameStart(input[i + 1])) {
		const fs = i + 1;
		i = fs;
		while (isNameChar(input[i])) i++;
		field = input.slice(fs, i);
	}
	const tok: Token = { kind: Tok.Ref, text: input.slice(start, i), start, end: i, step };
	if (name !== undefined) tok.name = name;
	if (field !== undefined) tok.field = field;
	return tok;
}
