import { afterEach, describe, expect, it, vi } from 'vitest';
import { createRateLimiter } from '../../../src/lib/server/rate-limit';
import { driftBetween, DRIFT_TOLERANCE } from '../../../src/lib/server/eval/drift';
import type { Result } from '../../../src/lib/lang/result';

describe('rate limiter', () => {
	it('allows `limit` calls per window per key, then refuses until the window ends', () => {
		const rl = createRateLimiter(3, 1000);
		const t = 1_000_000;
		expect([1, 2, 3, 4].map(() => rl.take('a', t))).toEqual([true, true, true, false]);
		expect(rl.take('b', t)).toBe(true); // keys are independent
		expect(rl.retryAfterSeconds('a', t + 200)).toBe(1);
		expect(rl.take('a', t + 1000)).toBe(true); // a new window
	});
});

describe('drift', () => {
	const scalar = (value: number): Result => ({ kind: 'scalar', label: 'ΔA', value, order: 'exact' });
	it('is zero for identical results and the relative difference otherwise', () => {
		expect(driftBetween([scalar(0.25)], [scalar(0.25)])).toBe(0);
		expect(driftBetween([scalar(1)], [scalar(1 + 1e-6)])).toBeCloseTo(1e-6 / (1 + 1e-6), 15);
	});
	it('is infinite when the shape of the answer changed', () => {
		expect(driftBetween([scalar(1)], [{ kind: 'note', text: 'x' }])).toBe(Infinity);
		expect(driftBetween([scalar(1)], [scalar(1), scalar(2)])).toBe(Infinity);
		const table = (cols: string[]): Result => ({ kind: 'table', label: 't', columns: cols, rows: [[1, 2]] });
		expect(driftBetween([table(['l', 'o1'])], [table(['l', 'o2'])])).toBe(Infinity);
	});
	it('compares every cell of a table and every field of a record', () => {
		const t = (x: number): Result => ({
			kind: 'table',
			label: 't',
			columns: ['l', 'exact'],
			rows: [
				[0.1, 2],
				[0.2, x]
			]
		});
		expect(driftBetween([t(3)], [t(3)])).toBe(0);
		expect(driftBetween([t(3)], [t(3.3)])).toBeGreaterThan(DRIFT_TOLERANCE);
		const r = (T: number): Result => ({ kind: 'record', label: 'thermo', fields: { T, s: 1 } });
		expect(driftBetween([r(0.3)], [r(0.3 * (1 + 1e-12))])).toBeLessThan(DRIFT_TOLERANCE);
	});
});

describe('secure cookies', () => {
	const saved = { ...process.env };
	afterEach(() => {
		process.env = { ...saved };
		vi.resetModules();
	});
	async function secureWith(env: Record<string, string>) {
		process.env = { ...saved, ...env };
		vi.resetModules();
		return (await import('../../../src/lib/server/env')).env.secureCookies;
	}
	it('are on in production over https and off over plain local http', async () => {
		expect(await secureWith({ NODE_ENV: 'production', ORIGIN: 'https://pads.example.org' })).toBe(true);
		expect(await secureWith({ NODE_ENV: 'production', ORIGIN: 'http://localhost:3000' })).toBe(false);
		expect(await secureWith({ NODE_ENV: 'development', BULKPAD_SECURE_COOKIES: '1' })).toBe(true);
	});
});

describe('drift after storage', () => {
	it('treats a non-finite number that went through JSON as the same value', () => {
		const fresh: Result[] = [{ kind: 'table', label: 't', columns: ['l', 'o9'], rows: [[2, NaN]] }];
		const stored = JSON.parse(JSON.stringify(fresh)) as Result[];
		expect(driftBetween(stored, JSON.parse(JSON.stringify(fresh)))).toBe(0);
	});
});
