import { describe, expect, it } from 'vitest';
import { dAreaDParam, deltaArea, HoloError, makeBulk, seriesValues } from '../../../src/lib/holo/index';
import { expectRel } from './check';

/** Richardson-extrapolated central difference of the exact ΔA at fixed l (common practice). */
function fd(name: string, params: Record<string, number>, key: string, l: number, h: number): number {
	const at = (dx: number) => deltaArea(makeBulk(name, { ...params, [key]: params[key] + dx }), l);
	const c = (s: number) => (at(s) - at(-s)) / (2 * s);
	return (4 * c(h / 2) - c(h)) / 3;
}

const cases: [string, Record<string, number>, string, number[]][] = [
	['brane', { d: 4, zh: 1 }, 'zh', [0.3, 1, 3]],
	['brane', { d: 2, zh: 1.5 }, 'zh', [0.5, 4]],
	['brane', { d: 7, zh: 1 }, 'zh', [0.8, 2]],
	['boosted', { d: 4, zh: 1, v: 0.6 }, 'zh', [0.5, 2]],
	['boosted', { d: 4, zh: 1, v: 0.6 }, 'v', [0.5, 2]],
	['boosted', { d: 3, zh: 2, v: -0.3 }, 'v', [1, 5]],
	['charged', { d: 4, zh: 1, q: 0.8 }, 'q', [0.5, 2]],
	['charged', { d: 3, zh: 1, q: 1.2 }, 'zh', [0.7, 2.5]],
	['wave', { d: 4, zp: 1 }, 'zp', [0.3, 2]]
];

describe('dAreaDParam: extremality (∫ ∂_p L on the fixed surface; derived) against Richardson differences of the exact ΔA', () => {
	for (const [name, params, key, ls] of cases) {
		it(`${name} ${JSON.stringify(params)} d/d${key}`, () => {
			const b = makeBulk(name, params);
			for (const l of ls) {
				const h = 1e-3 * Math.max(Math.abs(params[key]), 0.1);
				expectRel(`${name} d/d${key} l=${l}`, fd(name, params, key, l, h), dAreaDParam(b, l, key), 1e-8, 'Richardson differences');
			}
		});
	}
	it('small l: the τ-derivative of the series, dΔA/dzh = −(d/zh) l^{2−d} Σ k a_k τ^k (PHYSICS.md series; derived)', () => {
		for (const d of [3, 4, 6]) {
			const b = makeBulk('brane', { d, zh: 1 });
			const a = seriesValues(b, 4);
			const l = 0.05;
			const tau = Math.pow(l, d);
			const series = -d * Math.pow(l, 2 - d) * a.reduce((s, ak, i) => s + (i + 1) * ak * Math.pow(tau, i + 1), 0);
			expectRel(`brane d=${d} l=${l}`, series, dAreaDParam(b, l, 'zh'), 1e-10, 'series to order 4');
		}
	});
	it('unknown parameter or bulk: HoloError naming the key', () => {
		expect(() => dAreaDParam(makeBulk('brane', { d: 4, zh: 1 }), 1, 'v')).toThrow(HoloError);
		expect(() => dAreaDParam(makeBulk('vacuum', { d: 4 }), 1, 'zh')).toThrow(/brane, boosted, charged and wave/);
	});
});
