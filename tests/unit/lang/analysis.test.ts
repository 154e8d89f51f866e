/**
 * The verbs of the engine's analysis half (tent, mu, firstlaw, mi, resum, balls). holo/analysis.ts says the
 * public index re-exports it; the mock below does exactly that, so these tests hold whether or not the
 * index has caught up. Expected values come from the engine's functions called directly or closed forms.
 */
import { describe, expect, it, vi } from 'vitest';

vi.mock('../../../src/lib/holo/index', async (importOriginal) => ({
	...(await importOriginal<object>()),
	...(await import('../../../src/lib/holo/analysis'))
}));

const holo = await import('../../../src/lib/holo/index');
const A = await import('../../../src/lib/holo/analysis');
const { Pad } = await import('./pad');
type R = import('../../../src/lib/lang/result').Result;
const scalar = (r: R | undefined) => r as import('../../../src/lib/lang/result').ScalarResult;
const record = (r: R | undefined) => r as import('../../../src/lib/lang/result').RecordResult;
const check = (r: R | undefined) => r as import('../../../src/lib/lang/result').CheckResult;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

const brane = holo.makeBulk('brane', { d: 4, zh: 1 });
const boosted = holo.makeBulk('boosted', { d: 4, zh: 1, v: 0.6 });

describe('tent and mu', () => {
	it('tent at order 1 in the brane is c_d/l (Bhattacharya, Nozaki, Takayanagi & Ugajin 2013)', () => {
		const r = scalar(new Pad().run('tent l=0.4 o=1').results[0]);
		expect(rel(r.value, holo.cd(4) / 0.4)).toBeLessThan(1e-9);
		expect(r.order).toBe(1);
	});
	it('tent and mu at order n are the engine values, with the order stated', () => {
		const p = new Pad();
		p.run('use boosted d=4 zh=1 v=0.6');
		const t = scalar(p.run('tent l=0.4 o=3').results[0]);
		expect(t.value).toBe(A.tent(boosted, 0.4, 3).value);
		expect(t.order).toBe(3);
		const m = scalar(p.run('mu l=0.4 o=exact').results[0]);
		expect(m.value).toBe(A.mu(boosted, 0.4, 'exact').value);
		const tab = p.run('tent l=0.4 o=1,2,exact').results[0] as import('../../../src/lib/lang/result').TableResult;
		expect(tab.columns).toEqual(['l', 'o1', 'o2', 'exact']);
	});
	it('tent ball is (d+1)/(2πR) at order 1 (Blanco, Casini, Hung & Myers 2013)', () => {
		const r = scalar(new Pad().run('tent ball R=0.5 o=1').results[0]);
		expect(rel(r.value, 5 / (2 * Math.PI * 0.5))).toBeLessThan(1e-15);
		expect(new Pad().fail('tent ball R=0.5').message).toBe('tent ball is known at order 1: use o=1');
	});
});

describe('firstlaw', () => {
	it('answers a check whose sides are the engine first law at order n', () => {
		const p = new Pad();
		p.run('use boosted d=4 zh=1 v=0.6');
		const c = check(p.run('firstlaw l=0.4 o=3').results[0]);
		const e = A.firstLaw(boosted, 0.4, 3, 1);
		expect(c).toMatchObject({ kind: 'check', lhs: e.scale.lhs, rhs: e.scale.rhs, residual: e.scale.residual, order: 3 });
		expect(c.tolerance).toBe(1e-3 * Math.abs(e.scale.lhs));
		expect(p.steps[1]!.ref.fields.tent).toBe(e.tent);
	});
	it('the first law holds exactly for the exact ΔS', () => {
		const c = check(new Pad().run('firstlaw l=0.3 o=exact').results[0]);
		expect(c.pass).toBe(true);
	});
});

