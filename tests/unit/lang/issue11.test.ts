/**
 * Issue 11 in the language: every derived number says what it is (scheme, phase, conjugate, approximant) and
 * how far to trust it (error estimate, radius uncertainty). Values are the engine's, called directly.
 */
import { describe, expect, it, vi } from 'vitest';

vi.mock('../../../src/lib/holo/index', async (importOriginal) => ({
	...(await importOriginal<object>()),
	...(await import('../../../src/lib/holo/analysis'))
}));

const holo = await import('../../../src/lib/holo/index');
const A = await import('../../../src/lib/holo/analysis');
const { Pad } = await import('./pad');
const { complete } = await import('../../../src/lib/lang/complete');
const { help } = await import('../../../src/lib/lang/help');
type R = import('../../../src/lib/lang/result').Result;
type S = import('../../../src/lib/lang/result').ScalarResult;
type Rec = import('../../../src/lib/lang/result').RecordResult;
type T = import('../../../src/lib/lang/result').TableResult;
type C = import('../../../src/lib/lang/result').CheckResult;
const first = <X>(r: R[]) => r[0] as X;

describe('entropy is the finite part (item 6)', () => {
	it('label S_fin, and the note names the subtracted term and the scheme (PHYSICS.md, "Strip")', () => {
		const r = first<S>(new Pad().run('entropy l=0.4').results);
		expect(r.label).toMatch(/^S_fin\(l=0\.4\)/);
		expect(r.note).toMatch(/2\/\(2 ε\^2\) per unit transverse volume is subtracted/);
		expect(r.note).toMatch(/minimal subtraction/);
		const d2 = first<S>(new Pad().run('entropy l=0.4 d=2').results);
		expect(d2.note).toMatch(/2 ln\(1\/ε\)/);
		expect(help('entropy')!.summary).toMatch(/finite part S_fin/);
	});
});

describe('mu names its chemical potential (items 1, 7)', () => {
	it('charged: μ_Q by default and with of=charge; of=momentum is refused at the key', () => {
		const p = new Pad();
		p.run('use charged d=4 q=1');
		const m = first<S>(p.run('mu l=0.5').results);
		const c = holo.makeBulk('charged', { d: 4, zh: 1, q: 1 });
		expect(m.value).toBe(A.mu(c, 0.5, 'exact').value);
		expect(m.label).toMatch(/^μ_Q \(conjugate to ΔQ\)/);
		expect(m.note).toMatch(/μ_Q → μ/);
		expect(first<S>(p.run('mu l=0.5 of=charge').results).value).toBe(m.value);
		expect(first<S>(p.run('mu l=0.5 of="charge"').results).value).toBe(m.value);
		const e = p.fail('mu l=0.5 of=momentum');
		expect(e.message).toMatch(/no momentum/);
		expect('mu l=0.5 of=momentum'.slice(e.start, e.end)).toBe('momentum');
		expect(p.fail('mu l=0.5 of=spin').message).toMatch(/of must be one of charge, momentum/);
		expect(first<T>(p.run('mu l=0.5,1').results).label).toMatch(/^μ_Q vs l/);
	});
	it('boosted: conjugate to ΔP_y; the note says the small-l sign is a convention and the large-l limit μ → v, T_ent → T/γ', () => {
		const p = new Pad();
		p.run('use boosted d=4 v=0.6');
		const m = first<S>(p.run('mu l=0.3').results);
		expect(m.label).toMatch(/^μ \(conjugate to ΔP_y\)/);
		expect(m.note).toMatch(/convention/);
		expect(m.note).toMatch(/μ → v, T_ent → T\/γ/);
		expect(first<S>(p.run('tent l=0.3').results).note).toMatch(/T_ent → T\/γ/);
		expect(p.fail('mu l=0.3 of=charge').message).toMatch(/no charge/);
	});
	it('firstlaw in a charged bulk checks T_ent δΔS = δΔE − μ_Q δΔQ in both directions and passes', () => {
		const p = new Pad();
		p.run('use charged d=4 q=1');
		const c = first<C>(p.run('firstlaw l=0.3 o=3').results);
		expect(c.label).toMatch(/T_ent δΔS = δΔE − μ_Q δΔQ/);
		expect(c.pass).toBe(true);
		expect(p.steps[1]!.ref.fields).toHaveProperty('residual_q');
		const ex = first<C>(p.run('firstlaw l=0.3').results);
		expect(ex.pass).toBe(true);
	});
	it('thermo and energy of the charged brane give μ, ρ and Q, with e + p = T s + μ ρ', () => {
		const p = new Pad();
		p.run('use charged d=4 q=1');
		const t = first<Rec>(p.run('thermo').results);
		const f = t.fields as Record<string, number>;
		expect(Math.abs(f.e + f.p - f.T * f.s - f.mu * f.rho)).toBeLessThan(1e-14);
		expect(t.note).toMatch(/normalisation/);
		const e = first<Rec>(p.run('energy l=0.5').results);
		expect(e.fields.Q).toBeCloseTo(f.rho * 0.5, 14);
	});
});

