import { describe, expect, it } from 'vitest';
import { deltaAreaSeries, HoloError, makeBulk, seriesCoeffs, seriesWarning } from '../../../src/lib/holo/index';

describe('charged: no series yet (double series in (l/zh)^d and (l/zh)^{2(d−1)}; documented in series/index.ts)', () => {
	it('seriesCoeffs, deltaAreaSeries and seriesWarning answer a HoloError on o', () => {
		const b = makeBulk('charged', { d: 4, zh: 1, q: 0.5 });
		for (const f of [() => seriesCoeffs(b, 3), () => deltaAreaSeries(b, 0.5, 2), () => seriesWarning(b, 0.5, 2)]) {
			try {
				f();
				expect.unreachable('no error');
			} catch (e) {
				expect(e).toBeInstanceOf(HoloError);
				expect((e as HoloError).message).toBe('no series for charged yet; use o=exact');
				expect((e as HoloError).key).toBe('o');
			}
		}
		expect(seriesWarning(b, 0.5, 0)).toBeUndefined();
	});
});
