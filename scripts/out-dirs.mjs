// Where a build goes. Several checkouts of work may build side by side (BULKPAD_BUILD_DIR, BULKPAD_KIT_DIR);
// the outputs must stay inside the project so the server build resolves node_modules, so a folder named
// outside it is placed under .out/ by its last name instead.
import { basename, dirname, relative, resolve, isAbsolute } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');

/** @param {string | undefined} path @param {string} fallback */
function inside(path, fallback) {
	if (!path) return fallback;
	const rel = relative(root, resolve(root, path));
	return rel.startsWith('..') || isAbsolute(rel) ? `.out/${basename(path)}` : rel;
}

export const buildDir = inside(process.env.BULKPAD_BUILD_DIR, 'build');
export const kitDir = inside(process.env.BULKPAD_KIT_DIR, '.svelte-kit');