describe('mi', () => {
	it('in d=2 vacuum the critical gap is (√2 − 1) l (Headrick 2010)', () => {
		const r = record(new Pad().run('use vacuum d=2; mi pair l=1 gap=0.3').results[1]);
		expect(Object.keys(r.fields)).toEqual(['I', 'gap_crit']);
		expect(Math.abs(r.fields.gap_crit! - (Math.SQRT2 - 1))).toBeLessThan(1e-9);
		// I = 2S(l) − S(2l+s) − S(s) with S = (c/3) ln ℓ, c = 3/(2G): I = (1/(2G)) ln(l²/((2l+s)s))
		expect(rel(r.fields.I!, 0.5 * Math.log(1 / (2.3 * 0.3)))).toBeLessThan(1e-9);
		const z = record(new Pad().run('use vacuum d=2; mi pair l=1 gap=0.5').results[1]);
		expect(z.fields.I).toBe(0);
	});
});

describe('resum', () => {
	it('gives the Padé value with the plain series and the exact value beside it', () => {
		const r = scalar(new Pad().run('resum l=0.8 o=6').results[0]);
		const e = A.resum(brane, 0.8, 6);
		expect(r.value).toBe(e.value);
		expect(r.order).toBe(6);
		expect(r.fields).toMatchObject({ l: 0.8, series: e.series, exact: e.exact });
		expect(new Pad().fail('resum l=0.8').message).toBe('resum needs a whole order, e.g. o=4');
	});
});

describe('balls', () => {
	it('darea ball: exact from the engine, order 1 = Ω_{d−2} R^d/(2(d+1) zh^d)', () => {
		const p = new Pad();
		const ex = scalar(p.run('darea ball R=0.5').results[0]);
		expect(ex.value).toBe(A.ballDeltaArea(4, 0.5, 1).value);
		const o1 = scalar(p.run('darea ball R=0.5 o=1').results[0]);
		const omega2 = 4 * Math.PI; // area of the unit 2-sphere
		expect(rel(o1.value, (omega2 * 0.5 ** 4) / (2 * 5))).toBeLessThan(1e-14);
		expect(p.fail('darea ball R=0.5 o=2').message).toBe('the ball series is known to order 1: use o=1 or o=exact');
		expect(p.fail('use boosted v=0.3; darea ball R=0.5').message).toBe('darea ball needs the brane or vacuum bulk');
	});
	it('energy ball is the energy density times the ball volume', () => {
		const r = record(new Pad().run('energy ball R=0.5').results[0]);
		expect(r.fields.E).toBe(A.ballEnergy(4, 0.5, 1, 1));
	});
});

describe('firstlaw ball', () => {
	it('sets the exact ΔS against ΔE/T with T = (d+1)/(2πR) (Blanco, Casini, Hung & Myers 2013)', () => {
		const c = check(new Pad().run('firstlaw ball R=0.2').results[0]);
		expect(c.kind).toBe('check');
		// ΔE/T equals the first-order ΔS = Ω_{d−2}R^d/(2(d+1)zh^d)/(4G) (Blanco et al. 2013), G = 1 here
		expect(rel(c.rhs, A.ballDeltaAreaFirstOrder(4, 0.2, 1) / 4)).toBeLessThan(1e-12);
		expect(rel(c.lhs, A.ballDeltaArea(4, 0.2, 1).value / 4)).toBeLessThan(1e-12);
		expect(c.pass).toBe(true);
	});
	it('has a residual that grows like (R/zh)^{2d}, the second order (derived; checked against exact numerics)', () => {
		const p = new Pad();
		const res = [0.1, 0.2].map((R) => Math.abs(check(p.run(`firstlaw ball R=${R} d=3`).results[0]).residual));
		const slope = Math.log(res[1] / res[0]) / Math.log(2);
		expect(Math.abs(slope - 6)).toBeLessThan(0.1);
	});
	it('needs a horizon', () => {
		expect(new Pad().fail('use vacuum d=4; firstlaw ball R=0.3').message).toMatch(/horizon/);
	});
});
