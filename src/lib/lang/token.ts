/**
 * Tokens of the console language. Each enum value is the text a message shows for that kind of token,
 * so "Expected '=', found end of line" reads naturally without a lookup table.
 */
export enum Tok {
	End = 'end of line',
	Name = 'name',
	Number = 'number',
	String = 'string',
	/** `#4` or `#4.T`: a reference to an earlier step of the pad */
	Ref = 'step reference',
	/** `@name`: a macro from the library */
	Macro = 'macro',
	Semi = "';'",
	Pipe = "'|'",
	Equals = "'='",
	Comma = "','",
	DotDot = "'..'",
	Colon = "':'",
	Plus = "'+'",
	Minus = "'-'",
	Star = "'*'",
	Slash = "'/'",
	Caret = "'^'",
	/** `?darea`: help on a word */
	Question = "'?'",
	LParen = "'('",
	RParen = "')'"
}

export interface Token {
	kind: Tok;
	/** the characters as typed (for a string: without quotes, escapes resolved) */
	text: string;
	start: number;
	end: number;
	/** numeric value of a Number token */
	num?: number;
	/** for Ref: the step number (or its name, `#btz`) and the optional field */
	step?: number;
	name?: string;
	field?: string;
}

/** How a token is quoted in a message: kinds with free text show the text too. */
export function describeToken(t: Token): string {
	switch (t.kind) {
		case Tok.End:
			return 'end of line';
		case Tok.Name:
			return `'${t.text}'`;
		case Tok.Number:
			return `number ${t.text}`;
		case Tok.String:
			return 'a string';
		case Tok.Ref:
			return `reference ${t.text}`;
		case Tok.Macro:
			return `macro ${t.text}`;
		default:
			return t.kind;
	}
}
