// Shared by the bench scripts that time the pure engine: src/lib/holo bundled with esbuild (already in
// node_modules via vite) into one ES module, imported as the benches' `H`.
import { build } from 'esbuild';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

export const root = join(dirname(fileURLToPath(import.meta.url)), '../..');
const tmp = mkdtempSync(join(tmpdir(), 'bulkpad-bench-'));

/**
 * Bundles src/lib/holo of the tree at `dir` (this checkout, or a base ref extracted elsewhere) as `<name>.mjs`
 * with `extra` export lines appended, and imports it. Packages (mathjs) come from this checkout either way.
 */
export async function loadEngine(dir, name, extra = '') {
	const outfile = join(tmp, `${name}.mjs`);
	await build({
		stdin: { contents: `export * from './src/lib/holo/index.ts';${extra}`, resolveDir: dir, loader: 'ts' },
		bundle: true,
		format: 'esm',
		platform: 'neutral',
		mainFields: ['module', 'main'],
		outfile,
		nodePaths: [join(root, 'node_modules')],
		logLevel: 'error'
	});
	return import(pathToFileURL(outfile).href);
}

/** Median µs of repeated runs of `fn` after a JIT warm-up; prints the row as one JSON line unless `quiet`. */
export function bench(name, fn, { minRuns = 20, minMs = 400, quiet = false } = {}) {
	// warm-up (JIT): at least 5 calls and 200 ms, so the first row is not timed on colder code than the others
	const w0 = performance.now();
	for (let i = 0; i < 5 || performance.now() - w0 < 200; i++) fn();
	const times = [];
	const t0 = performance.now();
	while (times.length < minRuns || performance.now() - t0 < minMs) {
		const a = performance.now();
		fn();
		times.push((performance.now() - a) * 1000);
		if (times.length > 100000) break;
	}
	times.sort((x, y) => x - y);
	const r = { name, median_us: Number(times[times.length >> 1].toFixed(2)), runs: times.length };
	if (!quiet) console.log(JSON.stringify(r));
	return r;
}
