// `npm test`: the static checks (svelte-check, ESLint with the import boundaries, Prettier), then unit, API and
// browser tests. The API and browser tests run against the real built server, so this builds first. Chromium,
// pdflatex (the LaTeX export's compile test) and redis-server (the fleet test) are installed when missing or the
// run fails — never skipped.
import { spawnSync } from 'node:child_process';

const step = (label, cmd, args) => {
	console.log(`\n▸ ${label}`);
	const t0 = Date.now();
	const r = spawnSync(cmd, args, { stdio: 'inherit', env: process.env });
	if (r.status !== 0) {
		console.error(`\n✗ ${label} failed (exit ${r.status})`);
		process.exit(r.status ?? 1);
	}
	console.log(`  ${label}: ${((Date.now() - t0) / 1000).toFixed(1)} s`);
};

const node = process.execPath;

// ── static checks first: a minute, not a build and a test run, to learn that a line breaks a rule ──
// All three run (one report of everything to fix), then the run stops if any failed.
const checks = [
	['svelte-kit sync', node, ['node_modules/@sveltejs/kit/svelte-kit.js', 'sync']],
	['svelte-check', node, ['node_modules/svelte-check/bin/svelte-check', '--tsconfig', './tsconfig.json', '--threshold', 'error']],
	['eslint (rules and import boundaries)', node, ['node_modules/eslint/bin/eslint.js', '.']],
	['prettier --check', node, ['node_modules/prettier/bin/prettier.cjs', '--check', '.', '--log-level', 'warn']]
];
const failed = [];
for (const [label, cmd, args] of checks) {
	console.log(`\n▸ ${label}`);
	const t0 = Date.now();
	const r = spawnSync(cmd, args, { stdio: 'inherit', env: process.env });
	if (r.status !== 0) failed.push(label);
	console.log(`  ${label}: ${r.status === 0 ? 'ok' : `failed (exit ${r.status})`}, ${((Date.now() - t0) / 1000).toFixed(1)} s`);
}
if (failed.length) {
	console.error(`\n✗ static checks failed: ${failed.join(', ')} (npm run format / npx eslint --fix . fix the mechanical ones)`);
	process.exit(1);
}

step('chromium', node, ['scripts/ensure-chromium.mjs']);
step('pdflatex', node, ['scripts/ensure-texlive.mjs']);
step('redis-server', node, ['scripts/ensure-redis.mjs']);
step('build (worker + app)', node, ['scripts/build-worker.mjs']);
step('vite build', node, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn']);
step('vitest (unit, api, e2e)', node, ['node_modules/vitest/vitest.mjs', 'run', ...process.argv.slice(2)]);
