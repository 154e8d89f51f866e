import { expect } from 'vitest';

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
