/**
 * The metric's first law along its scale direction (holo/metric/firstlaw.ts) against the brane's own
 * machinery (holo/firstlaw.ts, checked there against mpmath differences; order 1: Bhattacharya, Nozaki,
 * Takayanagi & Ugajin 2013), and against the charged brane's scale direction.
 */
import { describe, expect, it } from 'vitest';
import { firstLaw, makeBulk, tent } from '../../../../src/lib/holo/index';
import { expectRel } from '../check';

describe('metric first law', () => {
	for (const d of [3, 4, 5]) {
		it(`brane written as a metric, d=${d}: T_ent and the check at orders 1–3 and exact (1e−10)`, () => {
			const brane = makeBulk('brane', { d, zh: 1.3 });
			const metric = makeBulk('metric', { d, f: `1 - (z/zh)^${d}`, zh: 1.3 });
			for (const l of [0.3, 1.1, 3]) {
				for (const o of [1, 2, 3, 'exact'] as const) {
					const tol = o === 'exact' && l > 2 ? 1e-9 : 1e-10;
					expectRel(`tent d=${d} l=${l} o=${o}`, tent(brane, l, o).value, tent(metric, l, o).value, tol, 'the brane (holo/firstlaw.ts)');
					const [a, b] = [firstLaw(brane, l, o, 0.7), firstLaw(metric, l, o, 0.7)];
					expectRel(`firstlaw lhs d=${d} l=${l} o=${o}`, a.scale.lhs, b.scale.lhs, tol, 'the brane');
					expectRel(`firstlaw rhs d=${d} l=${l} o=${o}`, a.scale.rhs, b.scale.rhs, tol, 'the brane');
					if (o !== 'exact') expectRel(`residual d=${d} l=${l} o=${o}`, a.scale.residual, b.scale.residual, 1e-9, 'the brane');
				}
			}
		});
	}

	it('charged brane as a metric: T_ent along the scale direction equals the charged brane at fixed q (exact), and order 1 is BNTU', () => {
		// the charged bulk's δw = w direction at fixed q is the metric's scale direction: same α
		const charged = makeBulk('charged', { d: 4, zh: 1, q: 0.6 });
		const metric = makeBulk('metric', { d: 4, f: '1-(1+q^2)*z^4+q^2*z^6', q: 0.6 });
		const l = 0.8;
		const ex = firstLaw(metric, l, 'exact');
		// α along the scale direction alone: δΔS/δΔE
		const c = firstLaw(charged, l, 'exact');
		expectRel('scale-direction δΔS', c.scale.lhs, ex.scale.lhs, 1e-9, 'the charged brane (holo/firstlaw.ts)');
		// order 1: T_ent = c_d/l for every static state (Bhattacharya et al. 2013), c_4 from PHYSICS.md
		const g = (x: number) => Math.exp(lg(x));
		const cd = (2 * 15 * g(2 / 3) ** 2 * g(5 / 6)) / (Math.sqrt(Math.PI) * g(1 / 6) ** 2 * g(1 / 3));
		expectRel('order-1 T_ent', cd / l, tent(metric, l, 1).value, 1e-12, 'BNTU 2013 via PHYSICS.md c_d');
		expect(ex.conjugate).toBeNull();
	});
});

/** ln Γ by Lanczos (g = 7, n = 9; common practice, ~1e−15) so the check does not use the engine's own Γ. */
function lg(x: number): number {
	const c = [
		0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059, 12.507343278686905,
		-0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7
	];
	x -= 1;
	let a = c[0]!;
	const t = x + 7.5;
	for (let i = 1; i < 9; i++) a += c[i]! / (x + i);
	return 0.5 * Math.log(2 * Math.PI) + (x + 0.5) * Math.log(t) - t + Math.log(a);
}
