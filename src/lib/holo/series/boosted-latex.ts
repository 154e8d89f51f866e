/**
 * The boosted brane's exact a_k LaTeX table (boosted-latex.json, written by scripts/gen-series-latex.ts), packed
 * and read lazily. Why: the table is ~4 MB of LaTeX, and as an object literal in the evaluation-process bundle it
 * was parsed at every fork whether or not a line ever asked for a boosted series. Packed, it is 8 strings (one
 * per d) a quarter of that size; a row is unpacked on its first use and kept.
 *
 * Packing (exact, checked by a round trip in the generator and in tests/unit/holo/series-latex-table.test.ts):
 * the Beta atom \mathrm{B}(\tfrac{s}{m},\tfrac{1}{2}) with m = 2(d−1) becomes '#' and the letter of s (A = 1), the
 * fraction reduced on unpacking as exact-latex.ts prints it; a few frequent macros become one character each,
 * and ^{n} becomes '~n' where no digit follows it. Every stand-in character is absent from the LaTeX (the packer
 * refuses otherwise); the a_k of one row are joined by '|'.
 */
import packed from './boosted-latex.json';

const MACROS: readonly (readonly [string, string])[] = [
	['\\left(', '<'],
	['\\right)', '>'],
	['\\kappa', 'K'],
	['\\pi', 'P'],
	['\\frac{', 'F']
];
const STAND_INS = ['#', '~', '|', ...MACROS.map(([, c]) => c)];

function gcd(a: number, b: number): number {
	while (b) [a, b] = [b, a % b];
	return a;
}

function betaAtom(s: number, m: number): string {
	const g = gcd(s, m);
	return `\\mathrm{B}(\\tfrac{${s / g}}{${m / g}},\\tfrac{1}{2})`;
}

/** One d's a_1..a_n LaTeX packed into one string; throws if the packing would not be exact. */
export function packBoostedRow(d: number, latex: readonly string[]): string {
	const m = 2 * (d - 1);
	const parts = latex.map((tex) => {
		for (const c of STAND_INS) if (tex.includes(c)) throw new Error(`packBoostedRow: '${c}' occurs in the LaTeX`);
		let out = tex;
		for (let s = d - 2; s >= 1; s--) out = out.split(betaAtom(s, m)).join(`#${String.fromCharCode(64 + s)}`);
		for (const [long, short] of MACROS) out = out.split(long).join(short);
		return out.replace(/\^\{(\d+)\}(?!\d)/g, '~$1');
	});
	const row = parts.join('|');
	const back = unpackBoostedRow(d, row);
	if (back.length !== latex.length || back.some((t, i) => t !== latex[i])) throw new Error(`packBoostedRow: d=${d} does not round-trip`);
	return row;
}

/** The inverse of packBoostedRow. */
export function unpackBoostedRow(d: number, row: string): string[] {
	const m = 2 * (d - 1);
	return row.split('|').map((p) => {
		// atoms first: their letters (A = 1 …) share the alphabet of the macros' stand-ins
		let out = p.replace(/~(\d+)/g, '^{$1}').replace(/#([A-Z])/g, (_, c: string) => betaAtom(c.charCodeAt(0) - 64, m));
		for (const [long, short] of MACROS) out = out.split(short).join(long);
		return out;
	});
}

const rows = new Map<number, string[]>();

/** The table's LaTeX of the boosted brane's a_k at dimension d, or undefined outside it (d = 3…10, k ≤ 12). */
export function boostedLatex(d: number, k: number): string | undefined {
	let row = rows.get(d);
	if (!row) {
		const text = (packed as Record<string, string | undefined>)[d];
		if (text === undefined) return undefined;
		row = unpackBoostedRow(d, text);
		rows.set(d, row);
	}
	return row[k - 1];
}

/** Forgets the unpacked rows (benchmarks time the first use). */
export function clearBoostedLatex(): void {
	rows.clear();
}
