import { describe, expect, it } from 'vitest';
import { LangError, codeFrame } from '../../../src/lib/lang/errors';
import { parse } from '../../../src/lib/lang/parser';
import { printLine } from '../../../src/lib/lang/printer';
import type { VerbStmt, RangeValue, ListValue, BinaryExpr, MacroStmt } from '../../../src/lib/lang/ast';
import { SPEC_EXAMPLES } from './examples';

/** Other lines the spec writes inline. */
const SPEC_INLINE = [
	'darea l=0.2 d=5 o=3',
	'use boosted d=4 v=0.5; darea l=0.3',
	'#3 / #2',
	'area_fin * 4',
	'2*pi/3',
	'darea l=0.05..1.5',
	'darea l=0.05..1.5:120',
	'darea l=#4 o=2',
	'energy l=#4.T',
	'use metric d=4 f="1 - (z/zh)^4 + q^2*(z/zh)^6" zh=1 q=0.5',
	'units geo G=1',
	'units cft c=12',
	'units sym N=3',
	'let area_fin = area l=0.4',
	'@standard_brane d=5',
	'darea l=1/3 // a comment',
	'darea l=2.5e-3',
	'darea l=2*zh/3',
	'compare mydata darea o=3',
	'darea ball R=0.5 | table | csv'
];

function fail(input: string): LangError {
	try {
		parse(input);
	} catch (e) {
		if (e instanceof LangError) return e;
		throw e;
	}
	throw new Error(`expected a LangError for ${JSON.stringify(input)}`);
}

describe('parse: the spec examples', () => {
	it.each([...SPEC_EXAMPLES, ...SPEC_INLINE])('%s', (line) => {
		const ast = parse(line);
		expect(ast.statements.length).toBeGreaterThan(0);
		// the canonical print parses to the same canonical print
		expect(printLine(parse(printLine(ast)))).toBe(printLine(ast));
	});

	it('reads a sweep with a range and a list of orders', () => {
		const s = parse('sweep darea l=0.05..1.2:80 o=1,2,3,exact').statements[0] as VerbStmt;
		expect(s.type).toBe('verb');
		expect(s.sweep).toEqual({ start: 0, end: 5 });
		expect(s.verb.text).toBe('darea');
		const l = s.keys[0]!.value as RangeValue;
		expect(l.type).toBe('range');
		expect(l.points).toMatchObject({ type: 'number', value: 80 });
		const o = s.keys[1]!.value as ListValue;
		expect(o.items.map((i) => i.type)).toEqual(['number', 'number', 'number', 'exact']);
	});

	it('reads subjects and sinks', () => {
		const s = parse('coeffs darea o=4 | tex').statements[0] as VerbStmt;
		expect(s.subject?.text).toBe('darea');
		expect(s.sinks.map((x) => x.text)).toEqual(['tex']);
		const m = parse('mi pair l=1 gap=0.3').statements[0] as VerbStmt;
		expect(m.subject).toEqual({ text: 'pair', start: 3, end: 7 });
	});

	it('reads library names that join words with a hyphen, and stops at a trailing one', () => {
		const s = parse('@btz-check l=2 c=12').statements[0] as MacroStmt;
		expect(s.type).toBe('macro');
		expect(s.name.text).toBe('btz-check');
		expect(() => parse('@btz- l=2')).toThrow(LangError);
	});

	it('splits statements on ; and skips empty ones', () => {
		expect(parse('use vacuum d=3;; darea l=1;').statements.map((s) => s.type)).toEqual(['use', 'verb']);
		expect(parse('').statements).toEqual([]);
		expect(parse('   // only a comment').statements).toEqual([]);
	});

	it('keeps spans on every node', () => {
		const s = parse('darea l=2*zh/3').statements[0] as VerbStmt;
		const kv = s.keys[0]!;
		expect([kv.start, kv.end, kv.keySpan.start, kv.keySpan.end]).toEqual([6, 14, 6, 7]);
		const e = kv.value as BinaryExpr;
		expect([e.start, e.end, e.op]).toEqual([8, 14, '/']);
	});

	it('gives arithmetic the usual precedence (power binds tighter than unary minus)', () => {
		expect(printLine(parse('-2^2 + 3*4/2 - (1-2)'))).toBe('-2^2 + 3 * 4 / 2 - (1 - 2)');
		expect(printLine(parse('2^3^2'))).toBe('2^3^2');
		expect(printLine(parse('(2^3)^2'))).toBe('(2^3)^2');
	});

	it('reads strings with escapes', () => {
		const s = parse('use metric f="a\\"b"').statements[0]!;
		expect(s.type === 'use' && s.keys[0]!.value).toMatchObject({ type: 'string', value: 'a"b' });
	});
});

/**
 * Bad lines, each with its message and the characters it points at. The span is given as the text it covers
 * so a reader sees what gets underlined.
 */
