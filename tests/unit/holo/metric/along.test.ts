/**
 * A metric's first law along its named parameters (holo/metric/along.ts) against the charged brane's own
 * two-parameter machinery (holo/firstlaw.ts, checked there against 25-digit mpmath differences; order 1:
 * Bhattacharya, Nozaki, Takayanagi & Ugajin 2013). The charged brane written as f = 1 − m z^d + q² z^{2(d−1)},
 * m = (1+q_c²)/zh^d, q = q_c/zh^{d−1}: the same states, with q ∝ the charge density, so T_ent is the same and
 * μ_q = μ_Q·2(d−1)/g_d (derived in along.ts); the charged scale direction (δ ln zh = −1/d at fixed q_c) is
 * δm = m, δq = q(d−1)/d in the metric's labels, and the charged δq_c at fixed zh is δm = 2q_c/zh^d, δq = 1/zh^{d−1}.
 */
import { describe, expect, it } from 'vitest';
import { firstLaw, makeBulk, mu, tent } from '../../../../src/lib/holo/index';
import { expectHoloError, expectRel } from '../check';

function chargedAsMetric(d: number, zh: number, qc: number) {
	const m = (1 + qc * qc) / Math.pow(zh, d);
	const q = qc / Math.pow(zh, d - 1);
	return { m, q, bulk: makeBulk('metric', { d, f: `1 - m*z^${d} + q^2*z^${2 * (d - 1)}`, m, q }) };
}

describe('metric first law along named parameters', () => {
	for (const d of [3, 4]) {
		it(`charged brane d=${d} as a metric, along=m,q: T_ent, μ and both directions of the check at o=1..3 (1e−10)`, () => {
			const zh = 1.2;
			const qc = 0.55;
			const charged = makeBulk('charged', { d, zh, q: qc });
			const { m, q, bulk } = chargedAsMetric(d, zh, qc);
			const gd = Math.sqrt((d - 1) / (2 * (d - 2)));
			for (const l of [0.3, 0.8]) {
				for (const o of [1, 2, 3] as const) {
					const src = 'the charged brane (holo/firstlaw.ts)';
					expectRel(`tent d=${d} l=${l} o=${o}`, tent(charged, l, o).value, tent(bulk, l, o, ['m', 'q']).value, 1e-10, src);
					const muQ = mu(charged, l, o).value;
					const muq = mu(bulk, l, o, undefined, ['m', 'q']);
					expect(muq.param).toBe('q');
					if (o > 1) expectRel(`μ d=${d} l=${l} o=${o}`, muQ * ((2 * (d - 1)) / gd), muq.value, 1e-10, src);
					else expect(Math.abs(muq.value)).toBeLessThan(1e-12); // order 1: ΔA ∝ ΔE, β = 0 (BNTU)
					const a = firstLaw(charged, l, o, 0.7);
					const b = firstLaw(bulk, l, o, 0.7, ['m', 'q']);
					const [dm, dq] = b.directions!;
					// the charged scale direction in the metric's labels
					const comb = (x: 'lhs' | 'rhs' | 'residual', wm: number, wq: number) => wm * dm![x] + wq * dq![x];
					for (const x of ['lhs', 'rhs', 'residual'] as const) {
						expectRel(`scale ${x} d=${d} l=${l} o=${o}`, a.scale[x], comb(x, m, (q * (d - 1)) / d), 1e-10, src);
						expectRel(`δq ${x} d=${d} l=${l} o=${o}`, a.shape![x], comb(x, (2 * qc) / Math.pow(zh, d), 1 / Math.pow(zh, d - 1)), 1e-9, src);
					}
				}
			}
		});
	}

	it('o=exact along=m,q: the relation holds to rounding and T_ent equals the charged brane’s exact one', () => {
		const charged = makeBulk('charged', { d: 4, zh: 1, q: 0.4 });
		const { bulk } = chargedAsMetric(4, 1, 0.4);
		for (const l of [0.5, 2]) {
			expectRel(`exact tent l=${l}`, tent(charged, l, 'exact').value, tent(bulk, l, 'exact', ['m', 'q']).value, 1e-9, 'the charged brane');
			const c = firstLaw(bulk, l, 'exact', 1, ['m', 'q']);
			for (const dir of c.directions!) expect(Math.abs(dir.residual)).toBeLessThan(1e-12 * Math.abs(dir.lhs) + 1e-15);
		}
		// the series' residual against the exact gradient shrinks with the order
		const r = [1, 2, 3].map((o) => Math.abs(firstLaw(bulk, 0.5, o, 1, ['m', 'q']).directions![1]!.residualExact));
		expect(r[2]!).toBeLessThan(r[0]!);
	});

	it('a non-polynomial metric: derivatives by differences of the Taylor numbers agree with the exact ones of the same family', () => {
		// order 2 keeps K ≤ 8, so z^4 exp(−a z²) enters only through its Taylor terms up to z^8: the same family as
		// its polynomial truncation, whose derivatives are exact
		const exp = makeBulk('metric', { d: 4, f: '1 - c*z^4*exp(-a*z^2)', a: 0.3, c: 1.1 });
		const poly = makeBulk('metric', { d: 4, f: '1 - c*z^4*(1 - a*z^2 + a^2*z^4/2)', a: 0.3, c: 1.1 });
		for (const o of [1, 2]) {
			const [x, y] = [tent(exp, 0.4, o, ['c', 'a']).value, tent(poly, 0.4, o, ['c', 'a']).value];
			expectRel(`tent o=${o}`, y, x, 1e-10, 'the same family written as a polynomial (exact derivatives)');
			const [u, v] = [mu(exp, 0.4, o, undefined, ['c', 'a']).value, mu(poly, 0.4, o, undefined, ['c', 'a']).value];
			if (o > 1) expectRel(`mu o=${o}`, v, u, 1e-9, 'as above');
		}
	});

	it('errors name along and the parameter at fault', () => {
		const { bulk } = chargedAsMetric(4, 1, 0.5);
		const e1 = expectHoloError(() => tent(bulk, 0.5, 2, ['m', 'r']));
		expect(e1.key).toBe('along');
		expect(e1.message).toContain("'r'");
		expect(e1.hint).toContain('m, q');
		const e2 = expectHoloError(() => tent(bulk, 0.5, 2, ['q', 'm']));
		expect(e2.key).toBe('along');
		expect(e2.message).toContain('does not move the energy');
		const e3 = expectHoloError(() => tent(makeBulk('brane', { d: 4, zh: 1 }), 0.5, 2, ['zh']));
		expect(e3.key).toBe('along');
		const e4 = expectHoloError(() => tent(makeBulk('metric', { d: 4, f: '1 - m*z^4*exp(-z)', m: 1 }), 0.5, 'exact', ['m']));
		expect(e4.key).toBe('o');
	});
});
