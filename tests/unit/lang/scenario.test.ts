/**
 * LANGUAGE.md's example scenario, run as one pad. Verbs whose engine part has not landed must say so with
 * a LangError (never a made-up value); once the engine exports them the same lines must answer.
 */
import { describe, expect, it } from 'vitest';
import * as holo from '../../../src/lib/holo/index';
import type { CheckResult, RecordResult, ScalarResult, TableResult } from '../../../src/lib/lang/result';
import { SPEC_EXAMPLES } from './examples';
import { Pad } from './pad';

const has = (name: string) => typeof (holo as unknown as Record<string, unknown>)[name] === 'function';

describe('the LANGUAGE.md scenario', () => {
	it('runs line by line in one pad', () => {
		const p = new Pad();
		const kinds: string[] = [];
		for (const line of SPEC_EXAMPLES) {
			const verb = line.split(' ')[0]!;
			const missing =
				(verb === 'tent' && !has('tent')) || (verb === 'firstlaw' && !has('firstLaw')) || (verb === 'mi' && !has('mutualInformation'));
			if (missing) {
				const e = p.fail(line);
				expect(e.message).toBe(`${verb} is not available yet`);
				expect(line.slice(e.start, e.end)).toBe(verb);
				kinds.push('unavailable');
				continue;
			}
			const out = p.run(line);
			kinds.push(out.results.map((r) => r.kind).join('+'));
		}
		expect(kinds[0]).toBe('note');
		expect(kinds[1]).toBe('table');
		expect(kinds[2]).toBe('table');
		expect(kinds[5]).toBe('series');
		expect(kinds[6]).toBe('note');
		expect(p.ctx.bulk).toEqual({ name: 'vacuum', params: { d: 2 } });
		if (has('tent')) expect(kinds[3]).toBe('scalar');
		if (has('firstLaw')) expect(kinds[4]).toBe('check');
		if (has('mutualInformation')) expect(kinds[7]).toBe('record');
	});

	it.runIf(has('tent'))('tent at order 1 in the static brane is c_d/l (Bhattacharya et al. 2013)', () => {
		const r = new Pad().run('tent l=0.4 o=1').results[0] as ScalarResult;
		expect(Math.abs(r.value - holo.cd(4) / 0.4) / r.value).toBeLessThan(1e-9);
		expect(r.order).toBe(1);
	});

	it.runIf(has('firstLaw'))('firstlaw answers a check with both sides', () => {
		const r = new Pad().run('use boosted d=4 v=0.6; firstlaw l=0.4 o=3').results[1] as CheckResult;
		expect(r.kind).toBe('check');
		expect(r.residual).toBeCloseTo(r.lhs - r.rhs, 14);
		expect(r.order).toBe(3);
	});

	it.runIf(has('mutualInformation'))('mi in d=2 vacuum vanishes for gap/l ≥ √2 − 1 (Headrick 2010)', () => {
		const r = new Pad().run('use vacuum d=2; mi pair l=1 gap=0.5').results[1] as RecordResult;
		expect(r.fields.I).toBe(0);
		expect(Math.abs(r.fields.gap_crit! - (Math.SQRT2 - 1))).toBeLessThan(1e-9);
	});

	it('the sweep of the scenario is the engine at every point', () => {
		const p = new Pad();
		p.run('use boosted d=4 zh=1 v=0.6');
		const t = p.run('sweep darea l=0.05..1.2:80 o=1,2,3,exact').results[0] as TableResult;
		const b = holo.makeBulk('boosted', { d: 4, zh: 1, v: 0.6 });
		for (const row of [t.rows[0]!, t.rows[40]!, t.rows[79]!]) {
			const l = row[0] as number;
			expect(row.slice(1)).toEqual([1, 2, 3].map((n) => holo.deltaAreaSeries(b, l, n)).concat(holo.deltaArea(b, l)));
		}
	});
});
