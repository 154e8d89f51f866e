// axe-core (Deque's accessibility engine, run inside the page) on the pages people work in: sign-in, a pad, a
// public transcript and the library, in the light and the dark theme. No serious or critical violation may
// remain; lesser ones are printed so they can be seen, not hidden.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { launch, signInThroughForm } from '../helpers/browser';

const baseUrl = inject('baseUrl');
const AXE = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');
let anon: BrowserContext;
let member: BrowserContext;

interface Violation {
	id: string;
	impact: string | null;
	help: string;
	nodes: { target: string[]; failureSummary?: string }[];
}

async function audit(page: Page, dark: boolean): Promise<Violation[]> {
	await page.evaluate((d) => document.documentElement.classList.toggle('dark', d), dark);
	if (!(await page.evaluate(() => 'axe' in window))) await page.evaluate(AXE);
	const result = (await page.evaluate(() =>
		(window as unknown as { axe: { run: (c: unknown, o: unknown) => Promise<{ violations: unknown[] }> } }).axe.run(document, {
			resultTypes: ['violations']
		})
	)) as { violations: Violation[] };
	return result.violations;
}

/** Serious and critical violations fail the test, with where they are; the rest are printed. */
async function expectAccessible(page: Page, what: string) {
	for (const dark of [false, true]) {
		const violations = await audit(page, dark);
		const theme = dark ? 'dark' : 'light';
		const minor = violations.filter((v) => v.impact !== 'serious' && v.impact !== 'critical');
		if (minor.length) console.log(`${what} (${theme}): ${minor.map((v) => `${v.id} (${v.impact})`).join(', ')}`);
		const bad = violations
			.filter((v) => v.impact === 'serious' || v.impact === 'critical')
			.map(
				(v) =>
					`${v.id} (${v.impact}): ${v.help} — ${v.nodes
						.map((n) => n.target.join(' '))
						.slice(0, 5)
						.join(' | ')}`
			);
		expect(bad, `${what} in the ${theme} theme`).toEqual([]);
	}
}

beforeAll(async () => {
	anon = await launch();
	member = await launch();
});
afterAll(async () => {
	await anon?.close();
	await member?.close();
});

describe('no serious or critical accessibility violations', () => {
	it('on the sign-in page', async () => {
		const page = await anon.newPage();
		await page.goto(`${baseUrl}/signin`);
		await expectAccessible(page, 'sign-in');
	});

	it('on a public transcript, before and after a replay', async () => {
		const page = await anon.newPage();
		await page.goto(`${baseUrl}/t/sable-boosted-first-law`);
		await page.waitForLoadState('networkidle');
		await expectAccessible(page, 'transcript');
	});

	it('on a pad with formulas, a table and a plot, and on the pad list', async () => {
		const page = await member.newPage();
		await signInThroughForm(page, baseUrl, 'ines@sable.test');
		await page.locator('.pad-list a', { hasText: 'first law' }).click();
		await page.waitForSelector('.console[data-ready]');
		await expect.poll(() => page.locator('article.step').count()).toBeGreaterThan(3);
		// a failed line too: the attempt and the error under the input
		await page.locator('.input-line textarea').fill('dara l=0.4');
		await page.keyboard.press('Enter');
		await expect.poll(() => page.locator('.line-error').count(), { timeout: 60_000 }).toBe(1);
		await expectAccessible(page, 'pad');
		// the palette, open over the pad
		await page.keyboard.press('Control+k');
		await expect.poll(() => page.locator('.palette').count()).toBe(1);
		await expectAccessible(page, 'palette');
		await page.keyboard.press('Escape');
	});

	it('on the library', async () => {
		const page = await member.newPage();
		await page.goto(`${baseUrl}/library`);
		await page.waitForLoadState('networkidle');
		await expectAccessible(page, 'library');
	});

	it('on the API page, with its examples open', async () => {
		const page = await anon.newPage();
		await page.goto(`${baseUrl}/help/api`);
		await page.locator('[data-route="POST /api/eval"] summary').click();
		await expectAccessible(page, 'API page');
	});
});
