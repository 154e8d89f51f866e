// The sharing panel on the pad page: the owner shares the current state as a snapshot with a note, the pad
// moves on and the snapshot does not; a referee comments on a step and the owner reads it in the panel; the
// owner revokes from the pad page and the link is gone. Screenshots of the panel go to shots/ for review.
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { mkdirSync } from 'node:fs';
import { launch, signInThroughForm } from '../helpers/browser';
import { signUpConfirmed, type Client } from '../helpers/client';

const baseUrl = inject('baseUrl');
let ownerCtx: BrowserContext;
let refereeCtx: BrowserContext;
let api: Client;
let padId = '';
let url = '';
const email = `share-owner-${Date.now()}@tests.test`;
const password = 'correct horse battery';

/** screenshots for the lead's review, outside the committed test artifacts */
async function shot(page: Page, name: string) {
	mkdirSync('shots', { recursive: true });
	await page.screenshot({ path: `shots/${name}.png`, fullPage: false });
}

beforeAll(async () => {
	ownerCtx = await launch();
	refereeCtx = await launch();
	api = await signUpConfirmed(email, password, 'Share Owner');
	padId = (await api.post('/api/pads', { title: 'Boosted first law, as submitted' })).body.pad.id;
	for (const input of ['use boosted d=4 zh=1 v=0.6', 'darea l=0.4 o=1,2,3,exact', 'firstlaw l=0.4 o=3']) {
		const r = await api.post('/api/eval', { input, pad: padId });
		expect(r.status, JSON.stringify(r.body)).toBe(200);
	}
});
afterAll(async () => {
	await ownerCtx?.close();
	await refereeCtx?.close();
});

describe('sharing from the pad page', () => {
	it('shares the current state as a snapshot that later steps do not change', async () => {
		const page = await ownerCtx.newPage();
		await signInThroughForm(page, baseUrl, email, password);
		await page.goto(`${baseUrl}/pads/${padId}`);
		await page.waitForFunction(() => document.body.innerText.includes('#3'));
		await page.click('button:text-is("share")');
		const panel = page.locator('.share-panel');
		await panel.getByText('Nothing shared yet.').waitFor();
		await panel.locator('input[name=note]').fill('as submitted v1');
		await panel.locator('button:has-text("Share the current state as a new snapshot")').click();
		const snap = panel.locator('li.snapshot').filter({ hasText: 'as submitted v1' });
		await snap.waitFor();
		await expect.poll(() => snap.innerText()).toMatch(/frozen .* UTC · 3 steps/);
		url = (await snap.locator('a.share-url').getAttribute('href'))!;
		expect(url).toMatch(/\/t\/[A-Za-z0-9_-]+$/);
		await shot(page, 'share-panel-pad-page');

		// the pad moves on in the console
		await page.click('button:has-text("close")');
		await page.keyboard.type('tent l=0.4 o=3');
		await page.keyboard.press('Enter');
		await page.waitForFunction(() => document.body.innerText.includes('#4'));

		const reader = await refereeCtx.newPage();
		await reader.goto(url);
		await reader.getByText('as submitted v1').first().waitFor();
		expect(await reader.locator('ol > li').count()).toBe(3);
		expect(await reader.locator('body').innerText()).not.toContain('tent l=0.4 o=3');
		await reader.close();
		await page.close();
	});

	it("brings a referee's comment on a step to the owner's panel", async () => {
		const reader = await refereeCtx.newPage();
		await signInThroughForm(reader, baseUrl, 'ines@sable.test');
		await reader.goto(url);
		const step2 = reader.locator('#step-2');
		await step2.locator('button:has-text("comment on #2")').click();
		await step2.locator('textarea').fill('Which order does the o=3 column mean in the referee report? <b>bold?</b>');
		await step2.locator('button:has-text("Post comment")').click();
		await step2.locator('.comment').filter({ hasText: 'Which order' }).waitFor();
		// plain text: the tag is shown, not rendered
		expect(await step2.locator('.comment b').count()).toBe(0);
		expect(await step2.locator('.comment').innerText()).toContain('<b>bold?</b>');
		await shot(reader, 'share-comment-transcript');
		await reader.close();

		const page = await ownerCtx.newPage();
		await page.goto(`${baseUrl}/pads/${padId}`);
		await page.click('button:text-is("share")');
		const snap = page.locator('.share-panel li.snapshot').filter({ hasText: 'as submitted v1' });
		await snap.locator('button:has-text("1 comment")').click();
		await snap.locator('.comment').filter({ hasText: 'Which order does the o=3 column mean' }).waitFor();
		expect(await snap.locator('.comment').innerText()).toMatch(/on #2 · Inès Cardoso/);
		await shot(page, 'share-panel-comments');
		await page.close();
	});

	it('revokes the snapshot from the pad page, and its link answers not found', async () => {
		const page = await ownerCtx.newPage();
		await page.goto(`${baseUrl}/pads/${padId}`);
		await page.click('button:text-is("share")');
		const snap = page.locator('.share-panel li.snapshot').filter({ hasText: 'as submitted v1' });
		await snap.locator('button:has-text("Revoke")').click();
		await page.locator('.share-panel').getByText('that link now answers').waitFor();
		await expect.poll(() => snap.getAttribute('data-live')).toBe('false');
		await expect.poll(() => snap.innerText()).toMatch(/revoked \d{4}-\d\d-\d\d/);
		await shot(page, 'share-panel-revoked');
		await page.close();

		const visitor = await refereeCtx.newPage();
		const gone = await visitor.goto(url);
		expect(gone?.status()).toBe(404);
		await visitor.close();
	});
});
