/**
 * A custom metric written as the brane, the charged brane and the plane wave answers, through POST /api/eval,
 * what those bulks answer (to 1e−10): exact ΔA near and far from the horizon, the series coefficients, and —
 * for the static ones — stress, thermo and the first law along the scale direction. The named bulks are held
 * against mpmath fixtures and published limits in the unit tests. The wave's full metric is stationary (a dt dy
 * term), not static, so as a static metric only its slice — ΔA and the series — is the wave's.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, type Client } from '../helpers/client';

let c: Client;
beforeAll(async () => {
	c = await signedIn('tomas@sable.test');
});

type R = {
	kind: string;
	value?: number;
	fields?: Record<string, number>;
	terms?: { coeff: number; power: number }[];
	lhs?: number;
	rhs?: number;
};

async function results(input: string): Promise<R[]> {
	const r = await c.post('/api/eval', { input });
	expect(r.status, JSON.stringify(r.body).slice(0, 300)).toBe(200);
	return r.body.results as R[];
}

const close = (what: string, a: number, b: number, tol = 1e-10) =>
	expect(Math.abs(b - a) / Math.abs(a), `${what}: ${a} vs ${b}`).toBeLessThanOrEqual(tol);

const PAIRS: [name: string, named: string, metric: string, staticState: boolean][] = [
	['brane', 'use brane d=4 zh=1.1', 'use metric d=4 f="1 - (z/zh)^4" zh=1.1', true],
	['charged', 'use charged d=4 zh=1.1 q=0.7', 'use metric d=4 f="1 - (1+q^2)*(z/zh)^4 + q^2*(z/zh)^6" zh=1.1 q=0.7', true],
	['wave', 'use wave d=4 zp=1', 'use metric d=4 f="1" h="1 + z^4" zh=1', false]
];

describe('use metric through the API reproduces the named bulks', () => {
	for (const [name, named, metric, staticState] of PAIRS) {
		it(`${name}: exact ΔA (l = 0.4, 3, 6), coefficients to order 4`, async () => {
			for (const l of [0.4, 3, 6]) {
				const [a, b] = [(await results(`${named}; darea l=${l}`))[1]!, (await results(`${metric}; darea l=${l}`))[1]!];
				close(`${name} darea l=${l}`, a.value!, b.value!);
			}
			const [a, b] = [(await results(`${named}; coeffs darea o=4`))[1]!, (await results(`${metric}; coeffs darea o=4`))[1]!];
			expect(b.terms!.map((t) => t.power)).toEqual(a.terms!.map((t) => t.power));
			a.terms!.forEach((t, i) => close(`${name} coefficient ${t.power}`, t.coeff, b.terms![i]!.coeff, 1e-12));
		});
		if (!staticState) continue;
		it(`${name}: stress, thermo (T, s, e, p) and the first law (order 2 and exact)`, async () => {
			for (const verb of ['stress', 'thermo']) {
				const [a, b] = [(await results(`${named}; ${verb}`))[1]!, (await results(`${metric}; ${verb}`))[1]!];
				for (const k of verb === 'stress' ? ['tt', 'xx', 'yy'] : ['T', 's', 'e', 'p'])
					close(`${name} ${verb} ${k}`, a.fields![k]!, b.fields![k]!);
			}
			for (const o of ['2', 'exact']) {
				const [a, b] = [(await results(`${named}; firstlaw l=0.5 o=${o}`))[1]!, (await results(`${metric}; firstlaw l=0.5 o=${o}`))[1]!];
				close(`${name} firstlaw lhs o=${o}`, a.lhs!, b.lhs!);
				if (name === 'brane') close(`${name} firstlaw rhs o=${o}`, a.rhs!, b.rhs!);
			}
		});
	}

	it('a symbolic metric: coefficients as polynomials, values null until the symbols have numbers', async () => {
		const [, s] = await results('use metric d=4 f="1-m*z^4+q^2*z^6"; coeffs darea o=2 | tex');
		expect(s!.kind).toBe('series');
		expect(s!.terms!.map((t) => t.power)).toEqual([4, 6, 8]);
		expect(s!.terms!.every((t) => t.coeff === null)).toBe(true);
	});
});
