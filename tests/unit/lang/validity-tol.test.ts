/**
 * One validity tolerance per pad: the series warning, `validity` without tol= and the plot's shading all use
 * the pad's (PadContext.validityTol), 1e-3 relative by default. Expected l_max come from the engine's own
 * validity() called directly with the same tolerance, never from numbers the evaluator printed.
 */
import { describe, expect, it } from 'vitest';
import * as holo from '../../../src/lib/holo/index';
import type { RecordResult, ScalarResult, TableResult } from '../../../src/lib/lang/result';
import { DEFAULT_VALIDITY_TOL } from '../../../src/lib/lang/verbs/validity';
import { Pad } from './pad';

const brane = () => holo.makeBulk('brane', { d: 4, zh: 1 });

describe('the pad validity tolerance', () => {
	// a width where order 2 is within 1e-2 of exact but not within 1e-3
	const tight = holo.validity(brane(), 2, 1e-3).l_max;
	const loose = holo.validity(brane(), 2, 1e-2).l_max;
	const l = Math.sqrt(tight * loose);

	it('the default is 1e-3, and a width between the two l_max shows the threshold moving', () => {
		expect(DEFAULT_VALIDITY_TOL).toBe(1e-3);
		expect(tight).toBeLessThan(loose);
		expect(l).toBeGreaterThan(tight);
		expect(l).toBeLessThan(loose);
	});

	it('series warnings follow it: warned at the default, quiet at 1e-2', () => {
		const line = `darea l=${l} o=2`;
		const strict = new Pad().run(line).results[0] as ScalarResult;
		expect(strict.warning).toMatch(/order 2 is off by more than 0\.001 \(relative, the pad's validity tolerance\)/);
		const relaxed = new Pad({ validityTol: 1e-2 }).run(line).results[0] as ScalarResult;
		expect(relaxed.warning).toBeUndefined();
		// and a stricter pad warns even closer in
		const l4 = holo.validity(brane(), 2, 1e-4).l_max;
		const w = (new Pad({ validityTol: 1e-4 }).run(`darea l=${(l4 + tight) / 2} o=2`).results[0] as ScalarResult).warning;
		expect(w).toMatch(/more than 0\.0001/);
		expect((new Pad().run(`darea l=${(l4 + tight) / 2} o=2`).results[0] as ScalarResult).warning).toBeUndefined();
	});

	it('validity without tol= uses it; tol= on the line still wins', () => {
		const r = new Pad({ validityTol: 1e-2 }).run('validity o=2').results[0] as RecordResult;
		expect(r.fields.l_max).toBe(loose);
		const own = new Pad({ validityTol: 1e-2 }).run('validity o=2 tol=1e-3').results[0] as RecordResult;
		expect(own.fields.l_max).toBe(tight);
	});

	it('the plot shades with it and records which it used', () => {
		const t = new Pad({ validityTol: 1e-2 }).run('sweep darea l=0.05..0.6:6 o=1,2,exact').results[0] as TableResult;
		expect(t.plot?.tol).toBe(1e-2);
		expect(t.plot?.validity?.o2).toBe(loose);
		expect(t.plot?.validity?.o1).toBe(holo.validity(brane(), 1, 1e-2).l_max);
		const d = new Pad().run('sweep darea l=0.05..0.6:6 o=1,2,exact').results[0] as TableResult;
		expect(d.plot?.tol).toBe(1e-3);
		expect(d.plot?.validity?.o2).toBe(tight);
	});
});
