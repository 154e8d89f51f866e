/**
 * The custom metric (src/lib/holo/metric/, bulks/metric.ts) against the named bulks it can be written as: the
 * brane, the charged brane and the wave (PHYSICS.md; their own routines are checked against 30-digit mpmath
 * fixtures in strip.test.ts and series*.test.ts), the Fefferman–Graham stress tensor (de Haro, Skenderis &
 * Solodukhin 2001), and the errors that name the term at fault.
 */
import katex from 'katex';
import { describe, expect, it } from 'vitest';
import { deltaArea, makeBulk } from '../../../../src/lib/holo/index';
import { metricModelOf } from '../../../../src/lib/holo/bulks/metric';
import { evaluateCoeff, metricCoeffsNumeric, metricCoeffsSymbolic } from '../../../../src/lib/holo/metric/coeffs';
import { fgStress } from '../../../../src/lib/holo/metric/fg';
import { readMetric } from '../../../../src/lib/holo/metric/model';
import { seriesPowers, seriesValues } from '../../../../src/lib/holo/series/index';
import { expectAbs, expectHoloError, expectRel } from '../check';

describe('metric written as a named bulk reproduces it', () => {
	it('brane: exact ΔA to 1e−10 at every width the brane reaches, near the horizon included', () => {
		for (const d of [3, 4, 6]) {
			const brane = makeBulk('brane', { d, zh: 1.7 });
			const metric = makeBulk('metric', { d, f: `1 - (z/zh)^${d}`, zh: 1.7 });
			expect(metric.horizon).toBeCloseTo(1.7, 14);
			for (const l of [0.3, 2, 4 * 1.7, 5 * 1.7, 6 * 1.7]) {
				expectRel(`brane d=${d} l=${l}`, deltaArea(brane, l), deltaArea(metric, l), 1e-10, 'the brane bulk (mpmath fixtures)');
			}
		}
	});

	it('brane, charged, wave: series coefficients to 1e−12, same powers', () => {
		for (const d of [3, 4, 5]) {
			const pairs = [
				[makeBulk('brane', { d, zh: 1 }), makeBulk('metric', { d, f: `1 - z^${d}` })],
				[makeBulk('wave', { d, zp: 1.2 }), makeBulk('metric', { d, f: '1', h: `1 + (z/zp)^${d}`, zp: 1.2 })],
				[
					makeBulk('charged', { d, zh: 1.3, q: 0.5 }),
					makeBulk('metric', { d, f: `1 - (1+q^2)*(z/zh)^${d} + q^2*(z/zh)^${2 * (d - 1)}`, zh: 1.3, q: 0.5 })
				]
			];
			for (const [named, metric] of pairs) {
				const n = 5;
				const a = seriesValues(named!, n);
				const b = seriesValues(metric!, n);
				// the wave has no horizon: the metric's series is then in l itself, the wave's in l/zp
				const unit = named!.name === 'wave' ? 1.2 : 1;
				const pa = seriesPowers(named!, n);
				const pb = seriesPowers(metric!, n);
				expect(pb, `${named!.name} d=${d} powers`).toEqual(pa);
				a.forEach((x, i) =>
					expectRel(`${named!.name} d=${d} K=${pa[i]}`, x, b[i]! * Math.pow(unit, pa[i]!), 1e-12, `the ${named!.name} bulk's series`)
				);
			}
		}
	});

	it('charged: exact ΔA, T, s, and the FG stress tensor (traceless) equal the charged bulk', () => {
		const charged = makeBulk('charged', { d: 4, zh: 1.3, q: 0.5 });
		const metric = makeBulk('metric', { d: 4, f: '1-(1+q^2)*(z/zh)^4+q^2*(z/zh)^6', zh: 1.3, q: 0.5 });
		for (const l of [0.5, 2, 5, 8]) expectRel(`charged l=${l}`, deltaArea(charged, l), deltaArea(metric, l), 1e-10, 'the charged bulk');
		const [a, b] = [charged.thermo!(0.7), metric.thermo!(0.7)];
		for (const k of ['T', 's', 'e', 'p'] as const) expectRel(`thermo ${k}`, a[k], b[k], 1e-12, 'the charged bulk (PHYSICS.md)');
		const [s, t] = [charged.stress!(0.7), metric.stress!(0.7)];
		for (const k of ['tt', 'xx', 'yy'] as const) expectRel(`stress ${k}`, s[k], t[k], 1e-12, 'the charged bulk (de Haro et al. 2001)');
		expectAbs('trace', 0, -t.tt + 2 * t.xx + t.yy, 1e-15, 'conformal Ward identity');
	});
});

