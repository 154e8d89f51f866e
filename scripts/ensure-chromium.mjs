// Browser tests need Debian's Chromium. Install it when missing (as root), or stop loudly — never skip.
import { existsSync } from 'node:fs';
import { spawnSync } from 'node:child_process';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
if (!existsSync(CHROMIUM)) {
	if (process.getuid?.() !== 0) {
		console.error(`\n✗ ${CHROMIUM} is missing and this is not root: run "sudo apt-get install -y chromium" and retry.\n`);
		process.exit(1);
	}
	console.log(`${CHROMIUM} is missing: installing Debian's chromium package…`);
	const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
	for (const args of [
		['update', '-qq'],
		['install', '-y', '-qq', 'chromium']
	]) {
		const r = spawnSync('apt-get', args, { stdio: 'inherit', env });
		if (r.status !== 0) {
			console.error(`\n✗ apt-get ${args.join(' ')} failed (exit ${r.status}); the browser tests cannot run.\n`);
			process.exit(1);
		}
	}
	if (!existsSync(CHROMIUM)) {
		console.error(`\n✗ chromium was installed but ${CHROMIUM} is still missing.\n`);
		process.exit(1);
	}
}
console.log(`chromium: ${CHROMIUM}`);
