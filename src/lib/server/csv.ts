/**
 * Reads an uploaded CSV into numeric columns for `compare <dataset>`. The first row names the columns; every
 * other cell must be a plain decimal number. Problems are reported with the file's line number and the
 * column's name, because that is what the uploader sees in their editor.
 */
import Papa from 'papaparse';

export const CSV_MAX_COLUMNS = 20;
export const CSV_MAX_ROWS = 20_000;
export const COLUMN_NAME_MAX = 40;

export interface NumericTable {
	columns: string[];
	rows: number[][];
}

export class CsvProblem extends Error {
	constructor(
		message: string,
		public where: { line?: number; row?: number; column?: string } = {}
	) {
		super(message);
	}
}

/** Decimal numbers only: `Number()` alone would also take '', '0x1f', 'Infinity' and ' '. */
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;

export function parseNumber(cell: string): number | null {
	const t = cell.trim();
	if (!DECIMAL.test(t)) return null;
	const n = Number(t);
	return Number.isFinite(n) ? n : null;
}

const show = (cell: string) => (cell.trim() === '' ? 'an empty cell' : `'${cell.length > 24 ? cell.slice(0, 24) + '…' : cell}'`);

/** Looks like text, not a binary file renamed to .csv. */
export function looksLikeText(text: string): boolean {
	// eslint-disable-next-line no-control-regex -- control characters are exactly what marks a binary file
	return !/[\u0000-\u0008\u000e-\u001f\ufffd]/.test(text.slice(0, 65_536));
}

export function parseNumericCsv(text: string): NumericTable {
	if (!looksLikeText(text)) throw new CsvProblem('The file is not plain text: upload a CSV of numbers.');
	// no skipEmptyLines: keeping every record keeps its index equal to its line number (no quoted newlines in numbers)
	const parsed = Papa.parse<string[]>(text.replace(/^\ufeff/, ''), { header: false, delimiter: '', dynamicTyping: false });
	const fatal = parsed.errors.find((e) => e.type === 'Quotes');
	if (fatal) throw new CsvProblem(`line ${(fatal.row ?? 0) + 1}: ${fatal.message}`, { line: (fatal.row ?? 0) + 1 });

	const records = parsed.data.map((cells, i) => ({ cells, line: i + 1 })).filter((r) => r.cells.some((c) => c.trim() !== ''));
	const head = records.shift();
	if (!head) throw new CsvProblem('The file is empty: the first line names the columns, e.g. l,darea.');

	const columns = head.cells.map((c) => c.trim());
	if (columns.length > CSV_MAX_COLUMNS) {
		throw new CsvProblem(`The file has ${columns.length} columns; at most ${CSV_MAX_COLUMNS} are allowed.`, { line: head.line });
	}
	columns.forEach((name, i) => {
		if (name === '') throw new CsvProblem(`line ${head.line}: column ${i + 1} has no name.`, { line: head.line });
		if (name.length > COLUMN_NAME_MAX)
			throw new CsvProblem(`line ${head.line}: column name '${name.slice(0, 20)}…' is longer than ${COLUMN_NAME_MAX} characters.`, {
				line: head.line
			});
		if (parseNumber(name) !== null) {
			throw new CsvProblem(`line ${head.line}: the first line must name the columns (e.g. l,darea); found the number ${name}.`, {
				line: head.line,
				column: name
			});
		}
		if (columns.indexOf(name) !== i)
			throw new CsvProblem(`line ${head.line}: column '${name}' appears twice.`, { line: head.line, column: name });
	});

	if (records.length === 0) throw new CsvProblem('The file has a header but no rows of numbers.');
	if (records.length > CSV_MAX_ROWS) throw new CsvProblem(`The file has ${records.length} rows; at most ${CSV_MAX_ROWS} are allowed.`);

	// rows are counted from 1 below the header; the file's line is given too for editors that number lines
	const rows = records.map(({ cells, line }, i) => {
		const row = i + 1;
		if (cells.length !== columns.length) {
			throw new CsvProblem(
				`row ${row} (line ${line}) has ${cells.length} cells; the header has ${columns.length} columns (${columns.join(', ')}).`,
				{ line, row }
			);
		}
		return cells.map((cell, j) => {
			const n = parseNumber(cell);
			if (n === null)
				throw new CsvProblem(`row ${row} (line ${line}), column '${columns[j]}': ${show(cell)} is not a number.`, {
					line,
					row,
					column: columns[j]!
				});
			return n;
		});
	});
	return { columns, rows };
}
