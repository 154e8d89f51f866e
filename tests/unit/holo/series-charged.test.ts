import { describe, expect, it } from 'vitest';
import {
	cd,
	deltaArea,
	deltaAreaSeries,
	makeBulk,
	seriesCoeffs,
	seriesPowers,
	seriesRadius,
	seriesWarning,
	validity
} from '../../../src/lib/holo/index';
import { chargedPowers } from '../../../src/lib/holo/series/charged';
import { exactChargedTerms } from '../../../src/lib/holo/series/exact-charged';
import { atomValues } from '../../../src/lib/holo/series/exact-latex';
import { evaluateTerms } from '../../../src/lib/holo/series/laurent';
import fx from '../../fixtures/holo/charged_series.json';
import { expectAbs, expectRel } from './check';

// ΔA = l^{2−d} Σ_K c_K(q²) (l/zh)^K, K ∈ {da + 2(d−1)b}, order n = every K ≤ nd (series/charged.ts)

describe('charged series at q = 0 is the brane series (f reduces to the brane’s; derived)', () => {
	for (let d = 3; d <= 10; d++) {
		it(`d=${d}: c_{kd} = a_k (k ≤ 12) and every other power vanishes`, () => {
			const ch = seriesCoeffs(makeBulk('charged', { d, zh: 1, q: 0 }), 12);
			const br = seriesCoeffs(makeBulk('brane', { d, zh: 1 }), 12);
			for (const c of ch) {
				if (c.power! % d === 0) {
					// d = 3 loses ~1e−11 to cancellation in the inversion at high k, in both computations (coeffs.ts)
					expectRel(`d=${d} K=${c.power}`, br[c.power! / d - 1].value, c.value, d === 3 ? 2e-11 : 1e-12, 'brane series, same expansion');
				} else expect(c.value, `d=${d} K=${c.power}: q = 0 must leave only the brane's powers`).toBe(0);
			}
		});
	}
	// q ≠ 0 is refused at d = 2 (there the charge would change e, p but not the metric)
	it('d = 2: the charge drops out of f (m = d), the series is the BTZ one; q ≠ 0 is refused', () => {
		expect(() => makeBulk('charged', { d: 2, zh: 1, q: 0.7 })).toThrow(/d ≥ 3 for q ≠ 0/);
		const ch = seriesCoeffs(makeBulk('charged', { d: 2, zh: 1, q: 0 }), 6);
		const br = seriesCoeffs(makeBulk('brane', { d: 2, zh: 1 }), 6);
		ch.forEach((c, i) => expectRel(`d=2 k=${c.k}`, br[i].value, c.value, 1e-15, 'f = 1 − (z/zh)² identically'));
	});
});

describe('charged coefficients against 40-digit mpmath (tests/fixtures/holo/charged_runner.py: fixed-point reversion, not Lagrange)', () => {
	for (const cs of fx.cases) {
		it(`d=${cs.d} q=${cs.q}, order ${cs.order}`, () => {
			const b = makeBulk('charged', { d: cs.d, zh: 1, q: Number(cs.q) });
			const got = seriesCoeffs(b, cs.order);
			expect(got.map((c) => c.power)).toEqual(cs.powers);
			expect(seriesPowers(b, cs.order)).toEqual(cs.powers);
			got.forEach((c, i) => {
				expect(c.k).toBe(i + 1);
				expectRel(`d=${cs.d} q=${cs.q} K=${c.power}`, Number(cs.c[i]), c.value, 1e-12, 'mpmath 40 digits');
			});
		});
	}
});

describe('first order: a₁(q) = a₁(0)(1+q²) = (d−1)(1+q²)/(4π c_d) (ΔS = ΔE/T_ent, ε = (d−1)(1+q²)/(16πG zh^d), T_ent = c_d/l; Bhattacharya, Nozaki, Takayanagi & Ugajin, PRL 110 (2013) 091602)', () => {
	it('d = 3…8, q = 0.3, 0.5, 1', () => {
		for (let d = 3; d <= 8; d++) {
			for (const q of [0.3, 0.5, 1]) {
				const c = seriesCoeffs(makeBulk('charged', { d, zh: 1, q }), 1);
				expect(c.length).toBe(1);
				expect(c[0].power).toBe(d);
				expectRel(`a₁ d=${d} q=${q}`, ((d - 1) * (1 + q * q)) / (4 * Math.PI * cd(d)), c[0].value, 1e-13, 'BNTU 2013');
			}
		}
	});
});

