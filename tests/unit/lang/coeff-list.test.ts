/**
 * `coeffs` for a paper: an aligned list, one coefficient per line, every symbol defined, and a plain-text form.
 * The numbers in the text form are the engine's own coefficients (holo.seriesCoeffs called directly).
 */
import { describe, expect, it } from 'vitest';
import katex from 'katex';
import * as holo from '../../../src/lib/holo/index';
import type { SeriesResult } from '../../../src/lib/lang/result';
import { safeMath } from '../../../src/lib/server/export/safe-math';
import { Pad } from './pad';

const series = (line: string) => new Pad().run(line).results.at(-1) as SeriesResult;
/** the list's lines: the aligned block split at its line breaks */
const lines = (r: SeriesResult) => r.list!.replace(/^\\begin\{aligned\}\n|\n\\end\{aligned\}$/g, '').split(' \\\\\n');

describe('coefficients as an aligned list', () => {
	it('boosted: one a_k per line, τ and κ = γ²v² defined with their values, B and every other symbol too', () => {
		const r = series('use boosted d=4 zh=1 v=0.6; coeffs darea o=4 | tex');
		expect(r.list).toMatch(/^\\begin\{aligned\}\n/);
		const ls = lines(r);
		expect(ls[0]).toBe('\\Delta A &= \\ell^{-2}\\sum_{k\\ge1} a_{k}\\,\\tau^{k}');
		for (let k = 1; k <= 4; k++) expect(ls.filter((l) => l.startsWith(`a_{${k}} &= `))).toHaveLength(1);
		const defs = ls.slice(ls.indexOf('&\\text{where}') + 1).join('\n');
		expect(defs).toContain('\\tau = (\\ell/z_h)^{4}');
		// κ = v²/(1−v²) = 0.36/0.64 = 0.5625 at v = 0.6 (common practice: γ² v²)
		expect(defs).toContain('\\kappa = \\gamma^{2}v^{2} = \\frac{v^{2}}{1-v^{2}} = 0.5625');
		expect(defs).toContain('\\mathrm{B}(x,y)');
		expect(defs).toContain('z_h');
		// every control word the coefficients use is defined or standard (π, fractions, spacing)
		const used = new Set(r.terms.flatMap((t) => t.latex.match(/\\[A-Za-z]+/g) ?? []));
		for (const w of used) expect(['\\frac', '\\mathrm', '\\tfrac', '\\pi', '\\left', '\\right', '\\kappa'], w).toContain(w);
	});

	it('the plain text carries each coefficient at full precision and the definitions, without TeX', () => {
		const r = series('use boosted d=4 zh=1 v=0.6; coeffs darea o=3');
		const c = holo.seriesCoeffs(holo.makeBulk('boosted', { d: 4, zh: 1, v: 0.6 }), 3);
		const text = r.text!;
		for (const t of c) expect(text).toContain(`a_${t.k} = ${t.value}\n`);
		expect(text).toContain('κ = γ²v² = v²/(1 − v²) = 0.5625');
		expect(text).toContain('τ = (ℓ/z_h)^4');
		expect(text).not.toMatch(/\\[a-z]/);
	});

	it('mixed powers (charged) name each power; the charge is defined by its f', () => {
		const r = series('use charged d=4 zh=1 q=0.5; coeffs darea o=2');
		expect(lines(r)[0]).toBe('\\Delta A &= \\ell^{-2}\\sum_{k\\ge1} a_{k}\\,(\\ell/z_h)^{p_k}');
		expect(r.list).toContain('(p_{2} = 6)');
		expect(r.list).toContain('q = 0.5');
		expect(r.text).toContain('(p_2 = 6)');
	});

	it('a metric names the formula its parameters come from', () => {
		const r = series('use metric d=4 f="1-m*z^4+q^2*z^6"; coeffs darea o=2');
		expect(r.list).toContain('\\text{parameters of }f(z) = 1-m\\,z^4+q^2\\,z^6');
		expect(r.text).toContain('f(z) = 1-m*z^4+q^2*z^6');
	});

	it('renders in KaTeX and passes the .tex export allow-list, for every bulk with a series', () => {
		for (const line of [
			'coeffs darea o=3',
			'use boosted d=4 zh=1 v=0.6; coeffs darea o=5',
			'use wave d=4 zp=1; coeffs darea o=2',
			'use charged d=5 zh=1 q=0.3; coeffs darea o=2',
			'use metric d=4 f="1-m*z^4+q^2*z^6"; coeffs darea o=2'
		]) {
			const r = series(line);
			expect(() => katex.renderToString(r.list!, { displayMode: true, throwOnError: true }), line).not.toThrow();
			expect(safeMath(r.list!), line).not.toBeNull();
		}
		// order 8 boosted is ~28 000 characters: KaTeX draws it, the .tex export's 20 000 cap (as for the one-line form) refuses it
		const big = series('use boosted d=4 zh=1 v=0.6; coeffs darea o=8');
		expect(() => katex.renderToString(big.list!, { displayMode: true, throwOnError: true })).not.toThrow();
	});
});
