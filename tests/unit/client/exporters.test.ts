import { describe, expect, it } from 'vitest';
import { escapeTex, texNumber, toCsv, toLatexTable } from '../../../src/lib/client/exporters';
import { figureOfTable } from '../../../src/lib/client/figure/spec';
import { figurePgf } from '../../../src/lib/client/figure/pgf';

const table = {
	kind: 'table' as const,
	label: 'ΔA boosted',
	columns: ['l', 'o1', 'exact'],
	rows: [
		[0.1, 1.2345678901234e-5, 1.2e-5],
		[0.2, 0.000321, null],
		[0.3, 'n/a', 0.004]
	]
};

describe('toCsv', () => {
	it('writes a header and full-precision numbers, empty for missing', () => {
		expect(toCsv(table)).toBe('l,o1,exact\r\n0.1,0.000012345678901234,0.000012\r\n0.2,0.000321,\r\n0.3,n/a,0.004\r\n');
	});
	it('quotes cells with commas and quotes', () => {
		expect(toCsv({ columns: ['a,b', 'c"d'], rows: [['x', 1]] })).toBe('"a,b","c""d"\r\nx,1\r\n');
	});
});

describe('LaTeX', () => {
	it('escapes the specials', () => {
		expect(escapeTex('a_b & 50% #1 {x} ~^\\')).toBe('a\\_b \\& 50\\% \\#1 \\{x\\} \\textasciitilde{}\\textasciicircum{}\\textbackslash{}');
	});
	it('writes exponents as powers of ten', () => {
		expect(texNumber(1.5e-7)).toBe('1.5\\times 10^{-7}');
		expect(texNumber(0.25)).toBe('0.25');
		expect(texNumber(null)).toBe('--');
	});
	it('makes a tabular with order titles', () => {
		const t = toLatexTable(table);
		expect(t).toContain('\\begin{tabular}{rrr}');
		expect(t).toContain('l & order 1 & exact \\\\');
		expect(t).toContain('$0.1$ & $1.2345679\\times 10^{-5}$ & $1.2\\times 10^{-5}$ \\\\');
		expect(t.trim().endsWith('\\end{tabular}')).toBe(true);
	});
});

describe('figurePgf', () => {
	it('draws one \\addplot per order column, with log modes and validity', () => {
		const f = figureOfTable({ ...table, plot: { x: 'l', validity: { o1: 0.25 } } }, { logX: true, logY: true });
		const s = figurePgf(f);
		expect(s.match(/\\addplot\[/g)).toHaveLength(2);
		expect(s).toContain('xmode=log');
		expect(s).toContain('ymode=log');
		expect(s).toContain('\\legend{{$\\mathrm{order}\\;1$}, {$\\mathrm{exact}$}}');
		expect(s).toContain('{axis cs:0.25,1}');
		// a string cell and a missing value are skipped, not plotted as 0
		expect(s).not.toContain('(0.3,n/a)');
		expect(s).not.toContain('(0.2,)');
		expect(s.split('\\begin{tikzpicture}')).toHaveLength(2);
	});
});
