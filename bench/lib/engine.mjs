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
