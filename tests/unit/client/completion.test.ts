import { describe, expect, it } from 'vitest';
import { applyCandidate, commonPrefix, completeAt } from '../../../src/lib/client/completion';
import { buildVocabulary } from '../../../src/lib/client/words';

const names = (line: string, caret = line.length, cc = {}) => completeAt(line, caret, cc).candidates.map((c) => c.insert);

/** Tab with a single candidate: the line as the input shows it afterwards. */
function tab(line: string, cc = {}) {
	const { at, candidates } = completeAt(line, line.length, cc);
	if (candidates.length !== 1) throw new Error(`${candidates.length} candidates for "${line}": ${candidates.map((c) => c.insert)}`);
	return applyCandidate(line, at, candidates[0]!.insert).line;
}

describe('completion on the input line', () => {
	it('completes a verb, with a space after it', () => {
		expect(tab('dare')).toBe('darea ');
		expect(tab('use brane d=4; fir')).toBe('use brane d=4; firstlaw ');
	});
	it('completes a bulk after use', () => {
		expect(tab('use boo')).toBe('use boosted ');
	});
	it('completes a key without a space, so the value follows', () => {
		expect(tab('darea l=0.4 z')).toBe('darea l=0.4 zh=');
		expect(names('darea l=0.4 ')).not.toContain('l=');
	});
	it('completes a value after key=, and the next item of a list', () => {
		expect(tab('darea o=ex')).toBe('darea o=exact ');
		expect(tab('darea o=1,2,ex')).toBe('darea o=1,2,exact ');
	});
	it('replaces the whole word under the caret, keeping the rest of the line', () => {
		const line = 'dar l=0.4';
		const { at, candidates } = completeAt(line, 3);
		expect(applyCandidate(line, at, candidates[0]!.insert)).toEqual({ line: 'darea l=0.4', caret: 5 });
	});
	it('completes library macros after @', () => {
		expect(names('@bt', 3, { macros: ['btz-check', 'sym-thermo'] })).toEqual(['@btz-check']);
	});
	it('shares a prefix', () => {
		expect(commonPrefix(['table', 'tex'])).toBe('t');
		expect(commonPrefix([])).toBe('');
	});
});

describe('palette vocabulary from the language’s help table', () => {
	const v = buildVocabulary([{ name: 'btz-check', description: 'BTZ', params: { l: '1' } }]);
	it('has every verb with help and an example, and the statements', () => {
		const darea = v.verbs.find((w) => w.name === 'darea');
		expect(darea?.help).toMatch(/ΔA/);
		expect(darea?.example).toMatch(/^darea /);
		expect(v.verbs.map((w) => w.name)).toContain('sweep');
		expect(v.verbs.map((w) => w.name)).not.toContain('arithmetic');
		expect(v.bulks.map((w) => w.name)).toContain('boosted');
	});
});
