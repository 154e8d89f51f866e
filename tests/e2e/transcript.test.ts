// The collaborator's path: a member shares a pad from the console, someone with no account opens the link,
// replays it and sees every step reproduce; after a recorded result is altered, the replay marks that step.
import { afterAll, beforeAll, describe, expect, it, inject } from 'vitest';
import type { BrowserContext } from 'playwright-core';
import Database from 'better-sqlite3';
import { launch, screenshot, signInThroughForm } from '../helpers/browser';

const baseUrl = inject('baseUrl');
let member: BrowserContext;
let visitor: BrowserContext;

beforeAll(async () => {
	member = await launch();
	visitor = await launch();
});
afterAll(async () => {
	await member?.close();
	await visitor?.close();
});

describe('share → transcript → replay', () => {
	let url = '';
	let padId = '';

	it('shares a fresh pad from the console', async () => {
		const page = await member.newPage();
		await signInThroughForm(page, baseUrl, 'tomas@sable.test');
		const before = page.url();
		await page.click('button.new-pad');
		await page.waitForURL((u) => /\/pads\/[0-9a-f]+$/.test(u.pathname) && u.href !== before);
		padId = new URL(page.url()).pathname.split('/').pop()!;
		for (const line of ['use brane d=2 zh=1', 'dentropy l=3', 'mi pair l=1 gap=0.3 d=2']) {
			await page.keyboard.type(line);
			await page.keyboard.press('Enter');
			await page.waitForFunction(
				(n) => document.body.innerText.includes(`#${n}`),
				line === 'use brane d=2 zh=1' ? 1 : line.startsWith('dentropy') ? 2 : 3
			);
		}
		// share opens the sharing panel in place; a link is a snapshot of the pad as it is now
		await page.click('button:text-is("share")');
		await page.click('button:has-text("Share the current state as a new snapshot")');
		const link = page.locator('.share-panel a.share-url').first();
		await link.waitFor();
		url = (await link.getAttribute('href'))!;
		expect(url).toMatch(/\/t\/[A-Za-z0-9_-]+$/);
		await page.close();
	});

	it('lets a visitor with no account replay it, every step reproducing', async () => {
		const page = await visitor.newPage();
		await page.goto(url);
		await expect.poll(() => page.locator('main, body').first().innerText()).toContain('dentropy l=3');
		await page.click('button:has-text("Replay")');
		await expect.poll(() => page.locator('[role=status]').textContent()).toMatch(/All 3 steps reproduce/);
		expect(await page.locator('[data-drift=true]').count()).toBe(0);
		expect(await page.locator('[data-drift=false]').count()).toBe(3);
		await screenshot(page, 'transcript-replayed');
		await page.close();
	});

	it('marks the one step whose recorded result no longer reproduces', async () => {
		// the link shows its snapshot, so that is where the recorded result is altered
		const db = new Database(inject('dbFile'));
		const slug = url.split('/').pop()!;
		const row = db.prepare('select snapshot from shares where slug = ? and pad_id = ?').get(slug, padId) as { snapshot: string };
		const snap = JSON.parse(row.snapshot);
		snap.steps[1].results[0].value *= 1.01; // as if the engine had once answered 1% higher
		db.prepare('update shares set snapshot = ? where slug = ?').run(JSON.stringify(snap), slug);
		db.close();

		const page = await visitor.newPage();
		await page.goto(url);
		await page.click('button:has-text("Replay")');
		await expect.poll(() => page.locator('[role=status]').textContent()).toMatch(/1 of 3 steps drift/);
		const drifted = page.locator('[data-drift=true]');
		expect(await drifted.count()).toBe(1);
		expect(await drifted.innerText()).toContain('dentropy l=3');
		await screenshot(page, 'transcript-drift');
		await page.close();
	});
});
