// Scripting in the browser: the Keys page makes a key with its own budget and expiry and lists both, links the
// Python client and the API page; the API page, rendered from /api/openapi.json, shows each route's fields.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { BrowserContext } from 'playwright-core';
import { launch, screenshot, signInThroughForm } from '../helpers/browser';
import { signUpConfirmed } from '../helpers/client';

const baseUrl = inject('baseUrl');
let ctx: BrowserContext;

beforeAll(async () => {
	ctx = await launch();
});
afterAll(async () => {
	await ctx?.close();
});

describe('keys for scripts', () => {
	it('makes a key with a budget and an expiry date and lists both; the key works from a script', async () => {
		const email = `browser-keys-${Date.now()}@tests.test`;
		await signUpConfirmed(email, 'correct horse battery', 'Key Maker');
		const page = await ctx.newPage();
		await signInThroughForm(page, baseUrl, email, 'correct horse battery');
		await page.goto(`${baseUrl}/keys`);
		await page.getByText('120 requests a minute').waitFor();
		const day = new Date(Date.now() + 30 * 86_400_000).toISOString().slice(0, 10);
		await page.fill('form[aria-label="make a key"] input:not([name])', 'cluster sweep');
		await page.fill('input[name=perMinute]', '30');
		await page.fill('input[name=expiresAt]', day);
		await page.click('button:has-text("Make a key")');
		const key = (await page.locator('[data-testid=new-key]').textContent())!.trim();
		expect(key.startsWith('bpk_')).toBe(true);
		const row = page.locator('tbody tr', { hasText: 'cluster sweep' });
		await row.getByText('30/min').waitFor();
		// the key works through the chosen day (UTC), and the page says so with that day
		await row.getByText(`through ${day} (UTC)`).waitFor();

		const me = await fetch(`${baseUrl}/api/auth/me`, { headers: { authorization: `Bearer ${key}` } });
		expect(me.status).toBe(200);
		expect(await page.getAttribute('[data-testid=python-client]', 'href')).toBe('/bulkpad.py');
		await screenshot(page, 'scripting-keys');

		await Promise.all([page.waitForURL((u) => u.pathname === '/help/api'), page.click('a:has-text("The API, route by route")')]);
		await page.getByRole('heading', { name: 'The Bulkpad API' }).waitFor();
	});
});

describe('the API page', () => {
	it('shows every route with who may call it, the body fields and an example; the filter narrows it', async () => {
		const page = await ctx.newPage();
		await page.goto(`${baseUrl}/help/api`);
		const evalRoute = page.locator('[data-route="POST /api/eval"]');
		await evalRoute.waitFor();
		expect(await evalRoute.textContent()).toContain('members and admins');
		expect(await evalRoute.locator('tbody tr').first().textContent()).toContain('input');
		await evalRoute.locator('summary').click();
		expect(await evalRoute.locator('pre').textContent()).toContain(`-d '{"input":"darea l=0.3 o=2"}'`);
		const documented = (await (await fetch(`${baseUrl}/api/openapi.json`)).json()) as { paths: Record<string, object> };
		const operations = Object.values(documented.paths).reduce((n, item) => n + Object.keys(item).length, 0);
		expect(await page.locator('[data-route]').count()).toBe(operations);
		await page.fill('input[placeholder^="eval"]', 'replay');
		await expect.poll(() => page.locator('[data-route]').count()).toBe(2);
		await screenshot(page, 'scripting-api-page');
	});
});
