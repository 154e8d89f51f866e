import { describe, expect, it } from 'vitest';
import { LineHistory } from '../../../src/lib/client/history';

describe('LineHistory', () => {
	it('walks back through server history and forward to the draft', () => {
		const h = new LineHistory(['use brane d=4', 'darea l=0.4']);
		expect(h.up('dar')).toBe('darea l=0.4');
		expect(h.up('ignored')).toBe('use brane d=4');
		expect(h.up('x')).toBeUndefined();
		expect(h.down()).toBe('darea l=0.4');
		expect(h.down()).toBe('dar');
		expect(h.down()).toBeUndefined();
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
