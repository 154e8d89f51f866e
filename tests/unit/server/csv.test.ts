import { describe, expect, it } from 'vitest';
import { CSV_MAX_COLUMNS, CSV_MAX_ROWS, CsvProblem, parseNumber, parseNumericCsv } from '../../../src/lib/server/csv';

function problemOf(text: string): CsvProblem {
	try {
		parseNumericCsv(text);
	} catch (e) {
		if (e instanceof CsvProblem) return e;
		throw e;
	}
	throw new Error(`expected a CsvProblem for ${JSON.stringify(text.slice(0, 60))}`);
}

describe('parseNumber', () => {
	it.each([
		['0.25', 0.25],
		['-3', -3],
		['+2.5e-3', 2.5e-3],
		['.5', 0.5],
		['7.', 7],
		['  1e3 ', 1000]
	])('reads %j as %d', (cell, value) => expect(parseNumber(cell)).toBe(value));

	it.each(['', ' ', 'abc', '0x1f', 'Infinity', 'NaN', '1,5', '1e', '--1', '1e999'])('refuses %j', (cell) =>
		expect(parseNumber(cell)).toBeNull()
	);
});

describe('parseNumericCsv', () => {
	it('reads a header and numeric rows, with or without a trailing newline, CRLF and a BOM', () => {
		const want = {
			columns: ['l', 'darea'],
			rows: [
				[0.1, -0.002],
				[0.2, -0.017]
			]
		};
		expect(parseNumericCsv('l,darea\n0.1,-0.002\n0.2,-0.017\n')).toEqual(want);
		expect(parseNumericCsv('l,darea\r\n0.1,-0.002\r\n0.2,-0.017')).toEqual(want);
		expect(parseNumericCsv('\ufeffl,darea\n0.1,-0.002\n\n0.2,-0.017\n\n')).toEqual(want);
		expect(parseNumericCsv(' l , darea \n"0.1",-0.002\n0.2,-0.017')).toEqual(want);
	});

	it('detects semicolons and tabs as separators', () => {
		expect(parseNumericCsv('l;darea\n0.1;2\n0.2;3').rows).toEqual([
			[0.1, 2],
			[0.2, 3]
		]);
		expect(parseNumericCsv('l\tdarea\n0.1\t2\n0.2\t3').columns).toEqual(['l', 'darea']);
	});

	it.each([
		[
			'a bad cell, by row, line and column',
			'l,darea\n0.1,1\n\n0.3,oops\n',
			{ row: 2, line: 4, column: 'darea' },
			/row 2 \(line 4\), column 'darea': 'oops' is not a number/
		],
		['an empty cell', 'l,darea\n0.1,\n', { row: 1, column: 'darea' }, /an empty cell/],
		['a ragged row', 'l,darea\n0.1,1\n0.2\n', { row: 2, line: 3 }, /row 2 \(line 3\) has 1 cells; the header has 2 columns/],
		['a header of numbers', '0.1,0.2\n0.3,0.4\n', { line: 1 }, /must name the columns/],
		['a repeated column', 'l,l\n1,2\n', { column: 'l' }, /appears twice/],
		['an unnamed column', 'l,\n1,2\n', { line: 1 }, /column 2 has no name/],
		['no rows', 'l,darea\n', {}, /no rows/],
		['an empty file', '', {}, /empty/],
		['binary content', '\u0089PNG\r\n\u001a\n\u0000\u0000', {}, /not plain text/]
	])('refuses %s', (_what, text, where, message) => {
		const p = problemOf(text);
		expect(p.message).toMatch(message);
		expect(p.where).toMatchObject(where);
	});

	it('holds the column and row limits exactly', () => {
		const cols = (n: number) => Array.from({ length: n }, (_, i) => `c${i}`).join(',') + '\n' + Array(n).fill('1').join(',');
		expect(parseNumericCsv(cols(CSV_MAX_COLUMNS)).columns).toHaveLength(CSV_MAX_COLUMNS);
		expect(problemOf(cols(CSV_MAX_COLUMNS + 1)).message).toMatch(/at most 20 are allowed/);
		const rows = (n: number) => 'l\n' + '1\n'.repeat(n);
		expect(parseNumericCsv(rows(CSV_MAX_ROWS)).rows).toHaveLength(CSV_MAX_ROWS);
		expect(problemOf(rows(CSV_MAX_ROWS + 1)).message).toMatch(/at most 20000 are allowed/);
	});
});
