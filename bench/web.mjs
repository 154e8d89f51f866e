// The pad page in Chromium on loopback: the gzip size of the JavaScript it loads (from the build's own
// files, so the figure does not depend on which encoding the server picked), and the time until the input
// line is focused, hydrated and takes a key. Run after a build (`npm run build`, or with BULKPAD_BUILD_DIR).
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { join } from 'node:path';
import { gzipSync } from 'node:zlib';
import { chromium } from 'playwright-core';
import { buildDir } from '../scripts/out-dirs.mjs';
import { emit, machineLine, median, writeSection } from './lib/results.mjs';
import { freePort } from './lib/server.mjs';
import { CHROMIUM, CHROMIUM_ARGS } from '../scripts/chromium-flags.mjs';

const RUNS = Number(process.env.BENCH_RUNS ?? 7);
const BUDGET_KB = 150;
const worker = process.env.BULKPAD_WORKER ?? 'dist/eval-worker.mjs';
if (!existsSync(`${buildDir}/index.js`) || !existsSync(worker)) throw new Error(`build first: no ${buildDir}/index.js or ${worker}`);

const dir = mkdtempSync(join(tmpdir(), 'bulkpad-web-'));
const env = { ...process.env, DATABASE_URL: join(dir, 'web.db'), NODE_ENV: 'production', BULKPAD_INSECURE_COOKIES: '1' };
const seed = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/seed.ts', '--demo'], { env, encoding: 'utf8' });
if (seed.status !== 0) throw new Error(seed.stderr);
const port = await freePort();
const baseUrl = `http://127.0.0.1:${port}`;
const server = spawn(process.execPath, [`${buildDir}/index.js`], {
	env: { ...env, PORT: String(port), HOST: '127.0.0.1', ORIGIN: baseUrl },
	stdio: 'ignore'
});
const browser = await chromium.launch({
	executablePath: CHROMIUM,
	headless: true,
	args: CHROMIUM_ARGS
});

