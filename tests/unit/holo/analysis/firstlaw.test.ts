import { describe, it, expect } from 'vitest';
import { makeBulk, cd, deltaArea, seriesCoeffs, stressTensor } from '$lib/holo/index';
import { firstLawCoefficients, firstLaw, tent, mu } from '$lib/holo/analysis';
import { expectRel, expectAbs } from '../check';
import ref from '../../../fixtures/holo/analysis/reference.json';

describe('first law, order 1', () => {
	it('static brane: T_ent = c_d/l and ζ = 0 (Bhattacharya, Nozaki, Takayanagi & Ugajin, PRL 110 (2013) 091602)', () => {
		for (const d of [2, 3, 4, 5, 6, 8]) {
			for (const l of [0.05, 0.4]) {
				const b = makeBulk('brane', { d, zh: 1 });
				const r = firstLawCoefficients(b, l, 1);
				expectRel(`brane d=${d} l=${l} o=1 T_ent`, cd(d) / l, r.tent, 1e-12, 'BNTU 2013');
				expect(r.zeta).toBe(0);
				expect(mu(b, l, 1).value).toBe(0);
			}
		}
	});

	it('boosted: T_ent ΔS⁽¹⁾ = l[T_tt + (T_yy − T_xx)/d] with T_ent = c_d/l (derived; checked against exact numerics)', () => {
		for (const d of [3, 4, 5]) {
			for (const v of [0.3, 0.7]) {
				const b = makeBulk('boosted', { d, zh: 1, v });
				const l = 0.5;
				const G = 0.7;
				const a1 = seriesCoeffs(b, 1)[0].value;
				const dS1 = (a1 * Math.pow(l, 2)) / (4 * G); // ΔA⁽¹⁾ = l^{2−d} a₁ (l/zh)^d
				const T = stressTensor(b, G);
				const rhs = l * (T.tt + (T.yy - T.xx) / d);
				expectRel(`boosted d=${d} v=${v} l=${l}: T_ent ΔS⁽¹⁾ vs l[T_tt+(T_yy−T_xx)/d]`, rhs, (cd(d) / l) * dS1, 1e-12, 'derived');
				// … and ΔS⁽¹⁾ is the small-l limit of the exact ΔS: relative difference O((l/zh)^d)
				const ls = 0.02;
				const exact = deltaArea(b, ls);
				expectRel(
					`boosted d=${d} v=${v} l=${ls}: exact ΔA vs a₁ l²`,
					a1 * ls * ls,
					exact,
					4 * Math.pow(ls, d) * (1 + d * (b.params.kappa as number)),
					'derived; exact numerics'
				);
			}
		}
	});
});

