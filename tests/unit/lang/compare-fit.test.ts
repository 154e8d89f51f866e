import { describe, expect, it } from 'vitest';
import * as holo from '../../../src/lib/holo/index';
import type { CheckResult, ScalarResult, TableResult } from '../../../src/lib/lang/result';
import { Pad } from './pad';

/** mulberry32: a small seeded generator, so the noise is the same on every run */
function rng(seed: number) {
	return () => {
		seed = (seed + 0x6d2b79f5) | 0;
		let t = Math.imul(seed ^ (seed >>> 15), 1 | seed);
		t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
}
/** standard normal deviates by Box–Muller */
function gauss(r: () => number) {
	return () => Math.sqrt(-2 * Math.log(1 - r())) * Math.cos(2 * Math.PI * r());
}

const ls = Array.from({ length: 10 }, (_, i) => 0.2 + 0.1 * i);
function synthetic(zh: number, seed: number, rel = 0.01) {
	const b = holo.makeBulk('brane', { d: 4, zh });
	const g = gauss(rng(seed));
	return {
		columns: ['l', 'darea', 'sigma'],
		rows: ls.map((l) => {
			const y = holo.deltaArea(b, l);
			const s = rel * Math.abs(y);
			return [l, y + s * g(), s];
		})
	};
}

describe('compare with uncertainties', () => {
	it('reads the sigma column: χ²/dof and its p-value; passes true data, fails data shifted by many σ', () => {
		const good = synthetic(1, 7);
		const shifted = { ...good, rows: good.rows.map((r) => [r[0]!, r[1]! + 5 * r[2]!, r[2]!]) };
		const p = new Pad({ datasets: { good, shifted } });
		const [t, c] = p.run('compare good darea o=exact').results as [TableResult, CheckResult];
		expect(t.columns).toEqual(['l', 'engine', 'dataset', 'diff', 'sigma', 'pull']);
		const pulls = t.rows.map((r) => r[5] as number);
		const chi2 = pulls.reduce((s, x) => s + x * x, 0);
		expect(c.chi2dof).toBeCloseTo(chi2 / 10, 12);
		expect(c.pvalue).toBeCloseTo(holo.chi2Sf(chi2, 10), 14);
		expect(c.pass).toBe(c.pvalue! >= 0.05);
		expect(c.pass).toBe(true);
		const bad = p.run('compare shifted darea o=exact').results[1] as CheckResult;
		expect(bad.pass).toBe(false);
		expect(bad.chi2dof!).toBeGreaterThan(20);
		expect(bad.pvalue!).toBeLessThan(1e-10);
	});
	it('without errors the tolerance is relative (default 1e-4), so small values are judged by their own size', () => {
		const b = holo.makeBulk('brane', { d: 4, zh: 1 });
		// ΔA at l = 0.05 is ~1e-5: an absolute 1e-6 tolerance would pass a 10 % error here
		const near = { columns: ['l', 'darea'], rows: [0.05, 0.1, 0.2].map((l) => [l, holo.deltaArea(b, l) * (1 + 5e-5)]) };
		const off = { columns: ['l', 'darea'], rows: [0.05, 0.1, 0.2].map((l) => [l, holo.deltaArea(b, l) * 1.1]) };
		const p = new Pad({ datasets: { near, off } });
		const c = p.run('compare near darea').results[1] as CheckResult;
		expect(c).toMatchObject({ pass: true, tolerance: 1e-4, relation: 'engine = dataset' });
		expect(c.residual).toBeCloseTo(5e-5, 8);
		expect((p.run('compare off darea').results[1] as CheckResult).pass).toBe(false);
		expect((p.run('compare near darea tol=1e-6').results[1] as CheckResult).pass).toBe(false);
	});
});

describe('fit one bulk parameter to a dataset', () => {
	it('recovers zh from a synthetic dataset made with zh = 1.3 and 1 % noise, within its stated uncertainty', () => {
		const pulls: number[] = [];
		for (const seed of [1, 2, 3, 4, 5]) {
			const p = new Pad({ datasets: { syn: synthetic(1.3, seed) } });
			const out = p.run('compare syn darea o=exact fit=zh');
			const [fit, table, check] = out.results as [ScalarResult, TableResult, CheckResult];
			expect(fit.label).toMatch(/^zh fitted \(exact\) = [\d.]+ ± [\d.e-]+$/);
			const zh = fit.fields!.zh!;
			const err = fit.fields!.zh_err!;
			expect(err).toBeGreaterThan(0);
			expect(err).toBeLessThan(0.05);
			// one standard error: 68 % of fits land inside; every one of these lands within 3
			expect(Math.abs(zh - 1.3), `seed ${seed}: zh = ${zh} ± ${err}`).toBeLessThan(3 * err);
			pulls.push((zh - 1.3) / err);
			// the comparison is made at the fitted value, with one degree of freedom used by the fit
			expect(table.label).toContain(`at zh = `);
			expect(check.label).toMatch(/over 9 dof/);
			expect(out.ref.fields.zh).toBe(zh);
		}
		// the stated uncertainty is a standard error, not a loose bound: the pulls scatter by about one
		const rms = Math.sqrt(pulls.reduce((s, x) => s + x * x, 0) / pulls.length);
		expect(rms).toBeGreaterThan(0.2);
		expect(rms).toBeLessThan(2.5);
	});
	it('refuses what cannot be fitted, pointing at it', () => {
		const p = new Pad({ datasets: { syn: synthetic(1.3, 1) } });
		expect(p.fail('compare syn darea fit=q').message).toBe("the bulk has no number 'q' to fit");
		expect(p.fail('compare syn darea fit=zh zh=2').message).toBe('fit varies zh: leave zh= off the line');
		expect(p.fail('compare syn darea fit=c').message).toBe('fit=c needs CFT units: units cft c=… first');
	});
});
