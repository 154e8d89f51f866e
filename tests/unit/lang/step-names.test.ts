// Step names (`#btz`) and the units note of `use`: the language side of the pad as a working document.
import { describe, expect, it } from 'vitest';
import { Pad } from './pad';
import { parse } from '../../../src/lib/lang/parser';
import { printExpr } from '../../../src/lib/lang/printer';
import { unitsAfterUse } from '../../../src/lib/lang/units-note';
import type { ArithStmt } from '../../../src/lib/lang/ast';

describe('step names', () => {
	it('lexes #name and #name.field as references that keep the name', () => {
		const s = parse('#btz.T * 2 + #3').statements[0] as ArithStmt;
		expect(printExpr(s.expr)).toBe('#btz.T * 2 + #3');
	});

	it('reads a named step through the pad context, whatever its number', () => {
		const pad = new Pad();
		const a = pad.run('darea l=0.3');
		pad.run('darea l=0.6');
		pad.ctx.names = { btz: 1 };
		expect(pad.run('#btz / 2').results[0]).toMatchObject({ kind: 'scalar', value: a.ref.value! / 2 });
		// the name follows its step: after a renumbering the same name reads the new number
		pad.ctx.names = { btz: 2 };
		expect(pad.run('#btz').results[0]).toMatchObject({ value: pad.steps[1]!.ref.value });
	});

	it('names and fields do not collide: a name with _ and a field are told apart', () => {
		const pad = new Pad();
		pad.run('tent l=0.4 o=2');
		pad.run('darea l=0.2');
		pad.ctx.names = { a: 1, a_b: 2 };
		const both = pad.run('#a_b + #a').results[0] as { value: number };
		expect(both.value).toBeCloseTo(pad.steps[1]!.ref.value! + pad.steps[0]!.ref.value!, 14);
	});

	it('says which names exist when one is unknown, pointing at the reference', () => {
		const pad = new Pad();
		pad.run('darea l=0.3');
		pad.ctx.names = { btz: 1 };
		const e = pad.fail('2 * #bzt');
		expect(e.message).toMatch(/no step named #bzt.*did you mean 'btz'/);
		expect([e.start, e.end]).toEqual([4, 8]);
	});

	it('still asks for a number or a name after #', () => {
		expect(() => parse('# 3')).toThrow(/step number or name after '#'/);
	});
});

describe('units across use', () => {
	it('notes that cft units do not fit a d = 4 bulk and offers geo units with the same G', () => {
		const pad = new Pad();
		pad.run('use vacuum d=2');
		pad.run('units cft c=12');
		const out = pad.run('use boosted d=4 v=0.3');
		const note = out.results.find((r) => r.kind === 'note' && r.fix) as { text: string; fix: string };
		expect(note.text).toMatch(/d = 2.*d = 4/);
		// Brown–Henneaux: c = 3/(2G) → G = 3/(2·12) = 0.125 (Commun. Math. Phys. 104 (1986) 207)
		expect(note.fix).toBe('units geo G=0.125');
		// the offered line really makes entropies run again, with the same G
		pad.run(note.fix);
		expect(pad.run('entropy l=0.3').results[0]!.kind).toBe('scalar');
	});

	it('says nothing when the units fit the new bulk', () => {
		expect(unitsAfterUse({ system: 'geo', G: 1 }, 4)).toBeUndefined();
		expect(unitsAfterUse({ system: 'sym', N: 3 }, 4)).toBeUndefined();
		// N = 4 SYM: L³/G₅ = 2N²/π → G = π/(2N²) (Gubser, Klebanov & Peet 1996)
		expect(unitsAfterUse({ system: 'sym', N: 3 }, 3)?.fix).toBe(`units geo G=${Number((Math.PI / 18).toPrecision(12))}`);
	});
});
