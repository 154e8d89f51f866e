/**
 * The syntax tree of one line. Every node carries its span (offsets into the typed line) so any later stage —
 * schema checks, engine errors — can point back at the characters that caused it.
 */
export interface Span {
	start: number;
	end: number;
}

// ── arithmetic ───────────────────────────────────────────────────────────────
export interface NumberExpr extends Span {
	type: 'number';
	value: number;
	raw: string;
}
/** a let-name, a bulk key (`2*zh/3`) or a constant (`pi`, `e`) — resolved at evaluation */
export interface NameExpr extends Span {
	type: 'name';
	name: string;
}
/** `#4` or `#4.T`, or by the step's name: `#btz`, `#btz.T` (then `step` is 0, which no step has) */
export interface RefExpr extends Span {
	type: 'ref';
	step: number;
	name?: string;
	field?: string;
}
export interface UnaryExpr extends Span {
	type: 'unary';
	op: '-' | '+';
	arg: Expr;
}
export interface BinaryExpr extends Span {
	type: 'binary';
	op: '+' | '-' | '*' | '/' | '^';
	left: Expr;
	right: Expr;
}
export interface CallExpr extends Span {
	type: 'call';
	fn: string;
	fnSpan: Span;
	args: Expr[];
}
export interface ParenExpr extends Span {
	type: 'paren';
	inner: Expr;
}
export type Expr = NumberExpr | NameExpr | RefExpr | UnaryExpr | BinaryExpr | CallExpr | ParenExpr;

// ── values of key=value ─────────────────────────────────────────────────────
export interface ExactValue extends Span {
	type: 'exact';
}
export interface StringValue extends Span {
	type: 'string';
	value: string;
}
/** one item of a value: an arithmetic expression, `exact`, or a string */
export type Item = Expr | ExactValue | StringValue;
export interface ListValue extends Span {
	type: 'list';
	items: Item[];
}
/** `a..b` or `a..b:N` — N points, both ends included */
export interface RangeValue extends Span {
	type: 'range';
	from: Expr;
	to: Expr;
	points?: Expr;
}
export type Value = Item | ListValue | RangeValue;

export interface KeyValue extends Span {
	type: 'kv';
	key: string;
	keySpan: Span;
	value: Value;
}

export interface Word extends Span {
	text: string;
}

// ── statements ───────────────────────────────────────────────────────────────
export interface UseStmt extends Span {
	type: 'use';
	bulk: Word;
	keys: KeyValue[];
}
export interface UnitsStmt extends Span {
	type: 'units';
	system: Word;
	keys: KeyValue[];
}
/** `[sweep] <verb> [subject] [key=value …] [| sink …]`; subject is a shape (strip|ball|pair) or, for coeffs/validity/resum, a verb */
export interface VerbStmt extends Span {
	type: 'verb';
	sweep?: Span;
	verb: Word;
	subject?: Word;
	keys: KeyValue[];
	sinks: Word[];
}
/** `compare <dataset> [verb] [key=value …] [| sink …]` */
export interface CompareStmt extends Span {
	type: 'compare';
	dataset: Word;
	verb?: Word;
	keys: KeyValue[];
	sinks: Word[];
}
/** `plot #9 #35 [xlabel="…"] [ylabel="…"]`: one figure overlaying the tables of earlier steps */
export interface PlotStmt extends Span {
	type: 'plot';
	refs: RefExpr[];
	keys: KeyValue[];
}
/** `help [word]` or `?word`: what a verb, bulk, key, sink or statement does */
export interface HelpStmt extends Span {
	type: 'help';
	topic?: Word;
}
export interface MacroStmt extends Span {
	type: 'macro';
	name: Word;
	keys: KeyValue[];
}
export interface ArithStmt extends Span {
	type: 'arith';
	expr: Expr;
	sinks: Word[];
}
export interface LetStmt extends Span {
	type: 'let';
	name: Word;
	body: VerbStmt | CompareStmt | MacroStmt | ArithStmt;
}
export type Statement = UseStmt | UnitsStmt | VerbStmt | CompareStmt | PlotStmt | HelpStmt | MacroStmt | ArithStmt | LetStmt;

export interface Line extends Span {
	type: 'line';
	statements: Statement[];
}

export function isExpr(v: Value): v is Expr {
	return v.type !== 'exact' && v.type !== 'string' && v.type !== 'list' && v.type !== 'range';
}