describe('first law, exact', () => {
	it('∂ΔA/∂w, ∂ΔA/∂q by extremality agree with Richardson finite differences of the exact ΔA (derived)', () => {
		const d = 4;
		const l = 0.5;
		const v = 0.5;
		const b = makeBulk('boosted', { d, zh: 1, v });
		const ex = firstLawCoefficients(b, l, 'exact');
		const kappa = b.params.kappa as number;
		const A = (w: number, q: number) =>
			deltaArea(makeBulk('boosted', { d, zh: Math.pow(w, -1 / d), v: Math.sqrt(q / w / (1 + q / w)) }), l);
		const fd = (g: (h: number) => number, h: number) => (4 * (g(h / 2) - g(-h / 2)) - (g(h) - g(-h)) / 2) / (3 * h);
		const Aw = fd((h) => A(1 + h, kappa), 1e-3);
		const Aq = fd((h) => A(1, kappa + h), 1e-3);
		expectRel('boosted d=4 v=0.5 l=0.5 ∂_wΔA', Aw, ex.Aw, 1e-9, 'finite differences, common practice');
		expectRel('boosted d=4 v=0.5 l=0.5 ∂_qΔA', Aq, ex.Aq, 1e-9, 'finite differences, common practice');
	});

	it('α (and ζ) match 25-digit mpmath finite differences in (zh, v) of the exact ΔA (fixture)', () => {
		for (const r of ref.firstlaw) {
			const b = r.bulk === 'brane' ? makeBulk('brane', { d: r.d, zh: r.zh }) : makeBulk('boosted', { d: r.d, zh: r.zh, v: r.v as number });
			const got = firstLawCoefficients(b, r.l, 'exact');
			expectRel(`${r.bulk} d=${r.d} l=${r.l} exact α`, r.alpha, got.alpha, 1e-9, 'mpmath fixture');
			if (r.zeta !== undefined) expectRel(`${r.bulk} d=${r.d} l=${r.l} exact ζ`, r.zeta, got.zeta, 1e-8, 'mpmath fixture');
		}
	});

	it('d = 2: exact T_ent from the BTZ closed form ΔA = 2 ln(sinh x / x), x = l/(2zh) (Calabrese & Cardy 2004; Brown & Henneaux 1986)', () => {
		for (const l of [0.3, 1, 3]) {
			const x = l / 2;
			// α = 4π ∂_zhΔA / ∂_zh(l/zh²) at zh = 1; ∂_zh x = −x
			const dA = 2 * (1 / x - 1 / Math.tanh(x)) * x;
			const alpha = (4 * Math.PI * dA) / (-2 * l);
			expectRel(
				`brane d=2 l=${l} exact α`,
				alpha,
				firstLawCoefficients(makeBulk('brane', { d: 2, zh: 1 }), l, 'exact').alpha,
				1e-10,
				'BTZ closed form'
			);
		}
	});

	it('T_ent → Hawking temperature at large l, approaching like 1/l (ΔS → s l + const; thermodynamic first law, common practice)', () => {
		const b = makeBulk('brane', { d: 3, zh: 1 });
		const TH = 3 / (4 * Math.PI);
		const t = [2, 4, 8].map((l) => tent(b, l, 'exact').value / TH - 1);
		const msg = `T_ent/T_H − 1 at l = 2, 4, 8: ${t}`;
		expect(t[0] > t[1] && t[1] > t[2] && t[2] > 0 && t[2] < 0.15, msg).toBe(true);
		expect(t[2] / t[1] > 0.35 && t[2] / t[1] < 0.55, msg).toBe(true);
	});
});

