import katex from 'katex';
import { describe, expect, it } from 'vitest';
import { boostedCoeffPolys, makeBulk, seriesCoeffs } from '../../../src/lib/holo/index';
import { EXACT_ORDER, exactTerms, exactValue } from '../../../src/lib/holo/series/exact-latex';
import type { Term } from '../../../src/lib/holo/series/laurent';
import atomsFx from '../../fixtures/holo/atoms.json';
import fx from '../../fixtures/holo/series.json';
import { expectRel } from './check';

const ref = fx.a as Record<string, string[][]>;

interface Q {
	num: bigint;
	den: bigint;
}

/** A decimal string ("-1.25e-7") as an exact fraction. */
function parseDecimal(s: string): Q {
	const [mant, ex] = s.toLowerCase().split('e');
	const neg = mant.startsWith('-');
	const [ip, fp = ''] = mant.replace('-', '').split('.');
	let num = BigInt(ip + fp);
	let den = 10n ** BigInt(fp.length);
	const e = Number(ex ?? 0);
	if (e >= 0) num *= 10n ** BigInt(e);
	else den *= 10n ** BigInt(-e);
	return { num: neg ? -num : num, den };
}

const P = 10n ** 120n; // fixed point: far below the 1e−28 checked, far above any |a_k| here (≥ 1e−40)

/** Σ terms at exact rational atom values (50-digit decimals), each term to 120 decimals, in BigInt. */
function evalExact(ts: Term[], atoms: Q[]): bigint {
	let acc = 0n;
	for (const t of ts) {
		let num = t.c.num * P;
		let den = t.c.den;
		t.e.forEach((x, i) => {
			if (x > 0) {
				num *= atoms[i].num ** BigInt(x);
				den *= atoms[i].den ** BigInt(x);
			} else if (x < 0) {
				num *= atoms[i].den ** BigInt(-x);
				den *= atoms[i].num ** BigInt(-x);
			}
		});
		acc += num / den;
	}
	return acc;
}

/** |got/P − b| / |b| as a double. */
function relDiff(got: bigint, b: Q): number {
	const dn = got * b.den - b.num * P;
	const bn = b.num * P;
	return Number(((dn < 0n ? -dn : dn) * 10n ** 40n) / (bn < 0n ? -bn : bn)) / 1e40;
}

function toNumber(x: bigint): number {
	return Number((x * 10n ** 30n) / P) / 1e30;
}

/** The coefficient of κ^r in a decoded boosted a_k. */
function kappaPart(ts: Term[], r: number): Term[] {
	return ts.filter((t) => t.e[0] === r);
}

function atomsOf(d: number): Q[] {
	const b = (atomsFx.beta as Record<string, string[]>)[String(d)];
	// κ = 1: each check takes the terms of one power of κ apart
	return [{ num: 1n, den: 1n }, parseDecimal(atomsFx.pi), ...b.map(parseDecimal)];
}

function checkExact(label: string, ts: Term[], atoms: Q[], refText: string): void {
	const exp = parseDecimal(refText);
	const got = evalExact(ts, atoms);
	const rel = relDiff(got, exp);
	const msg = `${label}: expected ${refText}, got ${toNumber(got)}, relative difference ${rel.toExponential(2)}, tolerance 1e-28 rel [derived; checked against mpmath 60 digits, runner.py]`;
	expect(rel <= 1e-28, msg).toBe(true);
}

describe('exact a_k (π and B(s/m, ½) atoms) against the 60-digit numerics (tests/fixtures/holo/runner.py, atoms.py)', () => {
	// Derived: Beta reductions and Lagrange inversion in exact arithmetic (series/exact.ts). Evaluated with
	// 50-digit atoms in exact BigInt arithmetic, so any slip in the algebra shows far below double precision.
	for (let d = 3; d <= 10; d++) {
		it(`d=${d}: brane and wave k ≤ ${EXACT_ORDER.brane}, boosted k ≤ ${EXACT_ORDER.boosted} (every κ^r)`, () => {
			const atoms = atomsOf(d);
			const brane = exactTerms(d, 'brane', EXACT_ORDER.brane);
			const wave = exactTerms(d, 'wave', EXACT_ORDER.wave);
			for (let k = 1; k <= EXACT_ORDER.brane; k++) {
				checkExact(`brane d=${d} k=${k}`, brane[k - 1], atoms, ref[String(d)][k - 1][0]);
				checkExact(`wave d=${d} k=${k}`, wave[k - 1], atoms, ref[String(d)][k - 1][k]);
			}
			const boosted = exactTerms(d, 'boosted', EXACT_ORDER.boosted);
			for (let k = 1; k <= EXACT_ORDER.boosted; k++) {
				for (let r = 0; r <= k; r++) {
					checkExact(`boosted d=${d} k=${k} κ^${r}`, kappaPart(boosted[k - 1], r), atoms, ref[String(d)][k - 1][r]);
				}
			}
		}, 60_000);
	}
});

