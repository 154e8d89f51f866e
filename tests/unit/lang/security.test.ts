/**
 * Attacks on the arithmetic path. Two layers, each tested on its own: the language's parser refuses anything
 * that is not a number, a bound name, a step reference or a whitelisted function; and the formula sandbox it
 * hands text to (holo/formula.ts) checks the parsed tree against its own allow-list before evaluating it with
 * plain JS Math. Each attack asserts its exact error.
 */
import * as mathjs from 'mathjs';
import { describe, expect, it } from 'vitest';
import { sandboxEvaluate } from '../../../src/lib/lang/arith';
import { LangError } from '../../../src/lib/lang/errors';
import { FormulaError } from '../../../src/lib/holo/formula';
import { emptyContext, runLine } from '../../../src/lib/lang/evaluate';

function langError(input: string): LangError {
	try {
		runLine(input, emptyContext());
	} catch (e) {
		if (e instanceof LangError) return e;
		throw e;
	}
	throw new Error(`no error for ${input}`);
}

describe('the formula sandbox behind arithmetic', () => {
	// every entry point mathjs's guidance names, and the ones it does not (config, compile, parser, matrices):
	// the tree is checked against an allow-list before anything runs, so each is refused by name
	const refused: [string, string][] = [
		['import({ x: 1 }, { override: true })', "function 'import' is not allowed"],
		['createUnit("parsec2")', "function 'createUnit' is not allowed"],
		['reviver("a", "b")', "function 'reviver' is not allowed"],
		['evaluate("1 + 1")', "function 'evaluate' is not allowed"],
		['parse("1 + 1")', "function 'parse' is not allowed"],
		['simplify("x + x")', "function 'simplify' is not allowed"],
		['derivative("x^2", "x")', "function 'derivative' is not allowed"],
		['resolve("x", {})', "function 'resolve' is not allowed"],
		['compile("1 + 1")', "function 'compile' is not allowed"],
		['parser()', "function 'parser' is not allowed"],
		['config({ number: "BigNumber" })', "function 'config' is not allowed"],
		['rationalize("x + x")', "function 'rationalize' is not allowed"],
		['sum(range(1, 1e9))', "function 'sum' is not allowed"],
		['sqrt("4")', 'strings are not allowed'],
		['a = 3', 'assignment is not allowed'],
		['f(x) = x', 'function definitions are not allowed'],
		['[1, 2]', 'matrices and lists are not allowed'],
		['1:5', 'ranges are not allowed']
	];
	it.each(refused)('%s', (text, message) => {
		expect(() => sandboxEvaluate(text)).toThrow(new FormulaError(message, 'refused'));
	});

	it('refuses to reach JavaScript through properties', () => {
		expect(() => sandboxEvaluate('cos.constructor("return process")')).toThrow('only named functions can be called');
		expect(() => sandboxEvaluate('cos["constructor"]')).toThrow('properties and indexing are not allowed');
		expect(() => sandboxEvaluate('"".constructor')).toThrow('properties and indexing are not allowed');
		expect(() => sandboxEvaluate('sin.call')).toThrow('properties and indexing are not allowed');
		expect(() => sandboxEvaluate('constructor')).toThrow("unknown name 'constructor'");
		expect(() => sandboxEvaluate('__proto__ + 1')).toThrow("unknown name '__proto__'");
	});

	it('still does arithmetic', () => {
		expect(sandboxEvaluate('sqrt(16) + 2^3')).toBe(12);
		// Γ(½)² = π (common practice); the engine's Lanczos Γ, so a few ulps
		expect(sandboxEvaluate('gamma(0.5)^2')).toBeCloseTo(Math.PI, 14);
	});

	it('binds only the scope it is given and leaves the shared mathjs instance alone', () => {
		expect(sandboxEvaluate('a * 2', new Map([['a', 3]]))).toBe(6);
		expect(() => sandboxEvaluate('a')).toThrow("unknown name 'a'");
		expect(() => sandboxEvaluate('createUnit("zorkmid")')).toThrow("function 'createUnit' is not allowed");
		expect(() => mathjs.evaluate('2 zorkmid')).toThrow(/zorkmid/);
		expect(mathjs.evaluate('parse("1+1")').toString()).toBe('1 + 1');
	});
});

describe('the language refuses before mathjs sees anything', () => {
	const attacks: [input: string, message: string, covers: string][] = [
		['darea l=import(1)', "unknown function 'import'", 'import'],
		['evaluate(1)', "unknown function 'evaluate'", 'evaluate'],
		['parse(1)', "unknown function 'parse'", 'parse'],
		['createUnit(1)', "unknown function 'createUnit'", 'createUnit'],
		['cos.constructor', "Expected a name, number or operator, found '.'", '.'],
		['x = 1', "Expected ';' or end of line, found '='", '='],
		['f(x) = x', "unknown function 'f'", 'f'],
		['[1,2]', "Expected a name, number or operator, found '['", '['],
		['"abc"', "Expected a number, name or '(', found a string", '"abc"'],
		['1 ? 2 : 3', "Expected ';' or end of line, found '?'", '?'],
		['sqrt', "unknown name 'sqrt'", 'sqrt'],
		['import', "unknown name 'import'", 'import'],
		['constructor', "unknown name 'constructor'", 'constructor'],
		['__proto__', "unknown name '__proto__'", '__proto__'],
		['#1', 'no step #1 in this pad', '#1'],
		['sqrt(-1)', 'arithmetic gives a complex number', 'sqrt(-1)'],
		['1/0', 'arithmetic gives no finite number', '1/0'],
		['@__proto__', "unknown macro '@__proto__'", '@__proto__'],
		['use metric f="1" __proto__=1', "'__proto__' cannot be a key", '__proto__'],
		['darea constructor=1', "'constructor' cannot be a key", 'constructor'],
		['compare constructor darea', "unknown dataset 'constructor'", 'constructor']
	];
	it.each(attacks)('%s', (input, message, covers) => {
		const e = langError(input);
		expect(e.message).toBe(message);
		expect(input.slice(e.start, e.end)).toBe(covers);
	});

	it('does not let a let-name or a step field reach Object.prototype', () => {
		const ctx = { ...emptyContext(), refs: { 1: { value: 2, fields: {} } } };
		expect(() => runLine('#1.constructor', ctx)).toThrow("step #1 has no field 'constructor'");
		expect(() => runLine('toString + 1', ctx)).toThrow("unknown name 'toString'");
	});

	it('bounds hostile sizes with limit errors', () => {
		const deep = langError('('.repeat(100) + '1' + ')'.repeat(100));
		expect(deep.code).toBe('limit');
		const long = langError('1+'.repeat(1500) + '1');
		expect(long.code).toBe('limit');
		expect(long.message).toBe('input is 3001 characters long; at most 2000 are allowed');
	});
});
