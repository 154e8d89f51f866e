import { createRequire } from 'node:module';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
const require = createRequire(join(process.cwd(), 'package.json'));
const { chromium } = require('playwright-core');
const url = 'http://localhost:4311';
const lines = process.argv.slice(3);
const who = process.argv[2];
const ctx = await chromium.launchPersistentContext(mkdtempSync(join(tmpdir(), 'use-')), {
  executablePath: '/usr/bin/chromium', viewport: { width: 1280, height: 900 },
  args: ['--headless', '--no-sandbox', '--disable-gpu', '--no-first-run'] });
const problems = [];
ctx.on('response', (r) => { if (r.status() >= 500) problems.push(`${r.status()} ${r.url()}`); });
const page = await ctx.newPage();
page.on('console', (m) => { if (m.type() === 'error') problems.push(`console: ${m.text()}`); });
await ctx.request.post(`${url}/api/auth/signin`, { data: { email: who, password: 'bulkpad-demo' }, headers: { origin: url } });
await page.goto(url + '/', { waitUntil: 'networkidle' });
// a new pad via the sidebar button
await page.getByText('begin a new pad').click();
await page.waitForTimeout(1500);
let i = 0;
for (const line of lines) {
  await page.keyboard.type(line);
  await page.keyboard.press('Enter');
  await page.waitForTimeout(line.startsWith('sweep') || line.startsWith('growth') ? 4000 : 1500);
  await page.screenshot({ path: `/tmp/use/q${i++}.png` });
}
await page.screenshot({ path: `/tmp/use/full.png`, fullPage: true });
console.log(page.url());
await ctx.close();
console.log(problems.join('\n') || 'no problems');
