/** Evaluation errors: each names what was wrong and points at the characters that caused it. */
import { describe, expect, it } from 'vitest';
import { codeFrame } from '../../../src/lib/lang/errors';
import { Pad } from './pad';

/** [setup lines, bad line, message (exact or pattern), the text the span covers, code] */
const BAD: [string[], string, string | RegExp, string, ('limit' | 'language')?][] = [
	[[], 'darea l=-1', 'l must be > 0', '-1'],
	[[], 'sweep darea l=-1e308..1e308:5', 'the range is wider than double precision can step through', '-1e308..1e308:5'],
	[[], 'darea l=0', 'l must be > 0', '0'],
	[[], 'darea o=2', 'darea needs l=… (the strip width)', 'darea'],
	[[], 'darea ball', 'darea ball needs R=… (the ball radius)', 'darea ball'],
	[[], 'width l=1', "width takes no key 'l'", 'l'],
	[[], 'darea l=0.3 gap=1', "darea takes no key 'gap'", 'gap'],
	[[], 'darea l=0.3 R=1', "darea strip takes no key 'R'", 'R'],
	[[], 'darea l=0.3 v=0.5', "key 'v' does not apply to bulk 'brane'", 'v'],
	[[], 'stress pair', 'stress takes no subject', 'pair'],
	[[], 'darea pair l=1', "darea has no form 'pair'", 'pair'],
	[[], 'darea l=0.3 d=11', 'd must be ≤ 10', '11'],
	[[], 'darea l=0.3 d=2.5', 'd must be a whole number', '2.5'],
	[[], 'darea l=0.3 o=2.5', 'order must be a whole number ≥ 0 or exact', '2.5'],
	[[], 'darea l=0.3 o=1,13,exact', 'order must be ≤ 12', '13', 'limit'],
	[[], 'darea l=0.3 o=-1', 'order must be ≥ 0', '-1'],
	[[], 'use boosted d=4 v=1.2', 'v must satisfy |v| < 1', '1.2'],
	[[], 'use boosted d=2', 'd must be ≥ 3 for a boost along a transverse direction', '2'],
	[['use boosted d=4 v=0.6'], 'darea l=0.3 v=-1', 'v must satisfy |v| < 1', '-1'],
	[['use boosted d=4 v=0.6'], 'darea l=0.3 v=0..1:3', 'v must satisfy |v| < 1 (at v=1)', '0..1:3'],
	[[], 'use charged q=2', 'q must satisfy q² ≤ d/(d−2) = 2 (the extremal brane)', '2'],
	[[], 'use brane q=1', "key 'q' does not apply to bulk 'brane'", 'q'],
	[[], 'use brane d=1..3', 'use takes one value per key', '1..3'],
	[[], 'units cft', 'units cft needs c=…', 'cft'],
	[[], 'units geo N=3', "units geo takes G=…, not 'N'", 'N'],
	[[], 'units cft c=12; entropy l=0.5', "units cft needs d = 2 in the pad's bulk", 'entropy'],
	[[], 'coeffs darea', 'coeffs needs a whole order, e.g. o=4', 'coeffs darea'],
	[[], 'coeffs darea o=exact', 'coeffs needs a whole order, e.g. o=4', 'exact'],
	[[], 'coeffs darea o=2,3', 'coeffs shows one series: give one value of each key', '2,3'],
	[[], 'validity o=exact', 'validity needs a whole order, e.g. o=4', 'exact'],
	[[], 'darea l=0.1,0.2 zh=1,2', "only one key may take several values on a line ('zh' already does)", '0.1,0.2'],
	[[], 'darea l=0.1..1:1', 'the number of range points must be a whole number ≥ 2', '1'],
	[[], 'darea l=0.1..1:2.5', 'the number of range points must be a whole number ≥ 2', '2.5'],
	[[], 'darea l=0.1..1:5000', 'a range of 5000 points is more than the 2000 allowed', '5000', 'limit'],
	[[], 'darea l=0.1..1:1000 o=1,2,exact', 'this line asks for 3000 points; at most 2000 sweep points are allowed', '0.1..1:1000', 'limit'],
	[
		[],
		'darea l=0.1..1:1000; darea l=0.1..1:1001',
		'this line asks for 2001 points; at most 2000 sweep points are allowed',
		'0.1..1:1001',
		'limit'
	],
	[[], 'darea l=x', "unknown name 'x'", 'x'],
	[[], 'darea l=zhh', "unknown name 'zhh' — did you mean 'zh'?", 'zhh'],
	[[], 'darea l=#3', 'no step #3 in this pad', '#3'],
	[['thermo'], '#1 + 1', 'step #1 has no single value', '#1'],
	[['thermo'], '#1.t', "step #1 has no field 't' — did you mean 'T'?", '#1.t'],
	[[], 'sqrt(-2)', 'arithmetic gives a complex number', 'sqrt(-2)'],
	[[], 'let x = use brane', "'use' gives no value to keep", 'use'],
	[['use metric d=4 f="1 - z^2 - z^4"'], 'darea l=0.3 o=2', /^the area has a log divergence from the z\^2 terms/, 'darea'],
	[[], 'use metric d=4 f="2 - z"', /^f\(0\) must be 1/, '"2 - z"'],
	[['use vacuum d=4'], 'firstlaw ball R=0.5', 'firstlaw ball needs a bulk with a horizon (brane)', 'firstlaw']
];

