import { describe, expect, it } from 'vitest';
import { parse } from '../../../src/lib/lang/parser';
import { printLine } from '../../../src/lib/lang/printer';
import { Pad } from './pad';

describe('plot #9 #35: a figure of earlier steps', () => {
	it('parses whole-step references and label keys, and prints back', () => {
		const line = parse('plot #2 #5 ylabel="\\Delta A/\\ell^2"');
		const s = line.statements[0]!;
		expect(s).toMatchObject({ type: 'plot', refs: [{ step: 2 }, { step: 5 }] });
		// printed back, it means the same (the printer doubles backslashes, the lexer reads them back)
		expect(parse(printLine(line)).statements[0]).toMatchObject({ keys: [{ key: 'ylabel', value: { value: '\\Delta A/\\ell^2' } }] });
		// `plot` after a pipe is still the sink
		expect(parse('sweep darea l=0.1..0.5:5 | plot').statements[0]).toMatchObject({ type: 'verb', sinks: [{ text: 'plot' }] });
	});
	it('refuses what a figure cannot draw, pointing at it', () => {
		const cases: [string, string, string][] = [
			['plot', 'Expected the steps to plot, e.g. plot #9 #35, found end of line', ''],
			['plot #2.T', 'plot takes whole steps: #2, not #2.T', '#2.T'],
			['plot #2 #2', 'step #2 is given twice', '#2'],
			['let fig = plot #1', 'nothing to keep', 'plot #1']
		];
		for (const [input, message, at] of cases) {
			let err: { message: string; start: number; end: number } | undefined;
			try {
				parse(input);
			} catch (e) {
				err = e as typeof err;
			}
			expect(err?.message, input).toBe(message);
			if (at) expect(input.slice(err!.start, err!.end), input).toBe(at);
		}
	});
	it('answers a figure naming steps that exist in the pad; a missing step is an error at its reference', () => {
		const p = new Pad();
		p.run('sweep darea l=0.1..0.5:5 o=1,exact');
		p.run('use boosted d=4 zh=1 v=0.5');
		p.run('sweep darea l=0.1..0.5:5 o=exact');
		const out = p.run('plot #1 #3 xlabel="\\ell/z_h"');
		expect(out.results).toEqual([{ kind: 'figure', label: 'figure of #1, #3', steps: [1, 3], xlabel: '\\ell/z_h' }]);
		const e = p.fail('plot #1 #9');
		expect(e.message).toBe('no step #9 in this pad to plot');
		expect('plot #1 #9'.slice(e.start, e.end)).toBe('#9');
		expect(p.fail('plot #1 colour="red"').message).toBe('plot takes xlabel="…" and ylabel="…", not colour');
		expect(p.fail('plot #1 xlabel=3').message).toBe('xlabel is LaTeX in quotes, e.g. xlabel="\\Delta A"');
	});
});
