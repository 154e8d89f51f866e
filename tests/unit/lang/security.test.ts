/**
 * Attacks on the arithmetic path. Two layers, each tested on its own: the language's parser refuses anything
 * that is not a number, a bound name, a step reference or a whitelisted function; and the mathjs instance it
 * hands text to is restricted as mathjs's security guidance describes. Each attack asserts its exact error.
 */
import * as mathjs from 'mathjs';
import { describe, expect, it } from 'vitest';
import { sandboxEvaluate } from '../../../src/lib/lang/arith';
import { LangError } from '../../../src/lib/lang/errors';
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

describe('the restricted mathjs instance', () => {
	const disabled: [string, string][] = [
		['import({ x: 1 }, { override: true })', 'Function import is disabled'],
		['createUnit("parsec2")', 'Function createUnit is disabled'],
		['reviver("a", "b")', 'Function reviver is disabled'],
		['evaluate("1 + 1")', 'Function evaluate is disabled'],
		['parse("1 + 1")', 'Function parse is disabled'],
		['simplify("x + x")', 'Function simplify is disabled'],
		['derivative("x^2", "x")', 'Function derivative is disabled'],
		['resolve("x", {})', 'Function resolve is disabled'],
		['compile("1 + 1")', 'Function compile is disabled'],
		['parser()', 'Function parser is disabled'],
		['config({ number: "BigNumber" })', 'Function config is disabled'],
		// functions that call the disabled ones internally are refused through them
		['rationalize("x + x")', 'Function simplify is disabled']
	];
	it.each(disabled)('%s', (text, message) => {
		expect(() => sandboxEvaluate(text)).toThrow(new Error(message));
	});

	it('refuses to reach JavaScript through properties', () => {
		expect(() => sandboxEvaluate('cos.constructor("return process")')).toThrow('No access to method "constructor"');
		expect(() => sandboxEvaluate('cos["constructor"]')).toThrow('No access to property "constructor"');
		expect(() => sandboxEvaluate('"".constructor')).toThrow('No access to property "constructor"');
		expect(() => sandboxEvaluate('sin.call')).toThrow('No access to property "call"');
	});

	it('still does arithmetic', () => {
		expect(sandboxEvaluate('sqrt(16) + 2^3')).toBe(12);
		expect(sandboxEvaluate('gamma(0.5)^2')).toBeCloseTo(Math.PI, 14);
	});

	it('keeps a fresh scope per call and leaves the shared mathjs instance alone', () => {
		expect(sandboxEvaluate('a = 3')).toBe(3);
		expect(() => sandboxEvaluate('a')).toThrow('Undefined symbol a');
		expect(() => sandboxEvaluate('createUnit("zorkmid")')).toThrow('Function createUnit is disabled');
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
		['1 ? 2 : 3', "Expected a name, number or operator, found '?'", '?'],
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
		const deep = langError('(' .repeat(100) + '1' + ')'.repeat(100));
		expect(deep.code).toBe('limit');
		const long = langError('1+'.repeat(1500) + '1');
		expect(long.code).toBe('limit');
		expect(long.message).toBe('input is 3001 characters long; at most 2000 are allowed');
	});
});
