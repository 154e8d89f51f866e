// The LaTeX export test compiles a hostile pad with pdflatex. Install Debian's texlive-latex-base when
// pdflatex is missing (as root), or stop loudly — that test is never skipped.
import { spawnSync } from 'node:child_process';

// the test runs `pdflatex` from PATH, so this checks the same one
const PDFLATEX = 'pdflatex';
const found = () => spawnSync(PDFLATEX, ['--version'], { stdio: 'ignore' }).status === 0;

if (!found()) {
	if (process.getuid?.() !== 0) {
		console.error(
			`\n✗ ${PDFLATEX} is missing and this is not root: run "sudo apt-get install -y --no-install-recommends texlive-latex-base" and retry.\n`
		);
		process.exit(1);
	}
	console.log(`${PDFLATEX} is missing: installing Debian's texlive-latex-base (no recommends)…`);
	const t0 = Date.now();
	const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
	for (const args of [
		['update', '-qq'],
		['install', '-y', '-qq', '--no-install-recommends', 'texlive-latex-base']
	]) {
		const r = spawnSync('apt-get', args, { stdio: 'inherit', env });
		if (r.status !== 0) {
			console.error(`\n✗ apt-get ${args.join(' ')} failed (exit ${r.status}); the LaTeX export test cannot run.\n`);
			process.exit(1);
		}
	}
	if (!found()) {
		console.error(`\n✗ texlive-latex-base was installed but ${PDFLATEX} still does not run.\n`);
		process.exit(1);
	}
	console.log(`texlive-latex-base installed in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
}
console.log(`pdflatex: ${PDFLATEX}`);
