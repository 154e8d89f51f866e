import { describe, expect, it } from 'vitest';
import { linePath, linearScale, logDomain, logScale, nearestIndex, niceDomain, niceStep } from '../../../src/lib/client/scale';

describe('linear scale', () => {
	it.each([
		[1, 5, 0.2],
		[0.9, 5, 0.2],
		[7, 5, 1],
		[9, 5, 2],
		[0.003, 4, 0.001]
	])('niceStep(%s, %s) = %s', (span, n, step) => expect(niceStep(span, n)).toBeCloseTo(step, 12));
	it('maps and inverts', () => {
		const s = linearScale([0, 2], [10, 110]);
		expect(s(1)).toBe(60);
		expect(s.invert(60)).toBe(1);
	});
	it('widens the domain to ticks and handles a flat one', () => {
		expect(niceDomain(0.05, 1.2)).toEqual([0, 1.2]);
		expect(niceDomain(3, 3)).toEqual([2.7, 3.3]);
	});
	it('gives ticks inside the domain with no float noise', () => {
		expect(linearScale([0, 1.2], [0, 1]).ticks(6)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1, 1.2]);
	});
});

describe('log scale', () => {
	it('maps decades evenly', () => {
		const s = logScale([0.01, 1], [0, 200]);
		expect(s(0.1)).toBeCloseTo(100, 10);
		expect(s.invert(100)).toBeCloseTo(0.1, 12);
	});
	it('widens to 1-2-5 steps around the data and ticks 1-2-5 over few decades', () => {
		expect(logDomain(0.05, 1.2)).toEqual([0.05, 2]);
		expect(logDomain(0.03, 0.3)).toEqual([0.02, 0.5]);
		expect(logDomain(1e-6, 1e-2)).toEqual([1e-6, 1e-2]);
		expect(logScale([0.01, 1], [0, 1]).ticks()).toEqual([0.01, 0.02, 0.05, 0.1, 0.2, 0.5, 1]);
	});
	it('falls back when there is nothing positive', () => {
		expect(logDomain(-1, 0)).toEqual([1e-3, 1]);
	});
});

describe('linePath', () => {
	it('breaks the line at missing and non-positive (log) values', () => {
		const x = linearScale([0, 4], [0, 4]);
		const y = logScale([0.1, 10], [0, 2]);
		const d = linePath(
			[
				[0, 1],
				[1, 1],
				[2, NaN],
				[3, -1],
				[4, 10]
			],
			x,
			y
		);
		expect(d).toBe('M0.00,1.00L1.00,1.00M4.00,2.00');
	});
	it('finds the nearest x', () => {
		expect(nearestIndex([0.1, 0.2, 0.3], 0.26)).toBe(2);
		expect(nearestIndex([], 1)).toBe(-1);
	});
});
