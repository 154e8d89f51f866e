// The LaTeX export test compiles a hostile pad with pdflatex, and the figure test compiles the pgfplots export.
// Install Debian's texlive-latex-base when pdflatex is missing, and texlive-pictures (pgfplots, with the
// texlive-latex-recommended it depends on) when pgfplots.sty is missing, as root — or stop loudly for pdflatex
// (that test is never skipped) and warn for pgfplots (its compile test skips without it).
// Measured on this machine's apt log: texlive-pictures + texlive-latex-recommended, 25 MB of .deb, installed in
// 11 s (2026-12-02), well inside CI's time; texlive-latex-base about 45 s.
import { spawnSync } from 'node:child_process';

// the tests run `pdflatex` and `kpsewhich` from PATH, so this checks the same ones
const PDFLATEX = 'pdflatex';
const found = () => spawnSync(PDFLATEX, ['--version'], { stdio: 'ignore' }).status === 0;
const hasPgfplots = () => spawnSync('kpsewhich', ['pgfplots.sty'], { encoding: 'utf8' }).stdout?.trim() !== '';
const root = process.getuid?.() === 0;
const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
let updated = false;

/** apt-get install of `packages` (no recommends), after one `apt-get update`; false when apt failed. */
function aptInstall(packages) {
	const steps = [...(updated ? [] : [['update', '-qq']]), ['install', '-y', '-qq', '--no-install-recommends', ...packages]];
	for (const args of steps) {
		const r = spawnSync('apt-get', args, { stdio: 'inherit', env });
		if (r.status !== 0) {
			console.error(`\n✗ apt-get ${args.join(' ')} failed (exit ${r.status}).\n`);
			return false;
		}
		if (args[0] === 'update') updated = true;
	}
	return true;
}

if (!found()) {
	if (!root) {
		console.error(
			`\n✗ ${PDFLATEX} is missing and this is not root: run "sudo apt-get install -y --no-install-recommends texlive-latex-base" and retry.\n`
		);
		process.exit(1);
	}
	console.log(`${PDFLATEX} is missing: installing Debian's texlive-latex-base (no recommends)…`);
	const t0 = Date.now();
	if (!aptInstall(['texlive-latex-base'])) {
		console.error('✗ the LaTeX export test cannot run.');
		process.exit(1);
	}
	if (!found()) {
		console.error(`\n✗ texlive-latex-base was installed but ${PDFLATEX} still does not run.\n`);
		process.exit(1);
	}
	console.log(`texlive-latex-base installed in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
}

if (!hasPgfplots()) {
	if (!root) {
		console.warn(
			'⚠ pgfplots is missing and this is not root: the pgfplots compile test will skip ("sudo apt-get install -y --no-install-recommends texlive-pictures texlive-latex-recommended" runs it).'
		);
	} else {
		console.log("pgfplots is missing: installing Debian's texlive-pictures and texlive-latex-recommended (no recommends)…");
		const t0 = Date.now();
		// not fatal: the pgfplots compile test skips without it, the rest of the suite does not need it
		if (aptInstall(['texlive-pictures', 'texlive-latex-recommended']) && hasPgfplots())
			console.log(`texlive-pictures installed in ${((Date.now() - t0) / 1000).toFixed(0)} s`);
		else console.warn('⚠ pgfplots could not be installed: the pgfplots compile test will skip.');
	}
}
console.log(`pdflatex: ${PDFLATEX}${hasPgfplots() ? ', pgfplots: yes' : ', pgfplots: no'}`);