const BAD: [input: string, message: string | RegExp, covers: string, code?: 'limit'][] = [
	['dara l=0.3', "unknown verb 'dara' — did you mean 'darea'?", 'dara'],
	['sweep dara l=0.1..1', "unknown verb 'dara' — did you mean 'darea'?", 'dara'],
	['use bran d=4', "unknown bulk 'bran' — did you mean 'brane'?", 'bran'],
	['units gео G=1', /^Expected a name, number or operator, found 'е'/, 'е'],
	['units geom G=1', "unknown unit system 'geom' — did you mean 'geo'?", 'geom'],
	['darea l=0.3 l=0.4', "key 'l' is given twice", 'l=0.4'],
	['darea o=3 order=4', "key 'order' is given twice (also given as 'o')", 'order=4'],
	['use boosted v=0.5 rapidity=1', "give either 'v' or 'rapidity', not both", 'rapidity=1'],
	['darea l=', 'Expected a value, found end of line', ''],
	['darea l 0.3', "Expected '=' after key 'l', found number 0.3", '0.3'],
	['darea l=0.3 0.4', 'Expected key=value, found number 0.4', '0.4'],
	['darea strp l=1', "unknown shape or quantity 'strp' — did you mean 'strip'?", 'strp'],
	['darea l=0.3 | tabel', "unknown sink 'tabel' — did you mean 'table'?", 'tabel'],
	['darea l=0.3 | table | table', "sink 'table' is given twice", 'table'],
	['darea l=0.3 |', 'Expected a sink (table, plot, tex or csv), found end of line', ''],
	['darea l=(0.3', "Expected ')', found end of line", ''],
	['darea l=sqr(2)', "unknown function 'sqr' — did you mean 'sqrt'?", 'sqr'],
	['darea l=import(2)', "unknown function 'import'", 'import'],
	['x = 3', "Expected ';' or end of line, found '='", '='],
	['2 3', "Expected ';' or end of line, found number 3", '3'],
	['darea l=exact+1', "Expected key=value, found '+'", '+'],
	['darea l=1+exact', "'exact' is an order, not a number", 'exact'],
	['darea o=exact..3', "Expected a number before '..', found '..'", '..'],
	['let darea = 3', "'darea' is a word of the language and cannot be a let-name", 'darea'],
	['let zh = 3', "'zh' is a word of the language and cannot be a let-name", 'zh'],
	['let x = use brane', "'use' gives no value to keep", 'use'],
	['let = 3', "Expected a name to keep the value under, found '='", '='],
	['#', "Expected a step number or name after '#', found end of line", '#'],
	// `#x` is a step name now (`#btz`); a character that starts neither a number nor a name is refused
	['#.', "Expected a step number or name after '#', found '.'", '#.'],
	['@', "Expected a macro name after '@', found end of line", ''],
	['darea l=0.3 $', "Expected a name, number or operator, found '$'", '$'],
	['darea f="abc', "unterminated string: add the closing '\"'", '"abc'],
	['darea l=1e999', 'number 1e999 is out of range', '1e999'],
	['use', 'Expected a bulk name, found end of line', ''],
	['sweep', "Expected a verb after 'sweep', found end of line", ''],
	['compare', 'Expected a dataset name, found end of line', ''],
	['compare data dara', "unknown verb 'dara' — did you mean 'darea'?", 'dara'],
	['.', "Expected a name, number or operator, found '.'", '.'],
	['x'.repeat(2001), /^input is 2001 characters long; at most 2000 are allowed$/, '', 'limit'],
	['darea l=' + '('.repeat(40) + '1' + ')'.repeat(40), /^arithmetic is nested more than 32 deep$/, '(', 'limit'],
	[Array.from({ length: 21 }, () => 'thermo').join(';'), 'more than 20 statements on one line', '', 'limit']
];

describe('parse: bad lines say what is wrong and where', () => {
	it.each(BAD)('%s', (input, message, covers, code) => {
		const e = fail(input);
		if (typeof message === 'string') expect(e.message, codeFrame(input, e)).toBe(message);
		else expect(e.message, codeFrame(input, e)).toMatch(message);
		expect(e.code).toBe(code ?? 'language');
		if (code === undefined || covers !== '') {
			expect(input.slice(e.start, e.end), codeFrame(input, e)).toBe(covers);
		}
		expect(e.start).toBeLessThanOrEqual(e.end);
		expect(e.end).toBeLessThanOrEqual(input.length);
	});

	it('points the statement limit at the 21st statement', () => {
		const line = Array.from({ length: 21 }, () => 'thermo').join(';');
		const e = fail(line);
		expect(e.start).toBe(20 * 7);
		expect(e.hint).toBe('the statements per line limit is 20');
	});

	it('stops at the token limit', () => {
		const e = fail(Array.from({ length: 700 }, () => '1').join('+'));
		expect(e.code).toBe('limit');
		expect(e.message).toBe('line has more than 600 tokens');
	});

	it('takes tighter limits from the caller', () => {
		expect(() => parse('darea l=0.3', { maxInput: 5 })).toThrow('input is 11 characters long; at most 5 are allowed');
	});
});
