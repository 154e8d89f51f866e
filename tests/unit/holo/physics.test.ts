import { describe, expect, it } from 'vitest';
import { energy, entropy, HoloError, makeBulk, newtonG, stressTensor, thermo } from '../../../src/lib/holo/index';
import { expectRel } from './check';

describe('thermodynamics and stress tensor', () => {
	it('N = 4 SYM: s = (π²/2) N² T³ with L³/G₅ = 2N²/π (Gubser, Klebanov & Peet, PRD 54 (1996) 3915)', () => {
		for (const [N, zh] of [
			[10, 1],
			[3, 0.37]
		]) {
			const b = makeBulk('brane', { d: 4, zh });
			const t = thermo(b, newtonG({ system: 'sym', N }, 4));
			expectRel(`s N=${N}`, (Math.PI ** 2 / 2) * N * N * t.T ** 3, t.s, 1e-14, 'GKP 1996');
		}
	});
	it('BTZ: S = (c/3) ln… needs G = 3/(2c) (Brown & Henneaux 1986)', () => {
		expectRel('G', 3 / 200, newtonG({ system: 'cft', c: 100 }, 2), 1e-15, 'Brown–Henneaux');
		expect(() => newtonG({ system: 'cft', c: 1 }, 4)).toThrow(HoloError);
		expect(() => newtonG({ system: 'sym', N: 1 }, 3)).toThrow(HoloError);
		expectRel('S', 1, entropy(8, 2), 0, 'S = A/4G');
	});
	it('conformal fluid: traceless, e + p = Ts (static), e + p = Ts + v·T^{ty} (boosted, lab frame) (de Haro–Skenderis–Solodukhin 2001)', () => {
		for (const d of [3, 4, 6]) {
			const G = 0.7;
			const b = makeBulk('brane', { d, zh: 1.3 });
			const s = stressTensor(b, G);
			expectRel(`trace d=${d}`, s.tt, (d - 2) * s.yy + s.xx, 1e-14, 'tracelessness −T_tt + Σ T_ii = 0');
			const t = thermo(b, G);
			expectRel(`e+p=Ts d=${d}`, t.T * t.s, t.e + t.p, 1e-14, 'thermodynamics');
			const v = 0.6;
			const bo = makeBulk('boosted', { d, zh: 1.3, v });
			const so = stressTensor(bo, G);
			const to = thermo(bo, G);
			expectRel(`boosted e+p d=${d}`, to.T * to.s + v * -so.ty, to.e + to.p, 1e-14, 'Gibbs–Duhem for a moving fluid');
			expectRel(`energy density v=0 d=${d}`, (d - 1) / (16 * Math.PI * G * 1.3 ** d), s.tt, 1e-14, 'PHYSICS.md');
			const E = energy(bo, 0.5, G);
			expect(E.P).toBeGreaterThan(0); // ΔP_y > 0 for v > 0 (PHYSICS.md)
			expectRel('ΔP_y', (0.5 * d * v) / (1 - v * v) / (16 * Math.PI * G * 1.3 ** d), E.P, 1e-14, 'PHYSICS.md');
		}
	});
	it('wave = v → 1 limit of the boosted brane at fixed γ²v²/zh^d', () => {
		const d = 4;
		const wave = stressTensor(makeBulk('wave', { d, zp: 1 }), 1);
		const rap = 8;
		const zh = Math.sinh(rap) ** (2 / d); // γ²v²/zh^d = 1
		const bo = stressTensor(makeBulk('boosted', { d, zh, rapidity: rap }), 1);
		expectRel('T_tt', wave.tt, bo.tt, 1e-6, 'limit');
		expectRel('T_ty', wave.ty, bo.ty, 1e-6, 'limit');
	});
});
