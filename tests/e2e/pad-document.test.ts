// The pad as a working document, in a real browser: a typo becomes an attempt (no step number), the kept line is
// selected, steps are named, re-run as versions and hidden, and the database keeps every earlier version. The
// screenshots of the pad list and the step layout land in shots/ for review (not committed).
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import Database from 'better-sqlite3';
import { mkdirSync } from 'node:fs';
import { launch, signInThroughForm } from '../helpers/browser';

const baseUrl = inject('baseUrl');
const SHOTS = 'shots';
let ctx: BrowserContext;
let page: Page;
let padId = '';

const input = () => page.locator('.input-line textarea');
const numbered = () => page.locator('article.step[data-step]:not([data-step=""])');
const step = (n: number) => page.locator(`article.step[data-step="${n}"]`);

function sql<T>(query: string, ...params: unknown[]): T[] {
	const db = new Database(inject('dbFile'), { readonly: true });
	db.pragma('busy_timeout = 5000');
	try {
		return db.prepare(query).all(...params) as T[];
	} finally {
		db.close();
	}
}

async function shot(name: string) {
	mkdirSync(SHOTS, { recursive: true });
	await page.screenshot({ path: `${SHOTS}/${name}.png` });
}

/** Types a line and waits until the pad holds `steps` numbered steps and nothing runs. */
async function run(line: string, steps: number) {
	await input().fill(line);
	await page.keyboard.press('Enter');
	await expect.poll(() => numbered().count(), { timeout: 60_000 }).toBe(steps);
	await expect.poll(() => page.locator('.status-running').count()).toBe(0);
}

beforeAll(async () => {
	ctx = await launch();
	page = await ctx.newPage();
	await signInThroughForm(page, baseUrl, 'tomas@sable.test');
	const before = page.url();
	await page.click('button.new-pad');
	await page.waitForURL((u) => u.pathname.startsWith('/pads/') && u.href !== before);
	await page.waitForSelector('.console[data-ready]');
	padId = new URL(page.url()).pathname.split('/').pop()!;
});
afterAll(async () => {
	await ctx?.close();
});

