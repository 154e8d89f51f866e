/**
 * A ball sweep starts each exact ball from the previous point's tip (verbs/point.ts, Point.carry): the same
 * values as the points asked one by one, for fewer Newton shots (counted by the engine, not timed).
 */
import { describe, expect, it } from 'vitest';
import { ballShotsTaken } from '../../../src/lib/holo/ball-shot';
import { Pad } from './pad';
import type { ScalarResult, TableResult } from '../../../src/lib/lang/result';

describe('exact ball sweeps continue from the previous point', () => {
	it('sweep darea ball R=0.1..2:200 equals the points one by one, with fewer shots', () => {
		const pad = new Pad();
		pad.run('use brane d=4 zh=1');
		let before = ballShotsTaken();
		const table = pad.run('sweep darea ball R=0.1..2:200').results[0] as TableResult;
		const sweepShots = ballShotsTaken() - before;
		expect(table.columns).toEqual(['R', 'exact']);
		expect(table.rows).toHaveLength(200);
		before = ballShotsTaken();
		let worst = 0;
		for (const [R, v] of table.rows as number[][]) {
			const one = pad.run(`darea ball R=${R}`).results[0] as ScalarResult;
			expect(one.order).toBe('exact');
			worst = Math.max(worst, Math.abs(v! - one.value) / Math.abs(one.value));
		}
		const pointShots = ballShotsTaken() - before;
		// the same ball from another Newton start (Newton's last step is applied linearly, its error is its square);
		// measured: 402 shots for the sweep against 792 one by one (2 per ball against 4)
		expect(worst).toBeLessThan(1e-12);
		expect(sweepShots).toBeGreaterThan(0);
		expect(sweepShots).toBeLessThan(0.6 * pointShots);
	});

	it('carries per order column and leaves other orders alone (o=1,exact)', () => {
		const pad = new Pad();
		pad.run('use brane d=3 zh=1');
		const t = pad.run('sweep darea ball R=0.2..2.5:30 o=1,exact').results[0] as TableResult;
		expect(t.columns).toEqual(['R', 'o1', 'exact']);
		for (const [R, , ex] of t.rows as number[][]) {
			const one = pad.run(`darea ball R=${R}`).results[0] as ScalarResult;
			expect(Math.abs(ex! - one.value) / one.value).toBeLessThan(1e-12);
		}
	});

	it('a jump back to a small ball (a list, not a range) still answers what a cold start answers', () => {
		const pad = new Pad();
		pad.run('use brane d=5 zh=1');
		const t = pad.run('darea ball R=2.5,0.12,1.7,0.3').results[0] as TableResult;
		for (const [R, v] of t.rows as number[][]) {
			const one = pad.run(`darea ball R=${R}`).results[0] as ScalarResult;
			expect(Math.abs(v! - one.value) / one.value).toBeLessThan(1e-12);
		}
	});
});
