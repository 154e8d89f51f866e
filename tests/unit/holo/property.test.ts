import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { areaFinite, deltaArea, HoloError, makeBulk, widthOf, zstarOf } from '../../../src/lib/holo/index';

const brane = fc.record({ d: fc.integer({ min: 2, max: 10 }), zh: fc.double({ min: 0.05, max: 20, noNaN: true }) });
const boosted = fc.record({
	d: fc.integer({ min: 3, max: 10 }),
	zh: fc.double({ min: 0.05, max: 20, noNaN: true }),
	v: fc.double({ min: -0.95, max: 0.95, noNaN: true })
});
const ratio = fc.double({ min: 0.01, max: 4, noNaN: true });

describe('properties (fast-check)', () => {
	it('widthOf(zstarOf(l)) = l', () => {
		fc.assert(
			fc.property(boosted, ratio, (p, r) => {
				const b = makeBulk('boosted', p);
				const l = r * p.zh;
				const zs = zstarOf(b, l);
				const back = widthOf(b, zs);
				// a plain-number z* carries η = 1 − z*/zh only to ε/η relative; l ∝ ln(1/η) near the horizon
				const eta = 1 - zs / p.zh;
				return Math.abs(back / l - 1) < 1e-11 + 1e-15 / (eta * r);
			}),
			{ numRuns: 60 }
		);
	});
	it('ΔA > 0 and finite for brane and boosted', () => {
		fc.assert(
			fc.property(brane, ratio, (p, r) => {
				const x = deltaArea(makeBulk('brane', p), r * p.zh);
				return Number.isFinite(x) && x > 0;
			}),
			{ numRuns: 60 }
		);
		fc.assert(
			fc.property(boosted, ratio, (p, r) => {
				const b = makeBulk('boosted', p);
				const x = deltaArea(b, r * p.zh);
				return Number.isFinite(x) && x > 0 && Number.isFinite(areaFinite(b, r * p.zh));
			}),
			{ numRuns: 60 }
		);
	});
	it('every invalid input throws HoloError, never NaN', () => {
		const bad = fc.oneof(
			fc.record({ d: fc.oneof(fc.integer({ min: -5, max: 1 }), fc.integer({ min: 11, max: 40 }), fc.constant(3.5), fc.constant(NaN)) }),
			fc.record({ d: fc.constant(4), zh: fc.oneof(fc.double({ max: 0, noNaN: true }), fc.constant(NaN), fc.constant(Infinity)) }),
			fc.record({
				d: fc.constant(4),
				v: fc.oneof(fc.double({ min: 1, max: 1e6, noNaN: true }), fc.double({ min: -1e6, max: -1, noNaN: true }), fc.constant(NaN))
			})
		);
		fc.assert(
			fc.property(bad, (p) => {
				try {
					makeBulk('boosted', p as Record<string, number>);
					return false;
				} catch (e) {
					return e instanceof HoloError && typeof e.key === 'string';
				}
			}),
			{ numRuns: 200 }
		);
		const b = makeBulk('brane', { d: 4, zh: 1 });
		for (const l of [0, -1, NaN, Infinity]) expect(() => deltaArea(b, l)).toThrow(HoloError);
		expect(() => widthOf(b, 1.5)).toThrow(HoloError);
		expect(() => makeBulk('charged', { d: 4, q: 1.5 })).toThrow(/non-extremal/);
		expect(() => makeBulk('boosted', { d: 4, v: 0.3, rapidity: 1 })).toThrow(HoloError);
		expect(() => makeBulk('nope', {})).toThrow(HoloError);
	});
});

describe('custom metric (sandboxed mathjs)', () => {
	it('reproduces the brane', () => {
		const m = makeBulk('metric', { d: 4, f: '1 - (z/zh)^4', zh: 1 });
		const b = makeBulk('brane', { d: 4, zh: 1 });
		for (const l of [0.2, 1, 2]) expect(Math.abs(deltaArea(m, l) / deltaArea(b, l) - 1)).toBeLessThan(1e-8); // black-box f: plain differences
	});
	it('rejects bad strings with HoloError naming the key', () => {
		const cases: [Record<string, number | string>, string][] = [
			[{ d: 4, f: '2 - z' }, 'f'],
			[{ d: 4, f: '1', h: '3' }, 'h'],
			[{ d: 4, f: '1 - (z' }, 'f'],
			[{ d: 4, f: 'import({x: 1})' }, 'f'],
			[{ d: 4, f: 'createUnit("foo")' }, 'f'],
			[{ d: 4, f: 'evaluate("1")' }, 'f'],
			[{ d: 4, f: 'w + 1' }, 'f']
		];
		for (const [p, key] of cases) {
			let err: unknown;
			try {
				makeBulk('metric', p);
			} catch (e) {
				err = e;
			}
			expect(err, JSON.stringify(p)).toBeInstanceOf(HoloError);
			expect((err as HoloError).key, JSON.stringify(p)).toBe(key);
		}
	});
});
