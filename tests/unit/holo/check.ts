import { expect } from 'vitest';
import { HoloError } from '../../../src/lib/holo/errors';

/** Relative-error check whose failure message prints input, expected, got, difference and tolerance. */
export function expectRel(input: string, expected: number, got: number, tol: number, source: string): void {
	const diff = Math.abs(got - expected);
	const rel = diff / Math.max(Math.abs(expected), Number.MIN_VALUE);
	const msg = `${input}: expected ${expected}, got ${got}, difference ${diff} (rel ${rel.toExponential(2)}), tolerance ${tol} rel [${source}]`;
	expect(Number.isFinite(got) && rel <= tol, msg).toBe(true);
}

/** Absolute-error variant. */
export function expectAbs(input: string, expected: number, got: number, tol: number, source: string): void {
	const diff = Math.abs(got - expected);
	const msg = `${input}: expected ${expected}, got ${got}, difference ${diff}, tolerance ${tol} abs [${source}]`;
	expect(Number.isFinite(got) && diff <= tol, msg).toBe(true);
}

/** The HoloError `fn` throws (any other error is rethrown; no error fails the test). */
export function expectHoloError(fn: () => unknown): HoloError {
	try {
		fn();
	} catch (e) {
		if (e instanceof HoloError) return e;
		throw e;
	}
	throw new Error('expected a HoloError');
}