describe('order-n error against the exact ΔA falls like the next omitted power (fitted log-log slope; derived, checked against exact numerics)', () => {
	for (const d of [3, 4, 5]) {
		it(`q=0.5 d=${d}, n = 1…4`, () => {
			const b = makeBulk('charged', { d, zh: 1, q: 0.5 });
			for (let n = 1; n <= 4; n++) {
				const [K1, K2] = chargedPowers(d, (n + 2) * d).filter((K) => K > n * d);
				// l grows with n so the error stays far above the ~1e−14 relative accuracy of the exact ΔA
				const l0 = [0.1, 0.1, 0.15, 0.25][n - 1];
				const ls = [l0, 1.2 * l0];
				const slope = (f: (l: number) => number) => Math.log(Math.abs(f(ls[1]) / f(ls[0]))) / Math.log(1.2) + d - 2;
				const s = slope((l) => deltaAreaSeries(b, l, n) - deltaArea(b, l));
				// the local slope the omitted terms K ≤ (n+3)d predict at these l (the exact error must follow it)
				const tail = slope((l) => deltaAreaSeries(b, l, n + 3) - deltaAreaSeries(b, l, n));
				expectAbs(`d=${d} q=0.5 n=${n} l=${l0}: slope of the exact error vs the omitted tail's`, tail, s, 0.01, 'derived; exact numerics');
				// → K1 as l → 0; at these l the next power K2 can still pull it up (d = 5, n = 3, 4: c_{K1} ∝ q⁴ is small)
				const msg = `d=${d} q=0.5 n=${n}: slope ${s}, expected in [${K1}, ${K2}] (next omitted powers) with 2% slack`;
				expect(s >= K1 * 0.98 && s <= K2 * 1.02, msg).toBe(true);
				if (d < 5 || n < 3) expectRel(`d=${d} q=0.5 n=${n} slope`, K1, s, 0.02, 'Taylor remainder, common practice');
			}
		});
	}
});

describe('validity, radius and warnings for charged', () => {
	it('radius at q = 0 is the brane’s (growth fit vs ratio test, within 1%; the fit is an estimate, which the warning says)', () => {
		for (const d of [3, 4, 6]) {
			const rb = seriesRadius(makeBulk('brane', { d, zh: 1 }));
			expectRel(`radius d=${d} q=0`, rb, seriesRadius(makeBulk('charged', { d, zh: 1, q: 0 })), 0.01, 'same series; two estimators');
		}
	});
	it('l_max is where the relative error reaches tol', () => {
		const b = makeBulk('charged', { d: 4, zh: 1, q: 0.5 });
		const { l_max, radius } = validity(b, 3, 1e-4);
		const rel = (l: number) => Math.abs(deltaAreaSeries(b, l, 3) / deltaArea(b, l) - 1);
		expect(l_max).toBeLessThan(radius);
		expect(rel(l_max * 0.999), `rel error just below l_max=${l_max}`).toBeLessThanOrEqual(1e-4);
		expect(rel(l_max * 1.01), `rel error just above l_max=${l_max}`).toBeGreaterThan(1e-4);
	});
	it('warnings: none when reliable; beyond the radius the text says so and says the radius is estimated', () => {
		const b = makeBulk('charged', { d: 4, zh: 1, q: 0.5 });
		expect(seriesWarning(b, 0.1, 3)).toBeUndefined();
		expect(seriesWarning(b, 2, 3)).toMatch(/estimated from the growth of the coefficients.*a number, not an approximation/);
		expect(seriesWarning(b, 0.5, 0)).toBeUndefined();
		expect(deltaAreaSeries(b, 0.3, 0)).toBe(0);
	});
	it('LaTeX: exact q² polynomial in π and B(s/m, ½) to order 6 (its value matches the double c_K), decimals marked ≈ beyond', () => {
		for (const d of [3, 4, 7]) {
			const b = makeBulk('charged', { d, zh: 1, q: 0.5 });
			const c = seriesCoeffs(b, 7);
			const terms = exactChargedTerms(d, 6);
			for (const t of c) {
				if (t.power! <= 6 * d) {
					expect(t.exact, `d=${d} K=${t.power}`).toBe(true);
					const tol = d === 3 ? 1e-11 : 2e-12; // the doubles' inversion cancellation (coeffs.ts)
					expectRel(
						`d=${d} K=${t.power}: exact form at q² = 0.25`,
						evaluateTerms(terms.get(t.power!)!, atomValues(d, 0.25)),
						t.value,
						tol,
						'exact algebra vs doubles'
					);
				} else expect(t.latex, `d=${d} K=${t.power}`).toMatch(/^\\approx .*exact form computed to order 6/);
			}
		}
		// the q² term of d = 4 (K = 6) is a single monomial in the atoms, times q²
		const c = seriesCoeffs(makeBulk('charged', { d: 4, zh: 1, q: 0.5 }), 2);
		expect(c[1].latex).toMatch(/^-\\frac\{.*\\mathrm\{B\}\(\\tfrac\{1\}\{6\},\\tfrac\{1\}\{2\}\).*\}\\,q\^\{2\}$/);
	});
});
