// Headless Debian Chromium through playwright-core, with the flags this machine's closed network needs.
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { mkdirSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { CHROMIUM, CHROMIUM_ARGS } from '../../scripts/chromium-flags.mjs';

export { CHROMIUM };
export const ARTIFACTS = 'tests/artifacts';

export async function launch(viewport = { width: 1280, height: 800 }): Promise<BrowserContext> {
	const ctx = await chromium.launchPersistentContext(mkdtempSync(join(tmpdir(), 'bulkpad-chromium-')), {
		executablePath: CHROMIUM,
		headless: true,
		viewport,
		args: CHROMIUM_ARGS
	});
	// Playwright's 30 s default for a click, a navigation or a wait is a speed limit on a busy machine; these
	// only have to catch a hang
	ctx.setDefaultTimeout(90_000);
	ctx.setDefaultNavigationTimeout(90_000);
	return ctx;
}

export async function signInThroughForm(page: Page, baseUrl: string, email: string, password = 'bulkpad-demo') {
	await page.goto(`${baseUrl}/signin`);
	await page.fill('input[name=email]', email);
	await page.fill('input[name=password]', password);
	await Promise.all([page.waitForURL((u) => !u.pathname.startsWith('/signin')), page.click('button:has-text("Sign in")')]);
}

export async function screenshot(page: Page, name: string) {
	mkdirSync(ARTIFACTS, { recursive: true });
	await page.screenshot({ path: join(ARTIFACTS, `${name}.png`), fullPage: false });
}

/** Opens a new pad of the signed-in user's from a pad page and waits until its input line has the focus. */
export async function openFreshPad(page: Page): Promise<void> {
	const before = page.url();
	await page.click('button.new-pad');
	await page.waitForURL((u) => u.pathname.startsWith('/pads/') && u.href !== before);
	await page.waitForFunction(() => document.activeElement?.getAttribute('aria-label') === 'input line');
}
