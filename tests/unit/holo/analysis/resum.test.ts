import { describe, it, expect } from 'vitest';
import { makeBulk, validity } from '$lib/holo/index';
import { resum, resumTent, padeApproximant, evalPade, polyRoots } from '$lib/holo/analysis';
import { expectRel, expectAbs } from '../check';

describe('Padé approximants', () => {
	it('[1/1] of ln(1+x)/x = 1 − x/2 + x²/3 is (1 + x/6)/(1 + 2x/3) (Baker & Graves-Morris 1996)', () => {
		const p = padeApproximant([1, -1 / 2, 1 / 3], 1, 1)!;
		expectAbs('q1', 2 / 3, p.q[1], 1e-15, 'hand computation');
		expectAbs('p1', 1 / 6, p.p[1], 1e-15, 'hand computation');
		expectRel('pole', -1.5, p.poles[0].re, 1e-14, 'hand computation');
	});

	it('[4/4] of e^x: denominator 1 − x/2 + 3x²/28 − x³/84 + x⁴/1680, and at x = 1 it beats the degree-8 Taylor polynomial (Baker & Graves-Morris 1996)', () => {
		const c = Array.from({ length: 9 }, (_, k) => 1 / [1, 1, 2, 6, 24, 120, 720, 5040, 40320][k]);
		const p = padeApproximant(c, 4, 4)!;
		[1, -1 / 2, 3 / 28, -1 / 84, 1 / 1680].forEach((q, i) => expectRel(`[4/4] exp q_${i}`, q, p.q[i], 1e-13, 'closed form'));
		const err = Math.E - evalPade(p, 1);
		const taylor = Math.E - c.reduce((a, b) => a + b);
		expect(err > 0 && err < taylor / 20, `Padé error ${err}, Taylor error ${taylor}`).toBe(true);
	});

	it('polynomial roots (Aberth–Ehrlich)', () => {
		const r = polyRoots([-6, 11, -6, 1])
			.map((z) => z.re)
			.sort();
		[1, 2, 3].forEach((x, i) => expectRel(`root ${x}`, x, r[i], 1e-13, '(x−1)(x−2)(x−3)'));
		expect(padeApproximant([1, 1, 1, 1], 1, 2)).toBeNull(); // singular Toeplitz system
	});
});

describe('resummation of ΔA and T_ent', () => {
	it('Padé is closer to exact than the plain series beyond the plain series’ validity (exact numerics)', () => {
		for (const [name, p] of [
			['brane', { d: 4, zh: 1 }],
			['brane', { d: 3, zh: 1 }],
			['boosted', { d: 4, zh: 1, v: 0.5 }]
		] as const) {
			const b = makeBulk(name, p);
			const n = 10;
			const { l_max, radius } = validity(b, n, 1e-2);
			for (const f of [1.2, 1.6]) {
				const l = l_max * f;
				const r = resum(b, l, n);
				const ep = Math.abs(r.value - r.exact);
				const es = Math.abs(r.series - r.exact);
				expect(
					ep < es / 100 && ep < 0.01 * Math.abs(r.exact),
					`${name} ${JSON.stringify(p)} l=${l} (l_max=${l_max}, radius=${radius}): [${r.L}/${r.M}] err ${ep}, series err ${es}`
				).toBe(true);
			}
		}
	});

	it('reports how far Padé extends the range (report, not a claim): largest l on a grid with 1% error', () => {
		const rows: string[] = [];
		for (const d of [3, 4]) {
			const b = makeBulk('brane', { d, zh: 1 });
			const { l_max } = validity(b, 10, 1e-2);
			let lp = 0;
			for (let l = 0.1; l <= 6; l += 0.05) {
				const r = resum(b, l, 10);
				if (Math.abs(r.value - r.exact) <= 0.01 * Math.abs(r.exact)) lp = l;
				else break;
			}
			rows.push(`d=${d}: plain o=10 valid to l=${l_max.toFixed(3)}, Padé to l≈${lp.toFixed(2)}`);
			expect(lp > 1.5 * l_max, rows.at(-1)).toBe(true);
		}
		console.info(rows.join('\n'));
	});

	it('T_ent⁽ⁿ⁾ at large l vs the Hawking temperature (report): exact T_ent → T_H, the plain series fails, Padé follows exact only part-way', () => {
		const b = makeBulk('brane', { d: 4, zh: 1 });
		const TH = 1 / Math.PI;
		const lines: string[] = [];
		for (const l of [0.5, 1, 1.5, 2, 3]) {
			const r = resumTent(b, l, 10);
			lines.push(
				`l=${l}: exact ${r.exact.toPrecision(5)}, Padé[${r.L}/${r.M}] ${r.value.toPrecision(5)}, plain o=10 ${r.series.toPrecision(5)}, T_H ${TH.toPrecision(5)}`
			);
		}
		console.info(lines.join('\n'));
		const r1 = resumTent(b, 1, 10);
		expectRel('brane d=4 l=1 Padé T_ent vs exact', r1.exact, r1.value, 1e-3, 'exact numerics');
		expect(Math.abs(r1.series - r1.exact) > 0.1 * r1.exact).toBe(true);
	});
});