describe('charged at d = 2 (item 4)', () => {
	it('refuses q with an error pointing at q', () => {
		const line = 'use charged d=2 q=0.5';
		const e = new Pad().fail(line);
		expect(e.message).toMatch(/d ≥ 3 for q ≠ 0/);
		expect(line.slice(e.start, e.end)).toBe('0.5');
		expect(new Pad().run('use charged d=2 q=0; thermo').results.length).toBeGreaterThan(0);
	});
});

describe('resum shows its error estimate (item 2)', () => {
	it('label carries [L/M] ± error, fields carry error; the issue cases warn', () => {
		const r = first<S>(new Pad().run('resum l=0.8 o=6').results);
		const e = A.resum(holo.makeBulk('brane', { d: 4, zh: 1 }), 0.8, 6);
		expect(r.fields!.error).toBe(e.error);
		expect(r.label).toMatch(/^ΔA \(Padé\) \[3\/2\] ± \d/);
		expect(first<S>(new Pad().run('resum l=3 o=12').results).warning).toMatch(/unphysical/);
		expect(first<S>(new Pad().run('resum l=2 o=6').results).warning).toMatch(/no value/);
		expect(first<S>(new Pad().run('use brane d=3; resum l=5 o=12').results.slice(1)).warning).toMatch(/no value/);
	});
	it('a resum table has an error column per order', () => {
		const t = first<T>(new Pad().run('resum l=0.4,0.8 o=6,8').results);
		expect(t.columns).toEqual(['l', 'o6', 'o6_err', 'o8', 'o8_err']);
		expect(t.rows.every((r) => typeof r[2] === 'number' && typeof r[4] === 'number')).toBe(true);
	});
});

describe('validity shows the radius uncertainty (item 3)', () => {
	it('radius_err beside radius, below 1e-3 relative', () => {
		const r = first<Rec>(new Pad().run('validity o=4').results);
		expect(r.fields.radius_err! / r.fields.radius!).toBeLessThan(1e-3);
		expect(r.fields.radius_err).toBeGreaterThan(0);
	});
});

describe('soliton answers say their phase; phases verb (item 5)', () => {
	it('zstar l=0.65 in d = 4: the RT surface is disconnected by default; phase=connected gives the other one', () => {
		const p = new Pad();
		p.run('use soliton d=4');
		const P = { d: 4, z0: 1 };
		const rt = first<S>(p.run('zstar l=0.65').results);
		expect(rt.label).toMatch(/\[disconnected, the RT surface\]/);
		expect(rt.value).toBe(1);
		expect(rt.fields!.connected).toBe(0);
		const con = first<S>(p.run('zstar l=0.65 phase=connected').results);
		expect(con.value).toBe(A.solitonZstar(P, 0.65));
		expect(con.label).toMatch(/\[connected, not minimal\]/);
		const area = first<S>(p.run('area l=0.5').results);
		expect(area.label).toMatch(/\[connected, the RT surface\]/);
		expect(area.note).toMatch(/l_c = /);
		expect(first<S>(p.run('entropy l=0.65 phase=disconnected').results).value).toBe(A.solitonDisconnectedArea(P) / 4);
	});
	it('width and mi in the soliton say which surface they are about', () => {
		const p = new Pad();
		p.run('use soliton d=4');
		expect(first<S>(p.run('width zstar=0.3').results).label).toMatch(/\[connected surface\]/);
		expect(first<Rec>(p.run('mi pair l=0.3 gap=0.1').results).note).toMatch(/RT \(minimal\)/);
	});
	it('phases gives l_c, l_max and the jump of ∂A/∂l (engine values)', () => {
		const p = new Pad();
		p.run('use soliton d=4');
		const r = first<Rec>(p.run('phases').results);
		const ph = A.solitonPhases({ d: 4, z0: 1 });
		expect(r.fields).toEqual({ l_c: ph.lc, l_max: ph.lmax, zstar_c: ph.zstarC, zstar_max: ph.zstarMax, dA_dl_jump: ph.jump });
		expect(new Pad().fail('phases').message).toMatch(/phases is for the soliton/);
	});
	it('a soliton sweep marks each row connected or not', () => {
		const t = first<T>(new Pad().run('use soliton d=4; zstar l=0.5,0.65').results.slice(1));
		expect(t.columns.at(-1)).toBe('connected');
		expect(t.rows.map((r) => r.at(-1))).toEqual([1, 0]);
	});
	it('phase=disconnected outside the soliton is refused; phases is in completion and help', () => {
		expect(new Pad().fail('zstar l=0.5 phase=disconnected').message).toMatch(/phase=disconnected is for the soliton/);
		expect(complete('pha').items.map((i) => i.insert)).toContain('phases');
		expect(help('phases')!.example).toBe('use soliton d=4; phases');
		expect(complete('zstar l=0.5 ', undefined, { bulk: 'soliton' }).items.map((i) => i.insert)).toContain('phase=');
		expect(complete('zstar l=0.5 ').items.map((i) => i.insert)).not.toContain('phase=');
		expect(complete('mu l=0.5 ').items.map((i) => i.insert)).toContain('of=');
		expect(complete('mu l=0.5 of=c').items.map((i) => i.insert)).toEqual(['charge']);
		expect(complete('zstar l=0.5 phase=').items.map((i) => i.insert)).toEqual(['rt', 'connected', 'disconnected']);
	});
});
