// DEVELOPERS.md stays true about the environment: every variable the code reads must be named there. The code is
// read as text (src/, scripts/, bench/, the test helpers and the root configs), so a new `process.env.X` fails
// this test until X is documented.
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const DIRS = ['src', 'scripts', 'bench', 'tests/helpers'];
const ROOT_FILES = ['vite.config.ts', 'svelte.config.js', 'drizzle.config.ts'];
const CODE = /\.(ts|js|mjs|cjs|svelte)$/;

function walk(dir: string): string[] {
	return readdirSync(dir).flatMap((name) => {
		const path = join(dir, name);
		return statSync(path).isDirectory() ? walk(path) : CODE.test(name) ? [path] : [];
	});
}

const NAME = '[A-Z][A-Z0-9_]*';

/**
 * The environment variables a source text reads: `process.env.X`, `process.env['X']`, `const { X } = process.env`,
 * `$env/static/*` imports, `env.X` with `$env/dynamic/*`, and — in a file that reads `process.env[name]` through a
 * helper — the capitalised names passed to a call (`intFrom('X', 5)`).
 */
function envReads(text: string): string[] {
	const found = new Set<string>();
	const add = (re: RegExp) => {
		for (const m of text.matchAll(re)) found.add(m[1]);
	};
	add(new RegExp(`process\\.env\\??\\.(${NAME})\\b`, 'g'));
	add(new RegExp(`process\\.env\\??\\.?\\[\\s*['"\`](${NAME})['"\`]\\s*\\]`, 'g'));
	for (const m of text.matchAll(/\{([^}]*)\}\s*=\s*process\.env\b/g)) {
		for (const part of m[1].split(',')) {
			const key = part.split(':')[0].trim();
			if (new RegExp(`^${NAME}$`).test(key)) found.add(key);
		}
	}
	for (const m of text.matchAll(/import\s*\{([^}]*)\}\s*from\s*['"]\$env\/static\/(?:private|public)['"]/g)) {
		for (const part of m[1].split(',')) {
			const key = part.trim().split(/\s+as\s+/)[0];
			if (key) found.add(key);
		}
	}
	if (/from\s*['"]\$env\/dynamic\//.test(text)) add(new RegExp(`\\benv\\.(${NAME})\\b`, 'g'));
	if (/process\.env\[\s*[a-z]/.test(text)) add(new RegExp(`\\b\\w+\\(\\s*['"](${NAME})['"]`, 'g'));
	return [...found];
}

describe('reading environment variables from code (the scanner itself)', () => {
	it.each([
		['process.env.DATABASE_URL ?? x', ['DATABASE_URL']],
		["process.env['SMTP_HOST']", ['SMTP_HOST']],
		['process.env?.PORT', ['PORT']],
		['const { HOST, PORT: p } = process.env;', ['HOST', 'PORT']],
		["import { SECRET_KEY } from '$env/static/private';", ['SECRET_KEY']],
		["import { env } from '$env/dynamic/private'; env.API_TOKEN", ['API_TOKEN']],
		["const raw = process.env[name]; intFrom('BULKPAD_EVAL_BUDGET_MS', 5000)", ['BULKPAD_EVAL_BUDGET_MS']],
		// without a dynamic read, a capitalised string argument is just a string
		["method('GET')", []],
		['const env = { ...process.env, NODE_ENV: "production" }', []]
	])('%s → %j', (text, names) => {
		expect(envReads(text).sort()).toEqual([...names].sort());
	});
});

describe('DEVELOPERS.md lists every environment variable the code reads', () => {
	const guide = readFileSync(join(ROOT, 'DEVELOPERS.md'), 'utf8');
	const files = [...DIRS.flatMap((d) => walk(join(ROOT, d))), ...ROOT_FILES.map((f) => join(ROOT, f))];
	const where = new Map<string, string[]>();
	for (const file of files) {
		for (const name of envReads(readFileSync(file, 'utf8'))) {
			where.set(name, [...(where.get(name) ?? []), relative(ROOT, file)]);
		}
	}

	it('finds the variables it must (so an empty scan cannot pass)', () => {
		// one read directly, one through src/lib/server/env.ts's intFrom helper, one in a script
		expect([...where.keys()]).toEqual(expect.arrayContaining(['DATABASE_URL', 'BULKPAD_EVAL_BUDGET_MS', 'BULKPAD_BUILD_DIR']));
	});

	it('names each of them', () => {
		const missing = [...where.entries()]
			.filter(([name]) => !new RegExp(`(^|[^A-Z0-9_])${name}($|[^A-Z0-9_])`).test(guide))
			.map(([name, in_]) => `${name} (read in ${in_.join(', ')})`);
		expect(missing, `DEVELOPERS.md does not name these environment variables: ${missing.join('; ')}`).toEqual([]);
	});
});
