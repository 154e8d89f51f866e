import { describe, expect, it } from 'vitest';
import { LineHistory } from '../../../src/lib/client/history';

describe('LineHistory', () => {
	it('walks back through every line from an empty input, and forward to the draft', () => {
		const h = new LineHistory(['use brane d=4', 'darea l=0.4']);
		expect(h.up('')).toBe('darea l=0.4');
		expect(h.up('darea l=0.4')).toBe('use brane d=4');
		expect(h.up('use brane d=4')).toBeUndefined();
		expect(h.down()).toBe('darea l=0.4');
		expect(h.down()).toBe('');
		expect(h.down()).toBeUndefined();
	});
	it('searches by what is typed: only lines starting with it, then the typed text again', () => {
		const h = new LineHistory(['darea l=0.1', 'use boosted d=4 v=0.5', 'tent l=0.4 o=3', 'darea l=0.2', 'darea l=0.2']);
		expect(h.up('dar')).toBe('darea l=0.2');
		// the repeat of the line shown is skipped, and lines not starting with "dar" are passed over
		expect(h.up('darea l=0.2')).toBe('darea l=0.1');
		expect(h.up('darea l=0.1')).toBeUndefined();
		expect(h.down()).toBe('darea l=0.2');
		expect(h.down()).toBe('dar');
		expect(h.up('u')).toBe('use boosted d=4 v=0.5');
	});
	it('walks the whole history when the typed line is selected (after an error), and gives the line back', () => {
		const h = new LineHistory(['darea l=0.4', 'tent l=0.4']);
		h.push('dara l=1');
		expect(h.up('dara l=1', '')).toBe('tent l=0.4');
		expect(h.up('tent l=0.4')).toBe('darea l=0.4');
		expect(h.down()).toBe('tent l=0.4');
		expect(h.down()).toBe('dara l=1');
	});
	it('appends new lines, keeps failed ones, and collapses immediate repeats', () => {
		const h = new LineHistory(['a']);
		h.push('dara l=1');
		h.push('dara l=1');
		h.push('   ');
		expect(h.all).toEqual(['a', 'dara l=1']);
		expect(h.up('')).toBe('dara l=1');
	});
	it('keeps at most max entries', () => {
		const h = new LineHistory(['1', '2', '3'], 3);
		h.push('4');
		expect(h.all).toEqual(['2', '3', '4']);
	});
});
