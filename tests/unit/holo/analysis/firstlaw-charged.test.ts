import { describe, expect, it } from 'vitest';
import { cd, deltaArea, makeBulk } from '$lib/holo/index';
import { firstLaw, firstLawCoefficients, mu, tent } from '$lib/holo/analysis';
import { chargedPowers } from '$lib/holo/series/charged';
import { expectAbs, expectRel } from '../check';

// Charged brane, one parameter: w = zh^{−d} at fixed q (firstlaw.ts); ΔE = l(d−1)(1+q²)/(16πG zh^d).

describe('charged first law, order 1: T_ent = c_d/l for every q (ΔS = ΔE/T_ent holds at first order for any state; Bhattacharya, Nozaki, Takayanagi & Ugajin, PRL 110 (2013) 091602)', () => {
	it('d = 3…6, q = 0.3, 1; l = 0.05, 0.4', () => {
		for (const d of [3, 4, 5, 6]) {
			for (const q of [0.3, 1]) {
				for (const l of [0.05, 0.4]) {
					const b = makeBulk('charged', { d, zh: 1, q });
					expectRel(`charged d=${d} q=${q} l=${l} o=1 T_ent`, cd(d) / l, tent(b, l, 1).value, 1e-12, 'BNTU 2013');
					expect(mu(b, l, 1).value).toBe(0);
				}
			}
		}
	});
});

describe('charged first law, order n', () => {
	it('exact α (∂_w at fixed q) agrees with Richardson finite differences of the exact ΔA in zh (common practice)', () => {
		const d = 4;
		const q = 0.5;
		const l = 0.6;
		const r = firstLawCoefficients(makeBulk('charged', { d, zh: 1, q }), l, 'exact');
		const A = (w: number) => deltaArea(makeBulk('charged', { d, zh: Math.pow(w, -1 / d), q }), l);
		const h = 1e-3;
		const Aw = (4 * (A(1 + h / 2) - A(1 - h / 2)) - (A(1 + h) - A(1 - h)) / 2) / (3 * h);
		expectRel('charged d=4 q=0.5 l=0.6 exact ∂_wΔA', Aw, r.Aw, 1e-9, 'finite differences, common practice');
	});

	it('order-n α converges to the exact α as n grows (derived; exact numerics)', () => {
		for (const [d, l] of [
			[3, 0.4],
			[4, 0.5],
			[5, 0.3]
		]) {
			const b = makeBulk('charged', { d, zh: 1, q: 0.5 });
			const ex = firstLawCoefficients(b, l, 'exact').alpha;
			const err = [1, 2, 4, 8, 12].map((n) => Math.abs(firstLawCoefficients(b, l, n).alpha - ex));
			const msg = `charged d=${d} q=0.5 l=${l}: |α_n − α_exact| at n = 1, 2, 4, 8, 12 = ${err.map((e) => e.toExponential(2))}, exact α = ${ex}`;
			expect(err.every((e, i) => i === 0 || e < err[i - 1]) && err[4] < 1e-6 * Math.abs(ex), msg).toBe(true);
		}
	});

	it('order-n residual scales like the next omitted power of l/zh (fitted slope; derived)', () => {
		const l = 1;
		const slopeOf = (d: number, n: number, key: 'residual' | 'residualExact', zhs: number[]) => {
			const xs = zhs.map((zh) => Math.log(l / zh));
			const ys = zhs.map((zh) => Math.log(Math.abs(firstLaw(makeBulk('charged', { d, zh, q: 0.5 }), l, n).scale[key])));
			const mx = xs.reduce((a, b) => a + b) / xs.length;
			const my = ys.reduce((a, b) => a + b) / ys.length;
			return xs.reduce((s, x, i) => s + (x - mx) * (ys[i] - my), 0) / xs.reduce((s, x) => s + (x - mx) ** 2, 0);
		};
		for (const d of [3, 4]) {
			for (let n = 1; n <= 4; n++) {
				const K = chargedPowers(d, (n + 1) * d).find((p) => p > n * d)!;
				// against order n+1: the variation of the added terms, led by (l/zh)^K; the next power corrects
				// the slope by O((l/zh)^{gap}) ≤ 1e−2 at l/zh ≤ 1/20
				expectAbs(
					`charged d=${d} q=0.5 l=1 o=${n}: slope of log|residual| vs log(l/zh)`,
					K,
					slopeOf(d, n, 'residual', [20, 28, 40]),
					0.05,
					'derived'
				);
				// against the exact ΔS: the same power up to higher orders, at l/zh large enough that the residual
				// stays above the ~1e−13 accuracy of the exact numerics
				if (n <= 3)
					expectAbs(
						`charged d=${d} q=0.5 l=1 o=${n}: slope of log|residualExact| vs log(l/zh)`,
						K,
						slopeOf(d, n, 'residualExact', [4, 5, 6]),
						0.25,
						'derived; exact numerics'
					);
			}
		}
	});

	it('firstLaw: exact residual vanishes; G cancels in α', () => {
		const b = makeBulk('charged', { d: 4, zh: 1, q: 0.5 });
		const r1 = firstLaw(b, 0.5, 'exact', 1);
		const r2 = firstLaw(b, 0.5, 'exact', 0.01);
		expectAbs('charged exact residual', 0, r1.scale.residual, 1e-13 * Math.abs(r1.scale.lhs), 'identity');
		expect(r2.alpha).toBe(r1.alpha);
		const o3 = firstLaw(b, 0.5, 3);
		expect(o3.series?.variable).toBe('(l/z_h)');
		expect(o3.series?.alpha.length).toBe(3 * 4 - 4 + 1);
	});
});
