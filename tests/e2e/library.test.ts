// The group's shared pieces in a browser: a member uploads a CSV dataset and compares against it in a pad;
// the curator tries a proposed macro on its example parameters, approves it, and it then runs from the console.
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest';
import type { BrowserContext } from 'playwright-core';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { launch, screenshot, signInThroughForm } from '../helpers/browser';

const baseUrl = inject('baseUrl');
let ines: BrowserContext;
let curator: BrowserContext;

beforeAll(async () => {
	ines = await launch();
	curator = await launch();
});
afterAll(async () => {
	await ines?.close();
	await curator?.close();
});

async function typeLine(page: import('playwright-core').Page, line: string, n: number) {
	await page.keyboard.type(line);
	await page.keyboard.press('Enter');
	await page.waitForFunction((k) => document.body.innerText.includes(`#${k}`), n);
}

describe('datasets and the macro library in the browser', () => {
	it('uploads a CSV on the datasets page and compares a pad against it', async () => {
		const page = await ines.newPage();
		await signInThroughForm(page, baseUrl, 'ines@sable.test');
		// the member's own numerics, here the engine's ΔA at three widths rounded to 6 digits (invented data)
		const rows: string[] = [];
		for (const l of [0.2, 0.3, 0.4]) {
			const r = await page.request.post(`${baseUrl}/api/eval`, { data: { input: `darea l=${l}` }, headers: { origin: baseUrl } });
			rows.push(`${l},${((await r.json()).results[0].value as number).toPrecision(6)}`);
		}
		const file = join(mkdtempSync(join(tmpdir(), 'bulkpad-csv-')), 'ines_run.csv');
		writeFileSync(file, `l,darea\n${rows.join('\n')}\n`);

		await page.goto(`${baseUrl}/datasets`);
		await page.setInputFiles('input[type=file]', file);
		await page.click('button:has-text("Upload")');
		await expect.poll(() => page.locator('[role=status]').textContent()).toMatch(/uploaded/);
		await screenshot(page, 'datasets-uploaded');

		await page.goto(`${baseUrl}/pads`);
		await page.waitForURL(/\/pads\/[0-9a-f]+$/);
		const before = page.url();
		await page.click('button.new-pad');
		await page.waitForURL((u) => u.href !== before && /\/pads\//.test(u.pathname));
		await typeLine(page, 'compare ines_run darea', 1);
		const text = await page.locator('body').innerText();
		expect(text).toMatch(/ines_run: darea against darea/);
		// six significant digits agree with the engine well inside the comparison's tolerance: the check holds
		expect(text).toMatch(/holds\s+ines_run agrees with darea/);
		await screenshot(page, 'compare-dataset');
		await page.close();
	});

	it('shows the curator a trial run before approving a proposed macro, which then runs in a pad', async () => {
		const page = await curator.newPage();
		await signInThroughForm(page, baseUrl, 'curator@sable.test');
		await page.goto(`${baseUrl}/library`);
		await page.click('button[role=tab]:has-text("proposed")');
		const card = page.locator('article').filter({ has: page.locator('h3', { hasText: 'charged-scan' }) });
		const approve = card.locator('button:has-text("approve")');
		// the approve button waits for the trial run
		expect(await approve.isDisabled()).toBe(true);
		await card.locator('button:has-text("trial run")').click();
		const results = card.locator('.trial-results');
		await results.waitFor();
		// the trial ran the body on its example l=0.5 in the charged brane the body sets
		await expect.poll(() => results.innerText()).toMatch(/charged d=4/);
		expect(await card.locator('.trial').innerText()).toContain('@charged-scan');
		expect(await card.locator('.trial [data-kind=scalar]').count()).toBeGreaterThan(0);
		await card.locator('.trial .katex').first().waitFor(); // the formula typeset, as in a pad
		await screenshot(page, 'library-trial-run');
		await approve.click();
		await expect
			.poll(async () =>
				(await (await page.request.get(`${baseUrl}/api/macros?state=approved`)).json()).macros.map((m: { name: string }) => m.name)
			)
			.toContain('charged-scan');
		await screenshot(page, 'library-approved');

		const pad = await ines.newPage();
		await pad.goto(`${baseUrl}/pads`);
		await pad.waitForURL(/\/pads\//);
		const before = pad.url();
		await pad.click('button.new-pad');
		await pad.waitForURL((u) => u.href !== before && /\/pads\//.test(u.pathname));
		await typeLine(pad, '@charged-scan l=0.4', 1);
		await expect.poll(() => pad.locator('body').innerText()).toMatch(/charged d=4/);
		await pad.close();
		await page.close();
	});
});