describe('evaluation errors point at the offending characters', () => {
	it.each(BAD)('%j then %s', (setup, line, message, covers, code) => {
		const p = new Pad();
		for (const s of setup) p.run(s);
		const e = p.fail(line);
		const frame = codeFrame(line, e);
		if (typeof message === 'string') expect(e.message, frame).toBe(message);
		else expect(e.message, frame).toMatch(message);
		expect(line.slice(e.start, e.end), frame).toBe(covers);
		expect(e.code).toBe(code ?? 'language');
	});

	it('an error leaves the pad as it was', () => {
		const p = new Pad();
		p.run('use boosted d=4 v=0.6');
		p.fail('use vacuum d=3; darea l=-1');
		expect(p.ctx.bulk).toEqual({ name: 'boosted', params: { d: 4, zh: 1, v: 0.6 } });
	});

	it('suggests the fix in the hint', () => {
		const e = new Pad().fail('darea l=0.3 v=0.5');
		expect(e.hint).toMatch(/use boosted/);
		expect(new Pad().fail('darea l=0.3 o=13').hint).toBe('the order limit is 12');
	});
});

describe('macros', () => {
	const macros = {
		// five's header declares that it leaves the pad in its bulk; twice declares nothing
		five: { params: { l: '0.3', o: 'exact' }, body: ['use brane d=5 zh=1', 'darea l={l} o={o}'], effects: ['bulk' as const] },
		twice: { params: {}, body: ['@five l=0.2', '@five l=0.4 o=2'] },
		loop: { params: {}, body: ['@loop'] },
		broken: { params: { l: '' }, body: ['darea l={l} gap=1'] },
		typo: { params: {}, body: ['darea l={w}'] }
	};

	it('expands the body with parameters; keys override defaults; results come in order', async () => {
		const p = new Pad({ macros });
		const out = p.run('@five l=0.25');
		expect(out.results.map((r) => r.kind)).toEqual(['note', 'scalar']);
		const holo = await import('../../../src/lib/holo/index');
		expect(out.results[1]).toMatchObject({ value: holo.deltaArea(holo.makeBulk('brane', { d: 5, zh: 1 }), 0.25), order: 'exact' });
		expect(out.bulk).toEqual({ name: 'brane', params: { d: 5, zh: 1 } });
		expect(out.ref.fields.l).toBe(0.25);
		const two = new Pad({ macros }).run('@twice');
		expect(two.results.map((r) => r.kind)).toEqual(['note', 'scalar', 'note', 'scalar', 'note']);
		expect(two.results[3]).toMatchObject({ order: 2, fields: { l: 0.4 } });
		// twice declares no effects: the d=5 bulk its inner calls left is put back, and it says so
		expect(two.bulk).toEqual({ name: 'brane', params: { d: 4, zh: 1 } });
		expect(two.results[4]).toEqual({ kind: 'note', text: "@twice ran in its own scope: the pad's bulk is as before" });
	});

	it('guards recursion with the macro depth limit', () => {
		const e = new Pad({ macros }).fail('@loop');
		expect(e.code).toBe('limit');
		expect(e.message).toBe('in @loop, line 1: in @loop, line 1: in @loop, line 1: in @loop, line 1: macros nest more than 4 deep');
		expect([e.start, e.end]).toEqual([0, 5]);
	});

	it('errors name the macro, the body line and point at the call', () => {
		const p = new Pad({ macros });
		const a = p.fail('@broken l=0.3');
		expect(a.message).toBe("in @broken, line 1: darea takes no key 'gap'");
		expect(a.hint).toBe('@broken line 1: darea l=0.3 gap=1');
		expect([a.start, a.end]).toEqual([0, 13]);
		expect(p.fail('@broken').message).toBe('@broken needs l=…');
		expect(p.fail('@five q=1').message).toBe("macro '@five' has no parameter 'q'");
		expect(p.fail('@fiv').message).toBe("unknown macro '@fiv' — did you mean '@five'?");
		expect(p.fail('@typo').message).toBe("macro '@typo' line 1 uses {w}, which is not one of its parameters");
	});
});

