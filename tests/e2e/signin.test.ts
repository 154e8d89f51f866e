import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import type { BrowserContext } from 'playwright-core';
import { launch, screenshot, signInThroughForm } from '../helpers/browser';

const baseUrl = inject('baseUrl');
let ctx: BrowserContext;

beforeAll(async () => {
	ctx = await launch();
});
afterAll(async () => {
	await ctx?.close();
});

describe('signing in', () => {
	it('sends an anonymous visitor to the sign-in page', async () => {
		const page = await ctx.newPage();
		await page.goto(baseUrl + '/');
		expect(new URL(page.url()).pathname).toBe('/signin');
		await screenshot(page, 'signin');
		await page.close();
	});

	it('shows the generic error for a wrong password and keeps the e-mail', async () => {
		const page = await ctx.newPage();
		await page.goto(baseUrl + '/signin');
		await page.fill('input[name=email]', 'tomas@sable.test');
		await page.fill('input[name=password]', 'wrong password');
		await page.click('button:has-text("Sign in")');
		await expect.poll(() => page.locator('[role=alert]').textContent()).toMatch(/Wrong e-mail or password/);
		expect(await page.inputValue('input[name=email]')).toBe('tomas@sable.test');
		await page.close();
	});

	it('lands the demo member on a console page of their own, with no request to another host', async () => {
		const page = await ctx.newPage();
		const foreign: string[] = [];
		page.on('request', (r) => {
			const u = new URL(r.url());
			if (!['127.0.0.1', 'localhost'].includes(u.hostname) && u.protocol !== 'data:') foreign.push(r.url());
		});
		await signInThroughForm(page, baseUrl, 'ines@sable.test');
		expect(new URL(page.url()).pathname).toMatch(/^\/pads\/[0-9a-f]+$/);
		await page.waitForLoadState('networkidle');
		// the font is served by the app itself
		const fontsOk = await page.evaluate(async () => {
			await document.fonts.ready;
			return document.fonts.check('16px "IBM Plex Mono"');
		});
		expect(fontsOk).toBe(true);
		expect(foreign).toEqual([]);
		await screenshot(page, 'console-after-signin');
		await page.close();
	});
});
