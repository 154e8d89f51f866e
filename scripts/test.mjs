// `npm test`: unit, API and browser tests. The API and browser tests run against the real built server, so
// this builds first. Chromium and pdflatex (the LaTeX export's compile test) are installed when missing or the
// run fails — those tests are never skipped.
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
step('chromium', node, ['scripts/ensure-chromium.mjs']);
step('pdflatex', node, ['scripts/ensure-texlive.mjs']);
step('build (worker + app)', node, ['scripts/build-worker.mjs']);
step('vite build', node, ['node_modules/vite/bin/vite.js', 'build', '--logLevel', 'warn']);
step('vitest (unit, api, e2e)', node, ['node_modules/vitest/vitest.mjs', 'run', ...process.argv.slice(2)]);
