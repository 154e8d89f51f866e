// The pages under their Content-Security-Policy in a real browser: signing in, the pad page with KaTeX,
// plots, the palette, the public transcript and the library all work, and the browser reports no violation.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { launch, signInThroughForm, openFreshPad } from '../helpers/browser';

const baseUrl = inject('baseUrl');
let ctx: BrowserContext;
let page: Page;
const violations: string[] = [];

/** The browser's own reports: console messages (Chromium logs every refusal) and securitypolicyviolation events. */
function watch(p: Page) {
	p.on('console', (m) => {
		if (/Content.Security.Policy|Refused to (load|execute|apply|frame|connect)/i.test(m.text())) violations.push(`console: ${m.text()}`);
	});
	p.on('pageerror', (e) => {
		if (/Content.Security.Policy|unsafe-eval/i.test(e.message)) violations.push(`page error: ${e.message}`);
	});
}

/** Events recorded in the page (the init script runs outside the page's policy, before any of its scripts). */
async function pageViolations(p: Page): Promise<string[]> {
	return p.evaluate(() => ((window as unknown as { __csp?: string[] }).__csp ?? []).slice());
}

const input = () => page.locator('textarea[aria-label="input line"]');
const stepCount = () => page.locator('article.step').count();

async function run(line: string) {
	const before = await stepCount();
	await input().fill(line);
	await page.keyboard.press('Enter');
	await expect.poll(stepCount, { timeout: 30_000 }).toBeGreaterThan(before);
	await expect.poll(() => page.locator('.status-running').count()).toBe(0);
}

beforeAll(async () => {
	ctx = await launch();
	await ctx.addInitScript(() => {
		const seen: string[] = ((window as unknown as { __csp: string[] }).__csp = []);
		document.addEventListener('securitypolicyviolation', (e) =>
			seen.push(`${e.violatedDirective} ${e.blockedURI} ${e.sourceFile}:${e.lineNumber}`)
		);
	});
	page = await ctx.newPage();
	watch(page);
});
afterAll(async () => {
	await ctx?.close();
});

describe('under the Content-Security-Policy', () => {
	it('the sign-in page sends its policy and runs its theme script (nonce) without a violation', async () => {
		const answer = await page.goto(`${baseUrl}/signin`);
		expect(answer?.headers()['content-security-policy']).toMatch(/script-src 'self' 'nonce-/);
		// the inline theme script runs (its nonce matches): it sets the chosen theme's class before paint
		await page.evaluate(() => localStorage.setItem('bulkpad-theme', 'dark'));
		await page.reload();
		expect(await page.evaluate(() => document.documentElement.classList.contains('dark'))).toBe(true);
		await page.evaluate(() => localStorage.removeItem('bulkpad-theme'));
		expect(await pageViolations(page)).toEqual([]);
	});

	it('signs in and works a pad: KaTeX, a plot and the palette, with no violation', async () => {
		await signInThroughForm(page, baseUrl, 'tomas@sable.test');
		await openFreshPad(page);

		await run('coeffs darea o=4 | tex');
		await expect.poll(() => page.locator('article.step .katex').count()).toBeGreaterThan(0);
		// KaTeX's layout lives in inline style attributes: they must apply (a refused style leaves them unset)
		const styled = await page
			.locator('article.step .katex [style]')
			.first()
			.evaluate((el) => (el as HTMLElement).style.cssText);
		expect(styled.length).toBeGreaterThan(0);

		await run('sweep darea l=0.05..1.2:30 o=1,exact');
		await expect.poll(() => page.locator('figure.plot-view path.series-path').count()).toBeGreaterThan(0);

		await page.keyboard.press('Control+k');
		await expect.poll(() => page.locator('.palette').count()).toBe(1);
		await page.keyboard.press('Escape');
		await expect.poll(() => page.locator('.palette').count()).toBe(0);

		expect(await pageViolations(page)).toEqual([]);
	});

	it('the public transcript, the library and the keys page load with no violation', async () => {
		for (const path of ['/t/sable-boosted-first-law', '/library', '/keys', '/datasets', '/help/api']) {
			await page.goto(baseUrl + path);
			await page.waitForLoadState('networkidle');
			expect(await pageViolations(page), path).toEqual([]);
		}
	});

	it('the browser reported no violation anywhere', () => {
		expect(violations).toEqual([]);
	});

	it('an injected inline script does not run', async () => {
		await page.goto(`${baseUrl}/signin`);
		const ran = await page.evaluate(async () => {
			const s = document.createElement('script');
			s.textContent = 'window.__injected = true';
			document.body.append(s);
			await new Promise((r) => setTimeout(r, 50));
			return (window as unknown as { __injected?: boolean }).__injected === true;
		});
		expect(ran).toBe(false);
		expect((await pageViolations(page)).some((v) => v.startsWith('script-src'))).toBe(true);
		violations.length = 0; // that refusal was the point
	});
});
