// ESLint 9 flat config, the usual SvelteKit set: @eslint/js and typescript-eslint recommended, the Svelte plugin,
// and eslint-config-prettier last so formatting is Prettier's alone. On top: the layering of DEVELOPERS.md as
// import rules per folder (`npm run lint`).
import js from '@eslint/js';
import prettier from 'eslint-config-prettier';
import svelte from 'eslint-plugin-svelte';
import { defineConfig } from 'eslint/config';
import globals from 'globals';
import { builtinModules } from 'node:module';
import ts from 'typescript-eslint';
import svelteConfig from './svelte.config.js';

/** An import whose path has `name` as one of its folders or files, however it is reached ($lib/…, ../…). */
const folder = (name) => `(^|/)${name}(/|$)`;

const NODE = {
	regex: `^(node:|(${builtinModules.join('|')})(/|$))`,
	message: 'no Node built-ins here: this code also runs in the browser or a worker without I/O'
};
const SVELTE = { regex: '^(svelte|\\$app|\\$env)(/|$)', message: 'no framework imports here' };
const SERVER = {
	regex: `${folder('server')}|\\.server(\\.[jt]s)?$|^\\$env/(static|dynamic)/private$`,
	message: 'server-only code must not reach the browser (SvelteKit refuses it at build; this says where)'
};

/** One no-restricted-imports rule from a list of { regex, message } patterns. */
const restrict = (...patterns) => ({ 'no-restricted-imports': ['error', { patterns }] });

export default defineConfig(
	{
		ignores: [
			'build/',
			'dist/',
			'.svelte-kit/',
			'.out/',
			'node_modules/',
			'data/',
			'drizzle/',
			'static/',
			'tests/artifacts/',
			'test-results/',
			'tests/fixtures/**/*.py'
		]
	},
	js.configs.recommended,
	ts.configs.recommended,
	svelte.configs.recommended,
	prettier,
	svelte.configs.prettier,
	{
		languageOptions: { globals: { ...globals.browser, ...globals.node } },
		rules: {
			// TypeScript checks undefined names better (svelte-check); the core rule misreads types and globals
			'no-undef': 'off',
			// `_`-prefixed parameters and destructured leftovers are deliberate: a signature kept for its callers
			'@typescript-eslint/no-unused-vars': ['error', { argsIgnorePattern: '^_', varsIgnorePattern: '^_', ignoreRestSiblings: true }],
			// the app is served at the root (no kit.paths.base), so links and goto() take plain paths; resolve()
			// around each of them would add nothing but noise
			'svelte/no-navigation-without-resolve': 'off'
		}
	},
	{
		files: ['**/*.svelte', '**/*.svelte.ts', '**/*.svelte.js'],
		languageOptions: {
			// no projectService: the recommended rules need no type information, and type-aware parsing would
			// double the lint time on a small machine (svelte-check does the type checking)
			parserOptions: { extraFileExtensions: ['.svelte'], parser: ts.parser, svelteConfig }
		}
	},
	{
		// tests and their helpers reach into any layer and read loosely typed JSON replies on purpose
		files: ['tests/**/*.ts'],
		rules: { '@typescript-eslint/no-explicit-any': 'off' }
	},

	// ── the layering (DEVELOPERS.md "Boundaries") ──
	{
		// the engine is pure: no language, server, UI, framework or Node
		files: ['src/lib/holo/**'],
		rules: restrict(
			{ regex: folder('(lang|server|components|client|library|routes)'), message: 'src/lib/holo imports nothing outside the engine' },
			SVELTE,
			NODE
		)
	},
	{
		// the language depends on the engine only; it runs in a worker and (parser, completion) in the browser
		files: ['src/lib/lang/**'],
		rules: restrict(
			{ regex: folder('(server|components|client|routes)'), message: 'src/lib/lang imports only src/lib/holo (and its packages)' },
			SVELTE
		)
	},
	{
		// code that runs in the browser never imports server-only code
		files: [
			'src/lib/components/**',
			'src/lib/client/**',
			'src/lib/library/**',
			'src/**/*.svelte',
			'src/routes/**/+page.ts',
			'src/routes/**/+layout.ts'
		],
		rules: restrict(SERVER, NODE)
	}
);
