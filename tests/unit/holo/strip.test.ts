import { describe, it } from 'vitest';
import {
	areaFinite,
	deltaArea,
	integrateStrip,
	makeBulk,
	stripIntegrals,
	vacuumAreaFinite,
	vacuumWidthFactor,
	widthOf,
	zstarOf
} from '../../../src/lib/holo/index';
import fx from '../../fixtures/holo/strip.json';
import { expectAbs, expectRel } from './check';

type Row = (typeof fx.rows)[number] & { v?: string; q?: string; zp?: number };

function bulkOf(r: Row) {
	if (r.kind === 'boosted') return makeBulk('boosted', { d: r.d, zh: 1, v: Number(r.v) });
	if (r.kind === 'charged') return makeBulk('charged', { d: r.d, zh: 1, q: Number(r.q) });
	if (r.kind === 'wave') return makeBulk('wave', { d: r.d, zp: 1 });
	return makeBulk('brane', { d: r.d, zh: 1 });
}

describe('exact strip against 30-digit mpmath fixtures (tests/fixtures/holo/runner.py)', () => {
	for (const r of fx.rows as Row[]) {
		const label = `${r.kind} d=${r.d}${r.v ? ` v=${r.v}` : ''}${r.q ? ` q=${r.q}` : ''} ${r.eta ? `eta=${r.eta}` : `z*=${r.zstar}`}`;
		it(label, () => {
			const bulk = bulkOf(r);
			const eta = r.eta ? Number(r.eta) : NaN;
			const near = eta <= 0.01;
			const tol = near ? 1e-8 : 1e-10;
			// at the fixture's own turning point (η exact): width, A_fin and ΔA
			const at = integrateStrip(bulk.slice, { z: Number(r.zstar), eta });
			expectRel(`width at ${label}`, Number(r.l), at.width, 1e-12, 'mpmath');
			expectRel(`A_fin at ${label}`, Number(r.A), at.areaFinite, 1e-12, 'mpmath');
			expectRel(`dA at ${label}`, Number(r.dA), at.deltaArea, 1e-11, 'mpmath');
			// through the public API, root finding included
			const l = Number(r.l);
			expectRel(`A_fin(l=${l}) ${label}`, Number(r.A), areaFinite(bulk, l), tol, 'mpmath');
			expectRel(`dA(l=${l}) ${label}`, Number(r.dA), deltaArea(bulk, l), tol, 'mpmath');
			if (!near) expectRel(`z*(l=${l}) ${label}`, Number(r.zstar), zstarOf(bulk, l), tol, 'mpmath');
		});
	}
});

describe('vacuum strip against the closed forms (Ryu & Takayanagi, PRL 96 (2006) 181602; JHEP 08 (2006) 045)', () => {
	for (let d = 3; d <= 8; d++) {
		it(`d=${d}`, () => {
			const vac = makeBulk('vacuum', { d });
			for (const zs of [0.01, 0.3, 1, 7]) {
				const r = stripIntegrals(vac, zs);
				const l = vacuumWidthFactor(d) * zs;
				expectRel(`vacuum width d=${d} z*=${zs}`, l, r.width, 1e-13, 'RT closed form');
				expectRel(`vacuum A_fin d=${d} z*=${zs}`, vacuumAreaFinite(d, l), r.areaFinite, 1e-12, 'RT closed form');
			}
		});
	}
});

describe('BTZ (d = 2) against Calabrese–Cardy (J. Stat. Mech. (2004) P06002; Brown & Henneaux 1986)', () => {
	it('S = (c/3) ln((β/πε) sinh(πl/β)), β = 2π zh, for l/β from 0.01 to 40', () => {
		for (const zh of [0.5, 1, 3]) {
			const b = makeBulk('brane', { d: 2, zh });
			const beta = 2 * Math.PI * zh;
			for (const r of [0.01, 0.1, 0.5, 1, 3, 10, 40]) {
				const l = r * beta;
				// A_fin = 2 ln((β/π) sinh(π l/β)); ΔA = 2 ln(sinh x / x), x = πl/β, written with log1p/expm1 so it is exact too
				const x = Math.PI * r;
				const A = 2 * (x + Math.log(-Math.expm1(-2 * x) / 2) + Math.log(beta / Math.PI));
				expectRel(`BTZ A_fin zh=${zh} l/β=${r}`, A, areaFinite(b, l), 1e-10, 'Calabrese–Cardy');
				const dA = x < 1 ? 2 * Math.log1p(sinhm(x)) : 2 * (x + Math.log(-Math.expm1(-2 * x) / (2 * x)));
				expectRel(`BTZ ΔA zh=${zh} l/β=${r}`, dA, deltaArea(b, l), 1e-10, 'Calabrese–Cardy');
			}
		}
	});
});

/** sinh(x)/x − 1 by its Taylor series (x < 1). */
function sinhm(x: number): number {
	let t = 1;
	let s = 0;
	for (let k = 1; k < 30; k++) {
		t *= (x * x) / (2 * k * (2 * k + 1));
		s += t;
	}
	return s;
}

describe('large l: A_fin − l/zh^{d−1} tends to a constant exponentially (horizon area density; common practice)', () => {
	// ΔA − l has the same limit but approaches it like l^{2−d} through the vacuum term, so A_fin is checked
	for (const d of [3, 4, 6]) {
		it(`brane d=${d}`, () => {
			const b = makeBulk('brane', { d, zh: 1 });
			const c = [10, 20, 30].map((l) => areaFinite(b, l) - l);
			expectAbs(`d=${d} const(20) vs const(30)`, c[2], c[1], 1e-9, 'common practice');
			expectAbs(`d=${d} const(10) vs const(30)`, c[2], c[0], 1e-4, 'common practice');
		});
	}
});

describe('width/turning point round trip at moderate z*', () => {
	it('widthOf(zstarOf(l)) = l', () => {
		const b = makeBulk('boosted', { d: 5, zh: 2, v: 0.7 });
		for (const l of [0.01, 0.3, 1, 2.5]) expectRel(`l=${l}`, l, widthOf(b, zstarOf(b, l)), 1e-13, 'identity');
	});
});
