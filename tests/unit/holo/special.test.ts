import { describe, it } from 'vitest';
import stdGamma from '@stdlib/math-base-special-gamma';
import stdBeta from '@stdlib/math-base-special-beta';
import { beta, gamma } from '../../../src/lib/holo/index';
import fx from '../../fixtures/holo/special.json';
import { expectRel } from './check';

describe('Γ and B', () => {
	it('match 32-digit mpmath values (tests/fixtures/holo/runner.py)', () => {
		for (const { x, value } of fx.gamma) expectRel(`gamma(${x})`, Number(value), gamma(Number(x)), 3e-15, 'mpmath');
		for (const { x, y, value } of fx.beta) {
			expectRel(`beta(${x},${y})`, Number(value), beta(Number(x), Number(y)), 1e-14, 'mpmath');
		}
	});

	it('match @stdlib (a general-purpose library from the registry)', () => {
		for (let x = 0.05; x < 30; x += 0.37) {
			expectRel(`gamma(${x})`, stdGamma(x), gamma(x), 5e-15, '@stdlib/math-base-special-gamma');
			expectRel(`beta(${x},0.5)`, stdBeta(x, 0.5), beta(x, 0.5), 2e-14, '@stdlib/math-base-special-beta');
		}
	});

	it('match Abramowitz & Stegun Table 6.1 (10 digits; values from memory)', () => {
		const table: [number, number][] = [
			[1.0, 1.0],
			[1.25, 0.9064024771],
			[1.5, 0.8862269255],
			[1.75, 0.9190625268],
			[2.0, 1.0]
		];
		for (const [x, g] of table) expectRel(`gamma(${x})`, g, gamma(x), 1e-9, 'A&S Table 6.1, from memory');
	});
});
