/**
 * Property tests: whatever is typed, the language answers or throws a LangError with a sane span — never
 * another exception. Limits are tightened so a random sweep stays cheap.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { LangError } from '../../../src/lib/lang/errors';
import { emptyContext, runLine } from '../../../src/lib/lang/evaluate';
import { parse } from '../../../src/lib/lang/parser';
import { printLine } from '../../../src/lib/lang/printer';
import type { PadContext } from '../../../src/lib/lang/result';
import { SPEC_EXAMPLES } from './examples';

const LIMITS = { maxPoints: 40 };

const ctx: PadContext = {
	...emptyContext(),
	refs: { 1: { value: 0.3, fields: { T: 0.5, l: 0.3 } }, 2: { fields: { E: 1 } } },
	lets: { w: { value: 0.2, fields: {} } },
	macros: { m: { params: { l: '0.3' }, body: ['darea l={l}'] } },
	datasets: {
		data: {
			columns: ['l', 'darea'],
			rows: [
				[0.1, 0.005],
				[0.2, 0.02]
			]
		}
	}
};

function onlyLangErrors(input: string, run: (s: string) => unknown): void {
	try {
		run(input);
	} catch (e) {
		if (!(e instanceof LangError)) throw new Error(`non-LangError for ${JSON.stringify(input)}: ${String(e)}`);
		expect(e.start).toBeGreaterThanOrEqual(0);
		expect(e.start).toBeLessThanOrEqual(e.end);
		expect(e.end).toBeLessThanOrEqual(Math.max(input.length, 0) + 0);
		expect(['language', 'limit']).toContain(e.code);
	}
}

const VALID = [
	...SPEC_EXAMPLES,
	'darea l=0.2 d=5 o=3',
	'use boosted d=4 v=0.5; darea l=0.3',
	'#1 / #1.T',
	'w * 4',
	'2*pi/3',
	'darea l=0.1..0.5:5 o=1,exact | table',
	'thermo zh=1,2 | csv',
	'let a = darea l=w',
	'@m l=0.2',
	'compare data darea',
	'units sym N=3; thermo',
	'use metric d=3 f="1 - (z/zh)^3" zh=1',
	'stress G=2 | tex'
];
const ALPHABET = [...'abcdelorstuvwxz0123456789.,;:=|#@"()+-*/^ _', '..', 'exact', 'darea', 'l=', 'o=', 'use ', 'sweep '];

/** A valid line with a few characters inserted, deleted or replaced. */
const mutated = fc
	.tuple(
		fc.constantFrom(...VALID),
		fc.array(fc.tuple(fc.constantFrom('insert', 'delete', 'replace'), fc.nat(), fc.constantFrom(...ALPHABET)), {
			minLength: 1,
			maxLength: 4
		})
	)
	.map(([line, edits]) => {
		let s = line;
		for (const [op, at, text] of edits) {
			const i = s.length ? at % (s.length + 1) : 0;
			if (op === 'insert') s = s.slice(0, i) + text + s.slice(i);
			else if (op === 'delete') s = s.slice(0, i) + s.slice(i + 1);
			else s = s.slice(0, i) + text + s.slice(i + 1);
		}
		return s;
	});

describe('never anything but LangError', () => {
	it('random strings (parse)', () => {
		fc.assert(
			fc.property(fc.string({ maxLength: 80 }), (s) => onlyLangErrors(s, (x) => parse(x, LIMITS))),
			{ numRuns: 500 }
		);
	});
	it('random unicode strings (runLine)', () => {
		fc.assert(
			fc.property(fc.string({ unit: 'binary', maxLength: 60 }), (s) => onlyLangErrors(s, (x) => runLine(x, ctx, { limits: LIMITS }))),
			{
				numRuns: 300
			}
		);
	});
	it('random words of the language (runLine)', () => {
		const words = fc.array(fc.constantFrom(...ALPHABET, 'thermo', 'stress', 'zstar', 'l=0.3', 'zh=2', 'v=0.5', '#1', '#2.E', 'pi'), {
			maxLength: 12
		});
		fc.assert(
			fc.property(words, (w) => onlyLangErrors(w.join(''), (x) => runLine(x, ctx, { limits: LIMITS }))),
			{ numRuns: 400 }
		);
	});
	it('mutations of valid lines (runLine)', () => {
		fc.assert(
			fc.property(mutated, (s) => onlyLangErrors(s, (x) => runLine(x, ctx, { limits: LIMITS }))),
			{ numRuns: 400 }
		);
	});
});

describe('printing', () => {
	it('the canonical print of any line that parses parses to the same print', () => {
		fc.assert(
			fc.property(mutated, (s) => {
				let ast;
				try {
					ast = parse(s);
				} catch {
					return;
				}
				const printed = printLine(ast);
				expect(printLine(parse(printed))).toBe(printed);
			}),
			{ numRuns: 400 }
		);
	});
});