describe('first law, order n', () => {
	it('order-n α, ζ converge to the exact ones as n grows (derived; exact numerics)', () => {
		const cases: [string, Record<string, number>, number[]][] = [
			['brane', { d: 4, zh: 1 }, [0.3, 0.6]],
			['brane', { d: 3, zh: 1 }, [0.3, 0.6]],
			['boosted', { d: 4, zh: 1, v: 0.5 }, [0.3]],
			['boosted', { d: 4, zh: 1, v: 0.2 }, [0.3, 0.6]],
			['wave', { d: 4, zp: 1 }, [0.3]]
		];
		for (const [name, p, ls] of cases) {
			const b = makeBulk(name, p);
			for (const l of ls) {
				const ex = firstLawCoefficients(b, l, 'exact');
				const err = [2, 4, 8, 12].map((n) => {
					const c = firstLawCoefficients(b, l, n);
					return Math.abs(c.alpha - ex.alpha) + Math.abs(c.zeta - ex.zeta);
				});
				const msg = `${name} ${JSON.stringify(p)} l=${l}: |Δα|+|Δζ| at n=2,4,8,12 = ${err.map((e) => e.toExponential(2))}`;
				expect(err[1] < err[0] && err[2] < err[1] && err[3] <= err[2] * 1.01 && err[3] < 1e-4 * Math.abs(ex.alpha), msg).toBe(true);
			}
		}
	});

	it('order-n residual scales like (l/zh)^{(n+1)d} (fitted slope; derived)', () => {
		const d = 4;
		const l = 1;
		const slopeOf = (n: number, key: 'residual' | 'residualExact', zhs: number[]) => {
			const xs = zhs.map((zh) => Math.log(l / zh));
			const ys = zhs.map((zh) => Math.log(Math.abs(firstLaw(makeBulk('boosted', { d, zh, v: 0.4 }), l, n).scale[key])));
			const mx = xs.reduce((a, b) => a + b) / xs.length;
			const my = ys.reduce((a, b) => a + b) / ys.length;
			return xs.reduce((s, x, i) => s + (x - mx) * (ys[i] - my), 0) / xs.reduce((s, x) => s + (x - mx) ** 2, 0);
		};
		// against order n+1: the variation of the (n+1)-th term, a pure power of 1/zh at fixed l
		for (let n = 1; n <= 4; n++)
			expectAbs(
				`boosted d=4 v=0.4 l=1 o=${n}: slope of log|residual| vs log(l/zh)`,
				(n + 1) * d,
				slopeOf(n, 'residual', [20, 28, 40]),
				1e-6,
				'derived'
			);
		// against the exact ΔS: the same power up to higher orders; l/zh must stay large enough that the
		// residual (relative size (l/zh)^{nd}) is above the ~1e-13 accuracy of the exact numerics
		for (let n = 1; n <= 3; n++)
			expectAbs(
				`boosted d=4 v=0.4 l=1 o=${n}: slope of log|residualExact| vs log(l/zh)`,
				(n + 1) * d,
				slopeOf(n, 'residualExact', [4, 5, 6]),
				0.25,
				'derived; exact numerics'
			);
	});

	it('firstLaw reports δΔS, α δΔE + ζ δΔP_y and a vanishing residual for o=exact; G cancels in α, ζ', () => {
		const b = makeBulk('boosted', { d: 3, zh: 1, v: 0.6 });
		const r1 = firstLaw(b, 0.4, 'exact', 1);
		const r2 = firstLaw(b, 0.4, 'exact', 0.01);
		expectAbs('boosted exact scale residual', 0, r1.scale.residual, 1e-13 * Math.abs(r1.scale.lhs), 'identity');
		expectAbs('boosted exact shape residual', 0, r1.shape!.residual, 1e-13 * Math.abs(r1.shape!.lhs), 'identity');
		expect(r2.alpha).toBe(r1.alpha);
		expectRel('δΔS scales as 1/G', r1.scale.lhs * 100, r2.scale.lhs, 1e-14, 'S = A/4G');
		expect(() => firstLaw(b, 0.4, 13)).toThrow(/order/);
	});

	// the charged law has two parameters (firstlaw-charge.test.ts); along δzh at fixed q it reads
	// 4π ∂_zhΔA = α ∂_zh ê + β ∂_zh(ρ̂ l), which at β → 0 is the old one-parameter form checked here
	it('charged brane: exact α, β reproduce the zh-derivative of ΔA along fixed q (finite differences; derived)', () => {
		const l = 0.6;
		const q = 0.7;
		const d = 4;
		const r = firstLawCoefficients(makeBulk('charged', { d, zh: 1, q }), l, 'exact');
		const A = (zh: number) => deltaArea(makeBulk('charged', { d, zh, q }), l);
		const h = 1e-3;
		const dA = (4 * (A(1 + h / 2) - A(1 - h / 2)) - (A(1 + h) - A(1 - h)) / 2) / (3 * h);
		const de = -d * l * (d - 1) * (1 + q * q);
		// ρ̂ l = l 2(d−1) q/(g_d zh^{d−1}): ∂_zh at zh = 1 is −(d−1) times it
		const g = Math.sqrt((d - 1) / (2 * (d - 2)));
		const dQ = (-(d - 1) * l * 2 * (d - 1) * q) / g;
		expectRel(
			'charged d=4 q=0.7 l=0.6 exact α, β',
			4 * Math.PI * dA,
			r.alpha * de + r.zeta * dQ,
			1e-9,
			'finite differences, common practice'
		);
	});
});
