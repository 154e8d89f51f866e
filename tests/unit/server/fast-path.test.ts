import { describe, it, expect } from 'vitest';
import { isFastLine, answerFast } from '../../../src/lib/server/eval/fast';
import { evaluateTask } from '../../../src/lib/server/eval/worker';

const ctx = { bulk: { name: 'brane', params: { d: 4, zh: 1 } }, units: { system: 'geo', G: 1 }, refs: {}, lets: {}, macros: {} } as never;

describe('fast path: which lines run in the server process (bounded cost only)', () => {
	it.each([
		['darea l=0.5', true],
		['darea strip l=0.5 o=exact zh=2 d=3', true],
		['zstar l=-0.3', true],
		['entropy l=0.4 o=6', true],
		['entropy l=0.4 o=7', false], // past the light order
		['darea ball R=0.5', false], // a ball: hundreds of microseconds to seconds
		['sweep darea l=0.1..1:5', false],
		['darea l=0.1..1:5', false], // a range
		['darea l=0.1,0.2', false], // a list
		['darea l=2*0.25', false], // arithmetic goes through the formula sandbox in a process
		['darea l=x', false],
		['darea l=#1', false],
		['darea l=0.5 | table', false],
		['use boosted v=0.3; darea l=0.5', false],
		['use metric f="1-z^4"', false],
		['@twice l=1', false],
		['coeffs o=3', false],
		['firstlaw l=0.5', false],
		['darea l=', false] // a parse error: answered by the queued path
	])('%s → %s', (line, fast) => {
		expect(isFastLine(line)).toBe(fast);
	});

	it('answers with evaluateTask itself, errors included', () => {
		for (const line of ['darea l=0.5', 'zstar l=-1', 'darea l=0.5 zz=1']) {
			const f = answerFast(line, ctx);
			expect(f, line).toBeDefined();
			expect(f!.answer, line).toEqual(evaluateTask({ input: line, ctx }));
			expect(f!.waitMs).toBe(0);
		}
		expect(answerFast('darea ball R=0.5', ctx)).toBeUndefined();
	});
});