describe('steps and attempts', () => {
	it('keeps a typo as an attempt with no step number, the line selected so typing replaces it', async () => {
		await input().fill('dara l=0.4');
		await page.keyboard.press('Enter');
		await expect.poll(() => page.locator('article.attempt').count(), { timeout: 60_000 }).toBe(1);
		expect(await numbered().count()).toBe(0);
		expect(await page.locator('article.attempt').textContent()).toMatch(/did you mean 'darea'/);
		// the kept line is selected: the next keys replace it
		await expect
			.poll(() => input().evaluate((el: HTMLTextAreaElement) => [el.selectionStart, el.selectionEnd, el.value.length]))
			.toEqual([0, 10, 10]);
		await expect.poll(() => page.locator('[data-announce]').textContent()).toMatch(/Not evaluated/);
		await page.keyboard.type('darea l=0.4');
		expect(await input().inputValue()).toBe('darea l=0.4');
		await page.keyboard.press('Enter');
		await expect.poll(() => numbered().count(), { timeout: 60_000 }).toBe(1);
		// the good line is #1: the typo took no number
		expect(await step(1).locator('.step-n').textContent()).toBe('#1');
		await expect.poll(() => page.locator('[data-announce]').textContent()).toMatch(/^Step 1: ΔA/);
		const rows = sql<{ n: number; input: string }>('SELECT n, input FROM steps WHERE pad_id = ? ORDER BY n', padId);
		expect(rows).toEqual([{ n: 1, input: 'darea l=0.4' }]);
		const attempts = sql<{ input: string; status: string }>('SELECT input, status FROM attempts WHERE pad_id = ?', padId);
		expect(attempts).toEqual([{ input: 'dara l=0.4', status: 'error' }]);
	});

	it('names a step and reads it back through #name', async () => {
		await step(1).locator('.step-name-button').click();
		await page.locator('.step-name-form input[name=name]').fill('btz');
		await page.keyboard.press('Enter');
		await expect.poll(() => step(1).locator('.step-name').textContent()).toBe('#btz');
		await run('#btz * 2', 2);
		const [a, b] = sql<{ results: string }>('SELECT results FROM steps WHERE pad_id = ? ORDER BY n', padId).map(
			(r) => (JSON.parse(r.results) as { value: number }[])[0]!.value
		);
		expect(b).toBeCloseTo(2 * a!, 14);
	});

	it('re-runs a step with an edited line as its next version, every earlier version kept in the database', async () => {
		await step(1).locator('.step-rerun').click();
		await expect.poll(() => input().inputValue()).toBe('darea l=0.4');
		await expect.poll(() => page.locator('.rerun-banner').textContent()).toMatch(/Re-running #1/);
		await input().fill('darea l=0.5');
		await page.keyboard.press('Enter');
		await expect.poll(() => step(1).getAttribute('data-version'), { timeout: 60_000 }).toBe('2');
		expect(await numbered().count()).toBe(2);
		await expect.poll(() => step(1).locator('.step-versions summary').textContent()).toMatch(/1 earlier version/);
		// and once more: v3, with v1 and v2 both kept
		await step(1).locator('.step-rerun').click();
		await input().fill('darea l=0.6');
		await page.keyboard.press('Enter');
		await expect.poll(() => step(1).getAttribute('data-version'), { timeout: 60_000 }).toBe('3');
		const versions = sql<{ version: number; input: string }>(
			'SELECT v.version, v.input FROM step_versions v JOIN steps s ON s.id = v.step_id WHERE s.pad_id = ? ORDER BY v.version',
			padId
		);
		expect(versions).toEqual([
			{ version: 1, input: 'darea l=0.4' },
			{ version: 2, input: 'darea l=0.5' }
		]);
		const now = sql<{ n: number; input: string; version: number; name: string }>(
			'SELECT n, input, version, name FROM steps WHERE pad_id = ? AND n = 1',
			padId
		);
		expect(now).toEqual([{ n: 1, input: 'darea l=0.6', version: 3, name: 'btz' }]);
	});

	it('hides a step (kept, marked, restorable) and dismisses an attempt without deleting either', async () => {
		await step(2).locator('.step-hide').click();
		await expect.poll(() => step(2).getAttribute('data-hidden')).toBe('true');
		expect(await step(2).textContent()).toMatch(/hidden/);
		// focus went back to the input, not to the page
		await expect.poll(() => page.evaluate(() => document.activeElement?.tagName)).toBe('TEXTAREA');
		expect(sql<{ h: number }>('SELECT hidden_at IS NOT NULL AS h FROM steps WHERE pad_id = ? AND n = 2', padId)).toEqual([{ h: 1 }]);
		await shot('step-layout-hidden');
		await step(2).locator('.step-restore').click();
		await expect.poll(() => step(2).getAttribute('data-hidden')).toBeNull();

		await page.locator('article.attempt .attempt-dismiss').click();
		await expect.poll(() => page.locator('article.attempt').count()).toBe(0);
		expect(sql<{ d: number }>('SELECT dismissed_at IS NOT NULL AS d FROM attempts WHERE pad_id = ?', padId)).toEqual([{ d: 1 }]);
		await page.locator('button.show-dismissed').click();
		await expect.poll(() => page.locator('article.attempt[data-dismissed]').count()).toBe(1);
		await page.locator('button.show-dismissed').click();
		// the whole pad still has every step and every attempt
		expect(sql<{ k: number }>('SELECT count(*) AS k FROM steps WHERE pad_id = ?', padId)).toEqual([{ k: 2 }]);
		expect(sql<{ k: number }>('SELECT count(*) AS k FROM attempts WHERE pad_id = ?', padId)).toEqual([{ k: 1 }]);
	});

	it('after a reload, shows the same steps, names, versions and no dismissed attempt', async () => {
		await page.reload();
		await page.waitForSelector('.console[data-ready]');
		expect(await numbered().count()).toBe(2);
		expect(await step(1).locator('.step-name').textContent()).toBe('#btz');
		expect(await step(1).getAttribute('data-version')).toBe('3');
		expect(await page.locator('article.attempt').count()).toBe(0);
	});
});

describe('units, history and completion', () => {
	it('says what a change of bulk does to cft units and puts the fix in the input', async () => {
		await run('use vacuum d=2', 3);
		await run('units cft c=12', 4);
		await run('use boosted d=4 v=0.3', 5);
		const fix = step(5).locator('.result-fix button');
		await expect.poll(() => fix.textContent()).toMatch(/units geo G=0\.125/);
		await fix.click();
		await expect.poll(() => input().inputValue()).toBe('units geo G=0.125');
		await page.keyboard.press('Enter');
		await expect.poll(() => numbered().count(), { timeout: 60_000 }).toBe(6);
		await run('entropy l=0.3', 7);
		expect(await step(7).getAttribute('data-status')).toBe('ok');
		await shot('step-layout');
	});

	it('searches the history by what is typed with Up and Down', async () => {
		await input().fill('dar');
		await page.keyboard.press('ArrowUp');
		expect(await input().inputValue()).toBe('darea l=0.6');
		await page.keyboard.press('ArrowUp');
		expect(await input().inputValue()).toBe('darea l=0.5');
		await page.keyboard.press('ArrowDown');
		await page.keyboard.press('ArrowDown');
		expect(await input().inputValue()).toBe('dar');
		await input().fill('');
	});

	it('completes dataset and macro names with Tab', async () => {
		await input().fill('compare latt');
		await page.keyboard.press('End');
		await page.keyboard.press('Tab');
		await expect.poll(() => input().inputValue()).toBe('compare lattice_d4 ');
		await input().fill('@btz');
		await page.keyboard.press('End');
		await page.keyboard.press('Tab');
		await expect.poll(() => input().inputValue()).toBe('@btz-check ');
		await input().fill('');
	});

	it('lists pads grouped by their bulk, with parameter chips', async () => {
		const group = page.locator('.bulk-group[data-bulk="boosted"]');
		await expect.poll(() => group.locator(`li[data-pad="${padId}"]`).count()).toBe(1);
		expect(await group.locator(`li[data-pad="${padId}"] .param-chip`).allTextContents()).toEqual(expect.arrayContaining(['d=4', 'v=0.3']));
		// no recency stamps like "· 4 min"
		expect(await page.locator('.pad-list').textContent()).not.toMatch(/·\s*\d+\s*(min|h|d)\b|\bnow\b/);
		await shot('pad-list');
		await page.evaluate(() => document.documentElement.classList.add('dark'));
		await shot('pad-list-dark');
		await page.evaluate(() => document.documentElement.classList.remove('dark'));
	});
});
