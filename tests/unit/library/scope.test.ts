/** The library refuses a macro body that refers outside the macro: the host pad's steps or names. */
import { describe, expect, it } from 'vitest';
import { checkBody } from '../../../src/lib/library/check';

describe('macro body scope', () => {
	it('refuses a reference to a step the macro does not have', () => {
		const p = checkBody(['darea l=#3'], {});
		expect(p).toMatchObject({ line: 1, start: 8, end: 10 });
		expect(p!.message).toBe(
			'line 1: #3 points outside this macro: line 1 has no earlier lines, and a body may refer only to its own earlier lines and its parameters.'
		);
		expect(checkBody(['darea l=0.3', 'darea l=0.4', '#3 - #1'], {})!.message).toBe(
			'line 3: #3 points outside this macro: a body may refer only to its own earlier lines (#1…#2) and its parameters.'
		);
		expect(checkBody(['darea l=0.3', 'tent l=#1.l o=2'], {})).toBeNull();
		expect(checkBody(['darea l=0.3', 'tent l=#2.l o=2'], {})).toMatchObject({ line: 2 });
	});

	it("refuses names it did not define (the pad's lets), and takes its own lets, bulk keys, pi and e", () => {
		expect(checkBody(['darea l=w'], {})!.message).toMatch(/^line 1: 'w' is not defined in this macro/);
		expect(checkBody(['let w = 0.2', 'darea l=w*2', 'darea l=zh/3', '2*pi*e'], {})).toBeNull();
		expect(checkBody(['darea l=w', 'let w = 0.2'], {})).toMatchObject({ line: 1 });
		expect(checkBody(['use metric d=4 f="1 - (z/a)^4" a=2', 'darea l=a/4'], {})).toBeNull();
	});

	it('checks parameter defaults as they are put in, and the keys of nested calls', () => {
		expect(checkBody(['darea l={l}'], { l: '#3' })).toMatchObject({ line: 1 });
		expect(checkBody(['@other l=#1'], {})).toMatchObject({ line: 1 });
		expect(checkBody(['darea l={l} o=1,2,exact'], { l: '0.1..0.5:5' })).toBeNull();
	});
});
