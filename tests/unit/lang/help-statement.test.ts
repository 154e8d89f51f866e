import { describe, expect, it } from 'vitest';
import { parse } from '../../../src/lib/lang/parser';
import { verbSpec } from '../../../src/lib/lang/verbs/index';
import { Pad } from './pad';

const texts = (line: string) => new Pad().run(line).results.map((r) => (r.kind === 'note' ? r.text : ''));

describe('help and ?word', () => {
	it('help darea and ?darea answer the verb registry: forms, method, accuracy, source, two examples', () => {
		const spec = verbSpec('darea')!;
		for (const line of ['help darea', '?darea', '? darea']) {
			const t = texts(line);
			expect(t[0]).toBe(`darea (verb): ${spec.help.summary}`);
			expect(t.find((x) => x.startsWith('forms: '))).toContain('darea strip l=… o=…');
			expect(t).toContain(`method: ${spec.help.method}`);
			expect(t).toContain(`accuracy: ${spec.help.accuracy}`);
			expect(t).toContain(`source: ${spec.help.source}`);
			expect(t).toContain(`examples: ${spec.help.examples.slice(0, 2).join('  ·  ')}`);
		}
	});
	it('explains bulks and keys too, lists the verbs with no word, and suggests for a typo', () => {
		expect(texts('?boosted')[0]).toMatch(/^boosted \(bulk\): /);
		expect(texts('help')[0]).toMatch(/^verbs: .*darea/);
		const e = new Pad().fail('?dara');
		expect(e.message).toBe("no help for 'dara' — did you mean 'darea'?");
		expect('?dara'.slice(e.start, e.end)).toBe('dara');
		expect(() => parse('?')).toThrow('Expected a word to explain, e.g. ?darea, found end of line');
	});
});

describe('the decimal comma', () => {
	it('l=0,4 points at the value and says to write l=0.4', () => {
		const e = new Pad().fail('darea l=0,4 o=2');
		expect(e.message).toBe('l=0,4 is a list of 0 and 4: l takes a decimal point');
		expect(e.hint).toBe('write l=0.4 (a comma separates list items)');
		expect('darea l=0,4 o=2'.slice(e.start, e.end)).toBe('0,4');
	});
	it('real lists still parse: orders, spaced lists, and keys where 0 is meaningful', () => {
		for (const line of ['darea l=0.4 o=0,2', 'darea l=0, 4', 'sweep darea l=0.3 v=0,5', 'darea l=0.1,0.4'])
			expect(() => parse(line), line).not.toThrow();
	});
});
