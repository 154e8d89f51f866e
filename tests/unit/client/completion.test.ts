import { describe, expect, it } from 'vitest';
import { applyCandidate, commonPrefix, complete, wordAt } from '../../../src/lib/client/completion';

const names = (line: string, caret = line.length) => complete(line, caret).candidates.map((c) => c.insert);

describe('completion', () => {
	it('finds the word under the caret', () => {
		expect(wordAt('darea l=0.4', 8)).toEqual({ start: 6, end: 11, word: 'l=' });
	});
	it('completes verbs at the start of a line and after ;', () => {
		expect(names('dar')).toEqual(['darea']);
		expect(names('use brane d=4; te')).toEqual(['tent']);
	});
	it('completes bulks after use, and that bulk’s keys', () => {
		expect(names('use bo')).toEqual(['boosted']);
		expect(names('use boosted d=4 ')).toEqual(['zh=', 'v=', 'rapidity=']);
	});
	it('completes keys on a verb line, skipping ones given', () => {
		const c = names('darea l=0.4 ');
		expect(c).toContain('o=');
		expect(c).not.toContain('l=');
		expect(names('mi pa')).toEqual(['pair']);
	});
	it('completes values of a key, including the next item of a list', () => {
		expect(names('darea o=ex')).toEqual(['o=exact']);
		expect(names('darea o=1,2,')).toContain('o=1,2,3,exact');
	});
	it('completes sinks after |', () => {
		expect(names('coeffs darea o=4 | t')).toEqual(['table', 'tex']);
	});
	it('inserts with a space after a word, none after key=', () => {
		expect(applyCandidate('dar', wordAt('dar', 3), 'darea')).toEqual({ line: 'darea ', caret: 6 });
		expect(applyCandidate('darea o', wordAt('darea o', 7), 'o=')).toEqual({ line: 'darea o=', caret: 8 });
	});
	it('shares a prefix', () => {
		expect(commonPrefix(['table', 'tex'])).toBe('t');
		expect(commonPrefix([])).toBe('');
	});
});

describe('vocabulary from the language’s help table', async () => {
	const { buildVocabulary } = await import('../../../src/lib/client/words');
	const v = buildVocabulary([{ name: 'btz-check', description: 'BTZ', params: { l: '1' } }]);
	it('has every verb with help and an example, and the statements', () => {
		const darea = v.verbs.find((w) => w.name === 'darea');
		expect(darea?.help).toMatch(/ΔA/);
		expect(darea?.example).toMatch(/^darea /);
		expect(v.verbs.map((w) => w.name)).toContain('sweep');
		expect(v.verbs.map((w) => w.name)).not.toContain('arithmetic');
	});
	it('completes macros after @', () => {
		expect(complete('@bt', 3, v).candidates.map((c) => c.insert)).toEqual(['@btz-check']);
	});
});
