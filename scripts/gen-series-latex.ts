// Writes src/lib/holo/series/boosted-latex.json: the exact LaTeX of the boosted brane's a_1..a_12(κ) for d = 3…10,
// the orders and dimensions the language allows (exact-latex.ts's EXACT_ORDER), so a first request does not pay
// for the BigInt algebra (~0.1–0.5 s per d). Each d's row is packed into one string (series/boosted-latex.ts says
// how and why). Run after a change to src/lib/holo/series/exact*.ts:
//   node --import tsx scripts/gen-series-latex.ts
// tests/unit/holo/series-latex-table.test.ts recomputes entries and fails when the table is stale.
import { writeFileSync } from 'node:fs';
import { EXACT_ORDER, computeExactLatex } from '../src/lib/holo/series/exact-latex';
import { packBoostedRow } from '../src/lib/holo/series/boosted-latex';

const table: Record<string, string> = {};
for (let d = 3; d <= 10; d++) {
	const row: string[] = [];
	for (let k = 1; k <= EXACT_ORDER.boosted; k++) row.push(computeExactLatex(d, 'boosted', k));
	table[d] = packBoostedRow(d, row);
}
writeFileSync('src/lib/holo/series/boosted-latex.json', JSON.stringify(table) + '\n');
