/**
 * A macro runs in its own scope: `#k` in its body is its own line k, the pad's lets are invisible, its lets
 * stay inside, and the pad's bulk and units are put back unless its header declares them. Values are checked
 * against the same lines typed directly (common practice: the macro must be exactly its body).
 */
import { describe, expect, it } from 'vitest';
import { Pad } from './pad';

const macros = {
	// a check in the spirit of the report: its line 3 compares its own lines 1 and 2
	selfcheck: { params: { l: '0.4' }, body: ['darea l={l}', 'darea l={l} o=exact', '#2 - #1'] },
	setter: { params: { zh: '2' }, body: ['use brane d=3 zh={zh}', 'units cft c=3'], effects: ['bulk' as const] },
	quiet: { params: {}, body: ['use vacuum d=3', 'units geo G=2', 'let inner = 5'] },
	leaky: { params: {}, body: ['w * 2'] },
	hostref: { params: {}, body: ['darea l=#1'] },
	onearg: { params: { l: '0.3' }, body: ['darea l={l}'] }
};

describe('a macro in its own scope', () => {
	it("reads its own lines for #k, never the host pad's steps", () => {
		const p = new Pad({ macros });
		p.run('darea l=0.9'); // the host pad's #1 and #2: values a leaking macro would pick up
		p.run('darea l=1.3');
		const out = p.run('@selfcheck l=0.4');
		const direct = new Pad();
		const a = direct.run('darea l=0.4').ref.value!;
		const b = direct.run('darea l=0.4 o=exact').ref.value!;
		expect(out.ref.value).toBe(b - a);
		expect(out.ref.value).toBe(0); // the default order is exact, so the check is exactly zero
	});

	it("cannot read the pad's steps or lets at all (if a body slipped past the library check)", () => {
		const p = new Pad({ macros });
		p.run('darea l=0.5');
		p.run('let w = 3');
		expect(p.fail('@hostref').message).toBe('in @hostref, line 1: no step #1 in this pad');
		expect(p.fail('@leaky').message).toMatch(/^in @leaky, line 1: unknown name 'w'/);
	});

	it('puts the bulk and units back unless declared, and keeps its lets to itself', () => {
		const p = new Pad({ macros });
		p.run('use boosted d=4 zh=1 v=0.5');
		p.run('units geo G=3');
		const q = p.run('@quiet');
		expect(q.bulk).toEqual({ name: 'boosted', params: { d: 4, zh: 1, v: 0.5 } });
		expect(q.units).toEqual({ system: 'geo', G: 3 });
		expect(q.lets).not.toHaveProperty('inner');
		expect(q.results.at(-1)).toEqual({ kind: 'note', text: "@quiet ran in its own scope: the pad's bulk and units are as before" });

		const s = p.run('@setter zh=2');
		expect(s.bulk).toEqual({ name: 'brane', params: { d: 3, zh: 2 } }); // declared
		expect(s.units).toEqual({ system: 'geo', G: 3 }); // not declared: put back
		expect(s.results.at(-1)).toEqual({ kind: 'note', text: "@setter ran in its own scope: the pad's units is as before" });
	});

	it("evaluates a call's #n and names in the caller's scope, before the body runs", () => {
		const p = new Pad({ macros });
		p.run('let w = 0.35');
		p.run('2 * 0.2'); // #2 = 0.4
		const viaRef = p.run('@onearg l=#2');
		const viaName = p.run('@onearg l=w');
		const direct = new Pad();
		expect(viaRef.ref.value).toBe(direct.run('darea l=0.4').ref.value);
		expect(viaName.ref.value).toBe(direct.run('darea l=0.35').ref.value);
	});
});
