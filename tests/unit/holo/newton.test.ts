import { describe, expect, it } from 'vitest';
import { HoloError, makeBulk } from '../../../src/lib/holo/index';
import { solveStrip, widthAt, widthSlope } from '../../../src/lib/holo/strip';
import type { Bulk } from '../../../src/lib/holo/index';
import { expectRel } from './check';

/** ln l at z* e^t, keeping η = 1 − z* / zh exact enough for the finite differences (t ≪ η). */
function lnWidth(b: Bulk, z: number, t: number): number {
	const zz = z * Math.exp(t);
	const zh = b.slice.zh;
	return Math.log(widthAt(b.slice, { z: zz, eta: zh ? 1 - zz / zh : NaN }));
}

/** Richardson-extrapolated central difference of ln l in ln z* (common practice). */
function fdSlope(b: Bulk, z: number, h: number): number {
	const c = (s: number) => (lnWidth(b, z, s) - lnWidth(b, z, -s)) / (2 * s);
	return (4 * c(h / 2) - c(h)) / 3;
}

const cases: [string, Record<string, number>][] = [
	['brane', { d: 4, zh: 1 }],
	['brane', { d: 2, zh: 1 }],
	['boosted', { d: 5, zh: 1, v: 0.9 }],
	['charged', { d: 3, zh: 1, q: 1.2 }],
	['wave', { d: 4, zp: 1 }]
];

describe('d ln l/d ln z* from the quadrature pass (used by the Newton solver)', () => {
	for (const [name, params] of cases) {
		it(`${name} ${JSON.stringify(params)} against Richardson differences (common practice)`, () => {
			const b = makeBulk(name, params);
			for (const l of [0.05, 0.5, 2, 4]) {
				const s = solveStrip(b.slice, l);
				const eta = s.point.eta;
				const h = Number.isFinite(eta) ? Math.min(1e-3, eta / 200) : 1e-3;
				expectRel(`${name} l=${l}`, fdSlope(b, s.zstar, h), widthSlope(b.slice, s.point).slope, 1e-7, 'finite differences');
			}
		});
	}
});

describe('Newton solve of l(z*) = l', () => {
	it('hits the width to 1e−13 from tiny l to deep near-horizon l (the residual is the test; common practice)', () => {
		for (const [name, params] of cases) {
			const b = makeBulk(name, params);
			for (const l of [1e-4, 0.01, 0.3, 1, 3, 8, 20]) {
				const s = solveStrip(b.slice, l);
				expectRel(`${name} ${JSON.stringify(params)} l=${l}: l(z*)`, l, s.width, 1e-13, 'self-consistency');
			}
		}
	});
	it('a turning point beyond double precision near the horizon is a clear HoloError on l', () => {
		const b = makeBulk('brane', { d: 10, zh: 1 });
		expect(() => solveStrip(b.slice, 200)).toThrow(HoloError);
		expect(() => solveStrip(b.slice, 200)).toThrow(/within e\^−700 of the horizon/);
	});
});