try {
	for (let i = 0; i < 200; i++) {
		try {
			if ((await fetch(`${baseUrl}/api/health`)).ok) break;
		} catch {
			/* starting */
		}
		await new Promise((r) => setTimeout(r, 100));
	}
	const ctx = await browser.newContext({ viewport: { width: 1280, height: 800 } });
	const signin = await ctx.request.post(`${baseUrl}/api/auth/signin`, {
		data: { email: 'ines@sable.test', password: 'bulkpad-demo' },
		headers: { origin: baseUrl }
	});
	if (!signin.ok()) throw new Error(`sign-in failed: ${signin.status()}`);
	// the seeded pad with formulas, tables and a sweep plot: the heaviest first paint of the demo
	const padUrl = await (async () => {
		const p = await ctx.newPage();
		await p.goto(`${baseUrl}/`);
		await p.locator('.pad-list a', { hasText: 'first law' }).click();
		await p.waitForURL(/\/pads\//);
		const u = p.url();
		await p.close();
		return u;
	})();

	// 1. which scripts the page loads, sized as gzip of the built files
	const page = await ctx.newPage();
	const scripts = [];
	page.on('response', (r) => {
		if (r.request().resourceType() === 'script') scripts.push(new URL(r.url()).pathname);
	});
	await page.goto(padUrl, { waitUntil: 'networkidle' });
	await page.waitForSelector('.console[data-ready]');
	await page.waitForLoadState('networkidle');
	await page.close();
	const sized = scripts.map((path) => {
		const file = join(buildDir, 'client', path);
		const raw = readFileSync(file);
		return { path, raw: raw.length, gzip: gzipSync(raw, { level: 9 }).length, katex: raw.includes('KaTeX parse error') };
	});
	const kb = (n) => Math.round(n / 102.4) / 10;
	const all = sized.reduce((a, s) => a + s.gzip, 0);
	const initial = sized.filter((s) => !s.katex).reduce((a, s) => a + s.gzip, 0);
	const katex = all - initial;
	emit({ name: 'pad page JS, gzip, everything it loads', kb: kb(all), files: sized.length, budget_kb: BUDGET_KB });
	emit({ name: 'pad page JS, gzip, before the lazy KaTeX chunk', kb: kb(initial) });
	emit({ name: 'KaTeX chunk (loaded after the page is interactive), gzip', kb: kb(katex) });

	// 2. time to interactive, cold cache each run
	const ttis = [];
	const fcps = [];
	const navs = [];
	for (let i = 0; i < RUNS; i++) {
		const p = await ctx.newPage();
		const cdp = await ctx.newCDPSession(p);
		await cdp.send('Network.setCacheDisabled', { cacheDisabled: true });
		await p.goto(padUrl, { waitUntil: 'commit' });
		const tti = await p.evaluate(
			() =>
				new Promise((resolve) => {
					const check = () => {
						const ok =
							document.querySelector('.console[data-ready]') && document.activeElement?.getAttribute('aria-label') === 'input line';
						if (ok) resolve(performance.now());
						else requestAnimationFrame(check);
					};
					check();
				})
		);
		await p.keyboard.type('d');
		const took = await p.inputValue('textarea[aria-label="input line"]');
		if (took !== 'd') throw new Error(`the input line did not take the key (has "${took}")`);
		const fcp = await p.evaluate(() => performance.getEntriesByName('first-contentful-paint')[0]?.startTime ?? null);
		const nav = await p.evaluate(() => {
			const n = performance.getEntriesByType('navigation')[0];
			return { ttfb: n.responseStart, html: n.responseEnd, dcl: n.domContentLoadedEventEnd };
		});
		navs.push(nav);
		ttis.push(tti);
		if (fcp !== null) fcps.push(fcp);
		await p.close();
	}
	const tti = median(ttis);
	const fcp = fcps.length ? median(fcps) : null;
	emit({
		name: 'pad page time to interactive (input focused, hydrated, takes a key), cold cache',
		median_ms: Math.round(tti),
		min_ms: Math.round(Math.min(...ttis)),
		max_ms: Math.round(Math.max(...ttis)),
		runs: RUNS
	});
	if (fcp !== null) emit({ name: 'pad page first contentful paint, cold cache', median_ms: Math.round(fcp) });
	const ttfb = median(navs.map((n) => n.ttfb));
	const html = median(navs.map((n) => n.html));
	emit({ name: 'pad page server answer (SSR with typeset formulas)', ttfb_ms: Math.round(ttfb), html_done_ms: Math.round(html) });

	writeSection(
		'web',
		`## Web console (\`npm run bench -- web\`)
${machineLine()}; headless Chromium on 127.0.0.1, the seeded pad "Boosted brane d=4: first law to third order" (formulas, a table, a sweep plot), signed in as a member. Load average when measured: ${loadavg()[0].toFixed(1)} (other work on the machine slows the times; the sizes do not move).

| figure | value |
|---|---|
| JavaScript the pad page loads, gzip -9 of the built files (all ${sized.length} files) | ${kb(all)} KB (budget < ${BUDGET_KB} KB) |
| … of which before KaTeX (what hydration needs) | ${kb(initial)} KB |
| … of which the KaTeX chunk, fetched lazily after the page is interactive (the server typesets the first paint) | ${kb(katex)} KB |
| time to interactive: input line focused, hydrated and taking a key, cold cache, median of ${RUNS} | ${Math.round(tti)} ms (min ${Math.round(Math.min(...ttis))}, max ${Math.round(Math.max(...ttis))}) |
${fcp !== null ? `| first contentful paint, cold cache, median | ${Math.round(fcp)} ms |\n` : ''}| server's first byte / whole HTML (SSR, formulas typeset on the server), median | ${Math.round(ttfb)} / ${Math.round(html)} ms |
`
	);
	await ctx.close();
} finally {
	await browser.close();
	server.kill('SIGTERM');
	await new Promise((r) => server.once('exit', r));
	rmSync(dir, { recursive: true, force: true });
}
