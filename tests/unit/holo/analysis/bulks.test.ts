import { describe, it, expect } from 'vitest';
import { makeBulk, deltaArea } from '$lib/holo/index';
import {
	solitonCriticalWidth,
	solitonArea,
	solitonConnectedArea,
	solitonDisconnectedArea,
	solitonZstar,
	solitonWidth,
	dpStrip,
	makeDpBulk
} from '$lib/holo/analysis';
import { integrateOde } from '$lib/holo/numeric/ode';
import { expectRel, expectAbs } from '../check';
import ref from '../../../fixtures/holo/analysis/reference.json';

describe('AdS soliton', () => {
	it('critical width by equal areas matches an independent mpmath evaluation of both branches (fixture; Nishioka & Takayanagi 2007 setup, from memory)', () => {
		for (const r of ref.soliton) {
			const P = { d: r.d, z0: r.z0 };
			const c = solitonCriticalWidth(P);
			expectRel(`soliton d=${r.d} l_c`, r.lc, c.lc, 1e-9, 'mpmath fixture');
			expectRel(`soliton d=${r.d} z*_c`, r.zstarC, c.zstar, 1e-9, 'mpmath fixture');
			expect(c.lc < c.lmax).toBe(true);
			// both branches evaluated independently at l_c: connected (solved for z* from l) = disconnected
			const con = solitonConnectedArea(P, solitonZstar(P, c.lc));
			expectRel(`soliton d=${r.d} areas at l_c`, solitonDisconnectedArea(P), con, 1e-9, 'equal areas');
		}
	});

	it('phases: connected below l_c, disconnected above; dA/dl = √H(z*) on the connected branch (Hamilton–Jacobi, common practice)', () => {
		const P = { d: 4, z0: 1 };
		const { lc } = solitonCriticalWidth(P);
		expect(solitonArea(P, 0.9 * lc).phase).toBe('connected');
		expect(solitonArea(P, 1.1 * lc).phase).toBe('disconnected');
		const l = 0.4;
		const zs = solitonZstar(P, l);
		expectRel('soliton width round trip', l, solitonWidth(P, zs), 1e-12, 'identity');
		const h = 1e-4;
		const dAdl = (solitonArea(P, l + h).areaFinite - solitonArea(P, l - h).areaFinite) / (2 * h);
		expectRel('soliton dA/dl', Math.sqrt(1 - zs ** 4) / zs ** 3, dAdl, 1e-6, 'HJ relation');
	});
});

describe('black Dp-brane', () => {
	it('z*, A_fin and ΔA against 25-digit mpmath (fixture)', () => {
		for (const r of ref.dp) {
			const s = dpStrip({ p: r.p, zh: r.zh }, r.l);
			expectRel(`dp p=${r.p} l=${r.l} z*`, r.zstar, s.zstar, 1e-10, 'mpmath fixture');
			expectRel(`dp p=${r.p} l=${r.l} A_fin`, r.areaFinite, s.areaFinite, 1e-10, 'mpmath fixture');
			expectRel(`dp p=${r.p} l=${r.l} ΔA`, r.deltaArea, s.deltaArea, 1e-9, 'mpmath fixture');
		}
	});

	it('p = 3 is the d = 4 brane (IMSY: the D3 near-horizon limit is AdS₅ × S⁵)', () => {
		for (const l of [0.3, 1.5])
			expectRel(
				`dp p=3 l=${l} ΔA vs brane d=4`,
				deltaArea(makeBulk('brane', { d: 4, zh: 1 }), l),
				dpStrip({ p: 3, zh: 1 }, l).deltaArea,
				1e-12,
				'IMSY 1998'
			);
	});

	it('large l: dA_fin/dl → zh^{−a} (entropy density, PHYSICS.md large-l check) and T = ν/(4π zh)', () => {
		for (const p of [1, 2, 4]) {
			const b = makeDpBulk({ p, zh: 1 });
			const slope = dpStrip({ p, zh: 1 }, 9).areaFinite - dpStrip({ p, zh: 1 }, 8).areaFinite;
			expectRel(`dp p=${p} slope at large l`, 1, slope, 1e-3, 'horizon area density');
			expectRel(`dp p=${p} T`, (2 * (7 - p)) / (5 - p) / (4 * Math.PI), b.thermo!(1).T, 1e-15, 'IMSY 1998 (from memory)');
		}
		expect(() => makeDpBulk({ p: 5 })).toThrow(/p = 1, 2, 3 or 4/);
	});
});

describe('Dormand–Prince', () => {
	it('harmonic oscillator over 10 periods and an event located to 1e-12 (closed form)', () => {
		const r = integrateOde((_t, y) => Float64Array.of(y[1], -y[0]), 0, [1, 0], 20 * Math.PI, { rtol: 1e-12, atol: 1e-14 });
		expectAbs('cos(20π)', 1, r.y[0], 1e-9, 'closed form');
		const e = integrateOde((_t, y) => Float64Array.of(y[1], -y[0]), 0, [1, 0], 10, { rtol: 1e-12, event: (_t, y) => y[0] });
		expect(e.event).toBe(true);
		expectAbs('first zero of cos', Math.PI / 2, e.t, 1e-11, 'closed form');
	});
});