describe('exact a_k evaluated in doubles (atoms from special/beta) reproduce the numeric coefficients', () => {
	// derived; checked against the numeric coefficients (coeffs.ts). d = 3: the exact form in doubles loses
	// digits to cancellation among its terms beyond k ≈ 8 (Σ|terms| exceeds |a_k| by 10⁴…10⁶), and the numeric
	// a_k of coeffs.ts are themselves only within 2e−12 there (its doc comment); so d = 3 is checked to k = 8,
	// the exact form against mpmath at 1e−12 and against coeffs.ts at coeffs.ts's own 3e−12.
	for (let d = 3; d <= 8; d++) {
		it(`d=${d}`, () => {
			const num = boostedCoeffPolys(d, 12);
			const K = d === 3 ? 8 : 12;
			const tol = d === 3 ? 3e-12 : 1e-12;
			for (let k = 1; k <= K; k++) {
				expectRel(`brane d=${d} k=${k}`, num[k - 1][0], exactValue(d, 'brane', k), tol, 'numeric a_k, coeffs.ts');
				expectRel(`wave d=${d} k=${k}`, num[k - 1][k], exactValue(d, 'wave', k), tol, 'numeric a_k, coeffs.ts');
				const mp = ref[String(d)][k - 1];
				expectRel(`brane d=${d} k=${k}`, Number(mp[0]), exactValue(d, 'brane', k), 1e-12, 'mpmath 60 digits, runner.py');
				expectRel(`wave d=${d} k=${k}`, Number(mp[k]), exactValue(d, 'wave', k), 1e-12, 'mpmath 60 digits, runner.py');
			}
			for (const kappa of [0.5625, 3]) {
				for (let k = 1; k <= EXACT_ORDER.boosted; k++) {
					let e = 0;
					for (let r = k; r >= 0; r--) e = e * kappa + num[k - 1][r];
					expectRel(`boosted d=${d} k=${k} κ=${kappa}`, e, exactValue(d, 'boosted', k, kappa), tol, 'numeric a_k, coeffs.ts');
				}
			}
		}, 60_000);
	}
});

describe('LaTeX of the coefficients', () => {
	it('every exact coefficient parses in KaTeX (common practice: render what the console shows)', () => {
		for (const d of [3, 4, 6, 10]) {
			for (const name of ['brane', 'wave', 'boosted'] as const) {
				const params: Record<string, number> = name === 'wave' ? { d, zp: 1 } : name === 'boosted' ? { d, zh: 1, v: 0.5 } : { d, zh: 1 };
				// rendering a boosted a₁₂ (hundreds of terms) takes seconds: full order at d = 3, the first six elsewhere
				const n = name === 'boosted' ? (d === 3 ? EXACT_ORDER.boosted + 1 : 6) : 12;
				for (const c of seriesCoeffs(makeBulk(name, params), n)) {
					expect(() => katex.renderToString(c.latex, { throwOnError: true }), `${name} d=${d} k=${c.k}: ${c.latex}`).not.toThrow();
					expect(c.exact, `${name} d=${d} k=${c.k}`).toBe(c.k <= EXACT_ORDER[name]);
					expect(c.latex.length, `${name} d=${d} k=${c.k}: length`).toBeLessThan(200_000);
				}
			}
		}
	}, 120_000);
	it('beyond the exact order the decimal says where the exact form stops', () => {
		const c = seriesCoeffs(makeBulk('boosted', { d: 4, zh: 1, v: 0.5 }), EXACT_ORDER.boosted + 1).at(-1)!;
		expect(c.latex).toMatch(/^\\approx .*exact form computed to order \d+/);
	});
	it('boosted a₁: primitive part ∝ (d−1) + (d+1)κ (PHYSICS.md: a₁(κ) = a₁(0)(1 + (d+1)κ/(d−1)); derived, checked against exact numerics)', () => {
		for (let d = 3; d <= 8; d++) {
			const g = d % 2 ? 2 : 1; // gcd(d−1, d+1)
			const latex = seriesCoeffs(makeBulk('boosted', { d, zh: 1, v: 0.3 }), 1)[0].latex;
			expect(latex, `d=${d}`).toContain(`\\left(${(d - 1) / g} + ${(d + 1) / g}\\kappa\\right)`);
		}
	});
	it('a₁ of the brane is a single monomial in π and the Beta values (its first-law value is a Γ ratio; BNTU 2013)', () => {
		for (let d = 3; d <= 10; d++) expect(exactTerms(d, 'brane', 1)[0]).toHaveLength(1);
	});
});
