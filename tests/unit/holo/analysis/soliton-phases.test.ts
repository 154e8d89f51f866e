import { describe, expect, it } from 'vitest';
import { solitonConnectedArea, solitonPhases, solitonSurface, solitonZstar } from '$lib/holo/analysis';
import { expectRel } from '../check';

// AdS soliton strip (Nishioka & Takayanagi, JHEP 01 (2007) 090; Klebanov, Kutasov &
// Murugan 2008 — from memory): connected below l_c, disconnected above; the entanglement's l-derivative jumps.

describe('soliton phases', () => {
	it('l_c < l_max; ∂A/∂l of the connected surface by Hamilton–Jacobi (√f(z*)/z*^{d−1}) against finite differences (derived)', () => {
		for (const [d, z0] of [
			[4, 1],
			[3, 2],
			[6, 1]
		]) {
			const P = { d, z0 };
			const ph = solitonPhases(P);
			expect(ph.lc).toBeLessThan(ph.lmax);
			expect(ph.zstarC).toBeLessThan(ph.zstarMax);
			const A = (l: number) => solitonConnectedArea(P, solitonZstar(P, l));
			const h = 1e-4 * ph.lc;
			const slope = (8 * (A(ph.lc + h / 2) - A(ph.lc - h / 2)) - (A(ph.lc + h) - A(ph.lc - h))) / (6 * h);
			expectRel(`soliton d=${d} z0=${z0}: jump of ∂A/∂l at l_c`, -slope, ph.jump, 1e-7, 'Richardson differences');
			expect(ph.jump).toBeLessThan(0);
		}
	});

	it('issue case d = 4, l = 0.65: the RT surface is the disconnected one; both are available, each says which it is', () => {
		const P = { d: 4, z0: 1 };
		const { lc, lmax } = solitonPhases(P);
		expect(lc < 0.65 && 0.65 < lmax, `l_c = ${lc}, l_max = ${lmax}`).toBe(true);
		const rt = solitonSurface(P, 0.65);
		expect(rt).toMatchObject({ phase: 'disconnected', minimal: true, zstar: 1 });
		const con = solitonSurface(P, 0.65, 'connected');
		expect(con.phase).toBe('connected');
		expect(con.minimal).toBe(false);
		expect(con.areaFinite).toBeGreaterThan(rt.areaFinite);
		expect(con.zstar).toBe(solitonZstar(P, 0.65));
		expect(solitonSurface(P, 0.5)).toMatchObject({ phase: 'connected', minimal: true });
		expect(() => solitonSurface(P, 1.5 * lmax, 'connected')).toThrow(/l_max/);
		expect(solitonSurface(P, 1.5 * lmax, 'disconnected').minimal).toBe(true);
	});
});
