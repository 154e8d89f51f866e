import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { complete } from '../../../src/lib/lang/complete';
import { help, helpEntries } from '../../../src/lib/lang/help';
import { BULKS, SINKS, verbNames } from '../../../src/lib/lang/vocab';
const VERBS = verbNames();

const inserts = (input: string, cursor?: number, cc = {}) => complete(input, cursor, cc).items.map((i) => i.insert);

describe('complete', () => {
	it('offers statements, verbs, macros and let-names at the start', () => {
		const all = inserts('', 0, { macros: ['five'], lets: ['area_fin'] });
		expect(all).toEqual(expect.arrayContaining(['use', 'sweep', ...VERBS, '@five', 'area_fin']));
		expect(inserts('dar')).toEqual(['darea']);
		expect(complete('dar').start).toBe(0);
	});
	it('offers bulks after use, verbs after sweep, sinks after |', () => {
		expect(inserts('use ')).toEqual([...BULKS]);
		expect(inserts('use bo')).toEqual(['boosted']);
		expect(inserts('sweep d')).toEqual(['darea', 'dentropy']);
		expect(inserts('darea l=1 | ')).toEqual([...SINKS]);
		expect(inserts('darea l=1 |t')).toEqual(['table', 'tex']);
	});
	it('offers the keys of the verb and of the bulk that are not given yet', () => {
		expect(inserts('darea l=0.3 ')).toEqual(['o=', 'd=', 'zh=']);
		expect(inserts('darea l=0.3 ', undefined, { bulk: 'boosted' })).toEqual(['o=', 'd=', 'zh=', 'v=', 'rapidity=']);
		expect(inserts('darea ')).toEqual(expect.arrayContaining(['strip', 'ball', 'l=']));
		expect(inserts('use boosted v=0.5 ')).toEqual(['d=', 'zh=', 'rapidity=']);
		expect(inserts('units cft ')).toEqual(['c=']);
	});
	it('offers orders after o= and inside a list, replacing only the last item', () => {
		expect(inserts('darea l=0.3 o=')).toEqual(['1', '2', '3', '4', 'exact']);
		const r = complete('darea l=0.3 o=1,2,ex');
		expect(r.items.map((i) => i.insert)).toEqual(['exact']);
		expect('darea l=0.3 o=1,2,ex'.slice(r.start, r.end)).toBe('ex');
	});
	it('works in the statement the cursor is in', () => {
		expect(inserts('use brane; th')).toEqual(['thermo']);
		expect(inserts('thermo; use ', 12)).toEqual([...BULKS]);
		expect(inserts('use metric f="a;b" ', undefined, { bulk: 'metric' })).toEqual(['d=', 'h=']);
	});
	it('gives one line of help with each candidate', () => {
		const c = complete('thermo').items;
		expect(c).toEqual([]);
		expect(complete('ther').items[0]).toEqual({ insert: 'thermo', label: 'thermo', detail: help('thermo')!.summary });
	});
});

describe('help', () => {
	it('has one line and an example for every verb, bulk and sink', () => {
		for (const name of [...VERBS, ...BULKS, ...SINKS]) {
			const h = help(name);
			expect(h, name).toBeDefined();
			expect(h!.summary.length).toBeGreaterThan(5);
			expect(h!.example).toMatch(/\S/);
		}
		expect(help('order')).toEqual(help('o'));
		expect(help('@anything')?.name).toBe('@macro');
		expect(helpEntries('verb')).toHaveLength(VERBS.length);
	});
	it('uses only the words of the product', () => {
		const text = JSON.stringify(helpEntries());
		expect(text).not.toMatch(/\b(cell|kernel|notebook|worksheet)s?\b/i);
	});
});

describe('the browser-facing modules stay small', () => {
	/** Follows relative imports from a module and lists every package it reaches (type-only imports are erased). */
	function packagesReached(file: string, seen = new Set<string>()): Set<string> {
		const pkgs = new Set<string>();
		if (seen.has(file)) return pkgs;
		seen.add(file);
		const src = readFileSync(file, 'utf8');
		for (const m of src.matchAll(/^\s*(?:import|export)(?!\s+type\b)[^'"]*from\s+'([^']+)'/gm)) {
			const spec = m[1]!;
			if (spec.startsWith('.')) for (const p of packagesReached(resolve(dirname(file), `${spec}.ts`), seen)) pkgs.add(p);
			else pkgs.add(spec);
		}
		return pkgs;
	}
	it.each(['complete', 'help'])('%s imports no package (no mathjs, no zod, no engine)', (name) => {
		const file = resolve(__dirname, `../../../src/lib/lang/${name}.ts`);
		expect([...packagesReached(file)]).toEqual([]);
	});
});