describe('compare <dataset>', () => {
	const ls = [0.1, 0.3, 0.5];
	it('puts the dataset beside the engine and checks the difference', async () => {
		const holo = await import('../../../src/lib/holo/index');
		const b = holo.makeBulk('brane', { d: 4, zh: 1 });
		const good = { columns: ['l', 'darea'], rows: ls.map((l) => [l, holo.deltaArea(b, l) * (1 + 1e-9)]) };
		const bad = { columns: ['l', 'mine'], rows: ls.map((l) => [l, holo.deltaArea(b, l) + 1e-3]) };
		const p = new Pad({ datasets: { good, bad } });
		const out = p.run('compare good');
		const [t, c] = out.results as [import('../../../src/lib/lang/result').TableResult, import('../../../src/lib/lang/result').CheckResult];
		expect(t.columns).toEqual(['l', 'engine', 'dataset', 'diff']);
		expect(t.rows.map((r) => r[1])).toEqual(ls.map((l) => holo.deltaArea(b, l)));
		expect(t.plot).toMatchObject({ x: 'l', dataset: 'good', show: true });
		expect(c).toMatchObject({ kind: 'check', pass: true });
		const out2 = p.run('compare bad darea o=exact');
		expect(out2.results[1]).toMatchObject({ kind: 'check', pass: false });
		// the residual is relative: the largest |diff|/|engine|, here at the smallest width
		const worst = Math.max(...ls.map((l) => 1e-3 / Math.abs(holo.deltaArea(b, l))));
		expect((out2.results[1] as { residual: number }).residual).toBeCloseTo(worst, 12);
		expect(out2.ref.fields.max_abs_diff).toBeCloseTo(1e-3, 12);
		expect(p.fail('compare bd').message).toBe("unknown dataset 'bd' — did you mean 'bad'?");
		expect(p.fail('compare bad').message).toBe('say which quantity to compare: compare <dataset> <verb>, e.g. compare mydata darea');
		expect(p.fail('compare bad thermo').message).toBe(
			'compare works with verbs that give one number (darea, area, entropy, …), not thermo'
		);
		expect(p.fail('compare bad darea y="nope"').message).toBe("dataset 'bad' has no column 'nope'");
	});
});
