import { describe, expect, it } from 'vitest';
import { makeBulk } from '$lib/holo/index';
import { nearestPole, padeApproximant, resum, resumTent } from '$lib/holo/analysis';

// A resummed value always comes with its error estimate (neighbouring approximants
// [L−1/M], [L/M−1]; Baker & Graves-Morris, "Padé Approximants", 2nd ed. 1996, common practice) and a warning
// when that estimate is large, when a pole or a Froissart doublet is in range, or when ΔA < 0.

describe('resum reports its own reliability', () => {
	it("the issue's cases now warn that there is no value (exact ΔA from the engine's exact numerics)", () => {
		for (const [d, l, o] of [
			[4, 3, 12],
			[4, 2, 6],
			[3, 5, 12]
		]) {
			const r = resum(makeBulk('brane', { d, zh: 1 }), l, o);
			const msg = `d=${d} l=${l} o=${o}: ${r.value} ± ${r.error} vs exact ${r.exact}; ${r.warning}`;
			expect(r.warning, msg).toMatch(/no value/);
			// the estimate is honest: it covers the actual error
			expect(r.error, msg).toBeGreaterThanOrEqual(Math.abs(r.value - r.exact));
		}
		expect(resum(makeBulk('brane', { d: 4, zh: 1 }), 3, 12).warning).toMatch(/< 0 is unphysical/);
	});

	it('where Padé works the estimate is small, covers the actual error and nothing warns', () => {
		for (const [name, p, l, o] of [
			['brane', { d: 4, zh: 1 }, 1, 10],
			['brane', { d: 3, zh: 1 }, 1, 8],
			['brane', { d: 4, zh: 1 }, 0.8, 6],
			['boosted', { d: 4, zh: 1, v: 0.5 }, 0.9, 10]
		] as const) {
			const r = resum(makeBulk(name, p), l, o);
			const msg = `${name} l=${l} o=${o}: ${r.value} ± ${r.error} vs exact ${r.exact}`;
			expect(r.warning, msg).toBeUndefined();
			expect(r.error / Math.abs(r.value), msg).toBeLessThan(1e-2);
			expect(r.error, msg).toBeGreaterThanOrEqual(Math.abs(r.value - r.exact));
		}
	});

	it('between: an estimate of a few per cent warns with the number (d = 4, l = 1.5, o = 10)', () => {
		const r = resum(makeBulk('brane', { d: 4, zh: 1 }), 1.5, 10);
		expect(r.warning).toMatch(/differ by \d+(\.\d+)?%/);
		expect(r.error).toBeGreaterThanOrEqual(Math.abs(r.value - r.exact));
	});

	it('T_ent resummation carries the same error field', () => {
		const r = resumTent(makeBulk('brane', { d: 4, zh: 1 }), 1, 10);
		expect(Number.isFinite(r.error)).toBe(true);
		expect(r.error).toBeGreaterThanOrEqual(Math.abs(r.value - r.exact));
	});
});

describe('Froissart doublets (Gilewicz & Kryakin, J. Comput. Appl. Math. 153 (2003) 235: noise in the coefficients makes pole–zero pairs)', () => {
	it('1/(1−x) with 1e-9 noise: [3/3] has its genuine pole at 1 and the rest flagged spurious', () => {
		const noise = [0.3, -0.7, 0.5, 0.9, -0.2, 0.4, -0.8];
		const c = noise.map((e) => 1 + 1e-9 * e);
		const p = padeApproximant(c, 3, 3)!;
		expect(p).not.toBeNull();
		expect(Math.abs(nearestPole(p)!.re - 1)).toBeLessThan(1e-6);
		expect(p.poles.filter((q) => q.spurious).length, JSON.stringify(p.poles)).toBeGreaterThanOrEqual(1);
	});
});