describe('symbolic parameters', () => {
	const sym = readMetric({ d: 4, f: '1 - m*z^4 + q^2*z^6', values: {} });

	it('finds the free names and gives coefficients as polynomials in them', () => {
		expect(sym.symbols).toEqual(['m', 'q']);
		const { coeffs, vars } = metricCoeffsSymbolic(sym, 3);
		expect(vars).toEqual(['m', 'q']);
		// the first term is linear in m alone (the brane's a₁ times m); z^6 first enters with (l)^6
		expect(coeffs[0]!.power).toBe(4);
		expect([...coeffs[0]!.poly.keys()]).toEqual(['1,0']);
		expect(coeffs.map((c) => c.power)).toEqual([4, 6, 8, 10, 12]);
	});

	it('at numbers equal the numeric series to 1e−12 (derived: the same sums over a different ring)', () => {
		const { coeffs, vars } = metricCoeffsSymbolic(sym, 4);
		for (const [m, q] of [
			[1, 0.3],
			[1.7, 0.9],
			[0.4, 1.1]
		]) {
			const num = readMetric({ d: 4, f: '1 - m*z^4 + q^2*z^6', values: { m: m!, q: q! } });
			const { powers, values } = metricCoeffsNumeric(num, 4);
			expect(coeffs.map((c) => c.power)).toEqual(powers);
			coeffs.forEach((c, i) =>
				expectRel(`m=${m} q=${q} K=${c.power}`, values[i]!, evaluateCoeff(c, vars, { m: m!, q: q! }), 1e-12, 'numeric series')
			);
		}
	});

	it('LaTeX compiles in KaTeX', () => {
		for (const c of metricCoeffsSymbolic(sym, 3).coeffs) expect(() => katex.renderToString(c.latex, { throwOnError: true })).not.toThrow();
		const fg = fgStress(readMetric({ d: 4, f: '1 - m*z^4 + q^2*z^6', values: {}, symbols: [] }));
		expect(fg.kind).toBe('stress');
		if (fg.kind === 'stress') {
			const tex = fg.latex!();
			expect(tex.tt).toContain('m');
			for (const s of Object.values(tex)) expect(() => katex.renderToString(s, { throwOnError: true })).not.toThrow();
		}
	});

	it('a symbolic bulk answers structure, and numbers only with values', () => {
		const bulk = makeBulk('metric', { d: 4, f: '1 - m*z^4' });
		expect(bulk.params.params).toBe('m');
		expect(expectHoloError(() => bulk.slice.f(0.1)).message).toContain('m is symbolic');
		expect(metricModelOf(bulk)!.model.symbols).toEqual(['m']);
	});
});

describe('stress tensor, horizon and errors', () => {
	it('a z² term is a deformation: no stress tensor, and the series refuses the log divergence (d = 4)', () => {
		const bulk = makeBulk('metric', { d: 4, f: '1 - z^2 - z^4' });
		expect(expectHoloError(() => bulk.stress!(1)).message).toMatch(/not a normalisable deformation: f has a z\^2 term/);
		expect(expectHoloError(() => seriesValues(bulk, 2)).message).toMatch(/log divergence/);
	});

	it('the wave as a static metric: T_yy = d/(16πG zp^d) (PHYSICS.md), T = 0, horizonless', () => {
		const bulk = makeBulk('metric', { d: 4, f: '1', h: '1 + (z/zp)^4', zp: 1.1 });
		expectRel('T_yy', 4 / (16 * Math.PI * Math.pow(1.1, 4)), bulk.stress!(1).yy, 1e-13, 'PHYSICS.md wave');
		expect(bulk.thermo!(1).T).toBe(0);
		expect(bulk.horizon).toBeUndefined();
	});

	it('extremal horizon: T = 0; g not vanishing with f or a zero that is not simple: no temperature, naming the function', () => {
		const ext = makeBulk('metric', { d: 4, f: '(1 - z^4)^2' });
		expect(ext.thermo!(1).T).toBe(0);
		const bad = makeBulk('metric', { d: 4, f: '1 - z^4', g: '1 - z^4/2' });
		// the strip still ends at f's zero
		expect(bad.slice.zmax).toBeCloseTo(1, 12);
		const e = expectHoloError(() => bad.thermo!(1));
		expect(e.key).toBe('g');
		expect(e.message).toMatch(/g does not vanish at f's zero/);
		const root = makeBulk('metric', { d: 4, f: 'sqrt(1 - z^4)' });
		expect(expectHoloError(() => root.thermo!(1)).message).toMatch(/^f's zero at zh=1\.00000000000 is not simple/);
	});

	it('names the term at fault', () => {
		const e1 = expectHoloError(() => makeBulk('metric', { d: 4, f: '2 - z^4' }));
		expect([e1.key, e1.message]).toEqual(['f', 'f(0) must be 1 (got 2)']);
		const e2 = expectHoloError(() => makeBulk('metric', { d: 4, f: '1 - z^4', h: '1 + z^4*log(z)' }));
		expect(e2.message).toContain('log(z)');
		const e3 = expectHoloError(() => makeBulk('metric', { d: 4, f: '1 - sqrt(z)^8' }));
		expect(e3.message).toContain('sqrt(z)');
	});

	it('a non-rational metric: Taylor-mode coefficients give the series of its typed-out Taylor polynomial (to 1e−12)', () => {
		// z⁴e^{−z²} = Σ_j (−1)^j z^{4+2j}/j! (common practice); through z^24 the two metrics share every coefficient
		const poly = Array.from(
			{ length: 11 },
			(_, j) => `${j % 2 ? '+' : '-'} z^${4 + 2 * j}/${[1, 1, 2, 6, 24, 120, 720, 5040, 40320, 362880, 3628800][j]}`
		).join(' ');
		const a = makeBulk('metric', { d: 4, f: '1 - z^4*exp(-z^2)', zh: 1 });
		const b = makeBulk('metric', { d: 4, f: `1 ${poly}`, zh: 1 });
		// each series is in l over its own horizon (the two horizons differ): compare the coefficients of l^K
		const K = seriesPowers(a, 6);
		expect(seriesPowers(b, 6)).toEqual(K);
		const [va, vb] = [seriesValues(a, 6), seriesValues(b, 6)];
		va.forEach((x, i) => {
			const [xa, xb] = [x / Math.pow(a.scale!, K[i]!), vb[i]! / Math.pow(b.scale!, K[i]!)];
			expectRel(`l^${K[i]}`, xb, xa, 1e-12, 'exact Taylor polynomial (nerdamer path)');
		});
	});
});
