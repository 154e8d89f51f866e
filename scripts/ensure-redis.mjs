// The fleet's integration test (tests/api/fleet.test.ts) starts its own Redis from Debian's redis-server on a
// free port. Install it when missing (as root), or stop loudly — like Chromium and pdflatex, it is never
// skipped by `npm test` (run alone without redis-server, the test itself says loudly that it skipped).
import { spawnSync } from 'node:child_process';

const found = () => spawnSync('redis-server', ['--version'], { stdio: 'ignore' }).status === 0;

if (!found()) {
	if (process.getuid?.() !== 0) {
		console.error('\n✗ redis-server is missing and this is not root: run "sudo apt-get install -y redis-server" and retry.\n');
		process.exit(1);
	}
	console.log("redis-server is missing: installing Debian's redis-server (no recommends)…");
	const t0 = Date.now();
	const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
	for (const args of [
		['update', '-qq'],
		['install', '-y', '-qq', '--no-install-recommends', 'redis-server']
	]) {
		const r = spawnSync('apt-get', args, { stdio: 'inherit', env });
		if (r.status !== 0) {
			console.error(`\n✗ apt-get ${args.join(' ')} failed (exit ${r.status}); the fleet test cannot run.\n`);
			process.exit(1);
		}
	}
	if (!found()) {
		console.error('\n✗ redis-server was installed but does not run.\n');
		process.exit(1);
	}
	console.log(`redis-server installed in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
}
console.log(`redis-server: ${spawnSync('redis-server', ['--version'], { encoding: 'utf8' }).stdout.trim()}`);
