// Paper output in a real browser: a long `coeffs … | tex` in a boosted bulk never scrolls the page sideways
// (the list scrolls in its own box) and copies as LaTeX and as plain text; figure labels typed in the label
// editor come back after a reload; the pad's validity tolerance is set in the header and kept.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { launch, signInThroughForm, openFreshPad } from '../helpers/browser';

const baseUrl = inject('baseUrl');
let ctx: BrowserContext;
let page: Page;

const stepCount = () => page.locator('article.step').count();
const step = (n: number) => page.locator(`article.step[data-step="${n}"]`);

async function run(line: string) {
	const before = await stepCount();
	await page.locator('textarea[aria-label="input line"]').fill(line);
	await page.keyboard.press('Enter');
	await expect.poll(stepCount, { timeout: 120_000 }).toBeGreaterThan(before);
	await expect.poll(() => page.locator('.status-running').count(), { timeout: 120_000 }).toBe(0);
}

/** What the page would put on the clipboard: the app's copy goes through navigator.clipboard.writeText. */
async function captureClipboard() {
	await page.evaluate(() => {
		Object.defineProperty(navigator, 'clipboard', {
			configurable: true,
			value: { writeText: async (t: string) => void ((window as unknown as { __copied: string }).__copied = t) }
		});
	});
}
const copied = () => page.evaluate(() => (window as unknown as { __copied?: string }).__copied ?? '');

/** No horizontal overflow of the page or of the step stream: anything wide scrolls inside its own box. */
const sideways = () =>
	page.evaluate(() => {
		const doc = document.scrollingElement!;
		const main = document.querySelector('main.step-stream')!;
		return { page: doc.scrollWidth - doc.clientWidth, stream: main.scrollWidth - main.clientWidth };
	});

beforeAll(async () => {
	ctx = await launch({ width: 1024, height: 800 });
	page = await ctx.newPage();
	await signInThroughForm(page, baseUrl, 'tomas@sable.test');
	await page.goto(`${baseUrl}/pads`);
	await page.waitForURL(/\/pads\/[0-9a-f]+$/);
	await openFreshPad(page);
});
afterAll(async () => {
	await ctx?.close();
});

describe('coefficients for a paper', () => {
	it('an order-8 boosted list does not scroll the page sideways, even with its terms shown', async () => {
		await run('use boosted d=4 zh=1 v=0.6');
		await run('coeffs darea o=8 | tex');
		const s = step(2);
		await expect.poll(() => s.locator('.series-list .katex').count(), { timeout: 60_000 }).toBeGreaterThan(0);
		// the list itself is wider than the console: it scrolls inside its own box (the display formula's)
		const box = await s.locator('.series-list .tex').evaluate((el) => ({ scroll: el.scrollWidth, client: el.clientWidth }));
		expect(box.scroll).toBeGreaterThan(box.client);
		expect(await sideways()).toEqual({ page: 0, stream: 0 });
		await s.locator('button:has-text("show terms")').click();
		await expect.poll(() => s.locator('.series-terms tr').count()).toBe(9);
		expect(await sideways()).toEqual({ page: 0, stream: 0 });
		// κ is defined on the page
		expect(await s.locator('.series-list').innerText()).toContain('κ');
	});

	it('copies the aligned list as LaTeX and the coefficients as plain text', async () => {
		await captureClipboard();
		const s = step(2);
		await s.locator('button.copy-latex').click();
		await expect.poll(copied).toMatch(/^\\begin\{aligned\}/);
		const tex = await copied();
		for (let k = 1; k <= 8; k++) expect(tex).toContain(`a_{${k}} &= `);
		expect(tex).toContain('\\kappa = \\gamma^{2}v^{2}');
		await s.locator('button.copy-text').click();
		await expect.poll(copied).toMatch(/^ΔA = /);
		const text = await copied();
		expect(text).not.toMatch(/\\[A-Za-z]/); // no TeX control words
		expect(text).toMatch(/^a_8 = -?\d/m);
		expect(text).toContain('κ = γ²v² = v²/(1 − v²) = 0.5625');
	});
});

describe('figure labels', () => {
	it('typed labels are kept with the step and come back after a reload', async () => {
		await run('use brane d=4 zh=1');
		await run('sweep darea l=0.1..0.6:6 o=1,exact');
		const fig = () => step(4).locator('figure.plot-view');
		await expect.poll(() => fig().count()).toBe(1);
		await fig().locator('button.figure-labels').click();
		await fig().locator('input[aria-label="x label (LaTeX)"]').fill('\\ell/z_h');
		await fig().locator('input[aria-label="legend of exact (LaTeX)"]').fill('\\mathrm{numerics}');
		await fig().locator('button.figure-labels').click(); // closing the editor keeps them
		await expect.poll(() => fig().innerText()).toContain('labels kept');
		await page.reload();
		await expect.poll(() => fig().count(), { timeout: 60_000 }).toBe(1);
		await expect.poll(() => fig().locator('text.axis-label').allTextContents()).toContain('ℓ/zh');
		expect(await fig().locator('text.legend-text').allTextContents()).toContain('numerics');
	});
});

describe('the pad validity tolerance', () => {
	it('is set in the header, kept over a reload, and the plot legend states it', async () => {
		await expect.poll(() => page.locator('button.validity-tol-button').innerText()).toBe('tol 1e-3');
		await page.locator('button.validity-tol-button').click();
		await page.locator('input[aria-label^="validity tolerance"]').fill('1e-2');
		await page.keyboard.press('Enter');
		await expect.poll(() => page.locator('button.validity-tol-button').innerText()).toBe('tol 1e-2 (pad)');
		await page.reload();
		await expect.poll(() => page.locator('button.validity-tol-button').innerText(), { timeout: 60_000 }).toBe('tol 1e-2 (pad)');
		await run('sweep darea l=0.05..0.8:20 o=1,2,exact');
		const fig = step(5).locator('figure.plot-view');
		await expect
			.poll(() => fig.locator('text.legend-text').allTextContents())
			.toContain('shaded: series within 1e-2 of exact (relative), ℓ ≤ ℓ_max');
	});
});
