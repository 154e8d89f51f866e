import { describe, it, expect } from 'vitest';
import { EXACT_ORDER, exactLatex, computeExactLatex } from '../../../src/lib/holo/series/exact-latex';
import packed from '../../../src/lib/holo/series/boosted-latex.json';
import { packBoostedRow, unpackBoostedRow } from '../../../src/lib/holo/series/boosted-latex';

// The boosted brane's exact LaTeX is served from a table written by scripts/gen-series-latex.ts; these checks
// recompute entries from the algebra, so a change to series/exact*.ts that is not followed by regenerating the
// table fails here (run: node --import tsx scripts/gen-series-latex.ts).
describe('boosted LaTeX table', () => {
	it('covers d = 3…10 to the exact order', () => {
		for (let d = 3; d <= 10; d++)
			expect(unpackBoostedRow(d, (packed as Record<string, string>)[d]!).length, `d=${d}`).toBe(EXACT_ORDER.boosted);
	});

	it('packs exactly: every row round-trips, and packing the algebra gives the stored row (d = 3)', () => {
		for (let d = 3; d <= 10; d++) {
			const row = unpackBoostedRow(d, (packed as Record<string, string>)[d]!);
			expect(packBoostedRow(d, row), `d=${d}`).toBe((packed as Record<string, string>)[d]);
			expect(
				row.every((t) => t.includes('\\mathrm{B}(\\tfrac{') && !/[#~|<>]/.test(t)),
				`d=${d}`
			).toBe(true);
		}
		const fromAlgebra = Array.from({ length: EXACT_ORDER.boosted }, (_, i) => computeExactLatex(3, 'boosted', i + 1));
		expect(packBoostedRow(3, fromAlgebra)).toBe((packed as Record<string, string>)[3]);
		expect(() => packBoostedRow(4, ['a # b'])).toThrow(/'#' occurs/);
	});

	it('equals the algebra for d = 3, 4 to order 12 and d = 7 to order 6', () => {
		for (const [d, n] of [
			[3, 12],
			[4, 12],
			[7, 6]
		]) {
			for (let k = 1; k <= n; k++) expect(exactLatex(d, 'boosted', k), `d=${d} k=${k}`).toBe(computeExactLatex(d, 'boosted', k));
		}
	}, 120_000);

	it('is not used past its order or for other bulks', () => {
		expect(exactLatex(4, 'brane', 3)).toBe(computeExactLatex(4, 'brane', 3));
		expect(() => exactLatex(4, 'boosted', 13)).toThrow(/order 12/);
	});
});
