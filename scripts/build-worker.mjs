// Bundles the evaluation process (language + engine + mathjs + nerdamer) into one file that the server forks
// (src/lib/server/eval/pool.ts). SvelteKit's build cannot emit a separate process entry, so esbuild does it.
import { build } from 'esbuild';
import { fileURLToPath } from 'node:url';
import { dirname, resolve } from 'node:path';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');
await build({
	entryPoints: [resolve(root, 'src/lib/server/eval/child.ts')],
	outfile: resolve(root, process.env.BULKPAD_WORKER ?? 'dist/eval-worker.mjs'),
	bundle: true,
	platform: 'node',
	format: 'esm',
	target: 'node20',
	sourcemap: true,
	logLevel: 'warning',
	// nerdamer and some of mathjs's dependencies are CommonJS and call require()
	banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" }
});
console.log(`built ${process.env.BULKPAD_WORKER ?? 'dist/eval-worker.mjs'}`);

// The fleet's evaluation worker (`npm run worker`, src/lib/server/eval/fleet/worker-main.ts): it forks the bundle
// above like the server does; its packages (bullmq) load from node_modules.
await build({
	entryPoints: [resolve(root, 'src/lib/server/eval/fleet/worker-main.ts')],
	outfile: resolve(root, 'dist/fleet-worker.mjs'),
	bundle: true,
	platform: 'node',
	format: 'esm',
	target: 'node20',
	packages: 'external',
	sourcemap: true,
	logLevel: 'warning'
});
console.log('built dist/fleet-worker.mjs');
