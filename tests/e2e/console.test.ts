// The console in a real browser: a member signs in, works a pad from the keyboard, and the page shows what
// POST /api/eval answers for the same lines.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { inject } from 'vitest';
import type { BrowserContext, Page } from 'playwright-core';
import { launch, screenshot, signInThroughForm, openFreshPad } from '../helpers/browser';

const baseUrl = inject('baseUrl');
let ctx: BrowserContext;
let page: Page;

const input = () => page.locator('textarea[aria-label="input line"]');
const stepCount = () => page.locator('article.step').count();
const lastStep = () => page.locator('article.step').last();

/** Types a line into the focused input and waits for the step it makes. */
async function run(line: string) {
	const before = await stepCount();
	await input().fill(line);
	await page.keyboard.press('Enter');
	await expect.poll(stepCount, { timeout: 30_000 }).toBeGreaterThan(before);
	await expect.poll(() => page.locator('.status-running').count()).toBe(0);
}

async function evalApi(line: string) {
	const r = await page.request.post(`${baseUrl}/api/eval`, { data: { input: line } });
	return { status: r.status(), body: await r.json() };
}

beforeAll(async () => {
	ctx = await launch();
	page = await ctx.newPage();
	await signInThroughForm(page, baseUrl, 'ines@sable.test');
	// a fresh pad of our own so the steps are numbered from #1
	await openFreshPad(page);
});
afterAll(async () => {
	await ctx?.close();
});

describe('the console', () => {
	it('starts on an empty pad with the input focused, the prompt mark and the status line', async () => {
		await expect.poll(() => page.locator('.prompt-mark').textContent()).toBe('∴');
		expect(await page.locator('.status-bulk').textContent()).toMatch(/brane d=4 zh=1/);
		expect(await page.locator('.status-line').textContent()).toMatch(/Inès Cardoso/);
		const text = (await page.locator('body').textContent()) ?? '';
		expect(text).not.toMatch(/\b(cell|kernel|notebook|worksheet)s?\b/i);
		expect(text).not.toMatch(/\b(In|Out)\[\d*\]/);
		await screenshot(page, 'console-empty');
	});

	it('evaluates lines into numbered steps whose table matches POST /api/eval', async () => {
		await run('use boosted d=4 zh=1 v=0.6');
		expect(await page.locator('.status-bulk').textContent()).toMatch(/boosted d=4 zh=1 v=0.6/);
		await run('darea l=0.4 o=1,2,3,exact');
		const step = lastStep();
		expect(await step.locator('.step-n').textContent()).toBe('#2');
		const api = await evalApi('use boosted d=4 zh=1 v=0.6; darea l=0.4 o=1,2,3,exact');
		expect(api.status).toBe(200);
		const results = api.body.results as { kind: string; columns?: string[]; rows?: unknown[][]; value?: number }[];
		const table = results.find((r) => r.kind === 'table');
		if (table) {
			const cells = await step.locator('table.data-table tbody td').evaluateAll((tds) => tds.map((td) => td.getAttribute('title')));
			expect(cells.map((c) => (c === 'no value' ? null : Number(c)))).toEqual(
				table.rows!.flat().map((v) => (v === null ? null : Number(v)))
			);
			const heads = await step.locator('table.data-table thead th').allTextContents();
			expect(heads.map((h) => h.trim())).toEqual(table.columns!.map((c) => (/^o\d+$/.test(c) ? `order ${c.slice(1)}` : c)));
		} else {
			// an engine that answers one scalar per order: the shown values are the API's, in order
			const shown = await step.locator('.result-scalar .value').evaluateAll((els) => els.map((e) => Number(e.getAttribute('title'))));
			expect(shown).toEqual(results.filter((r) => r.kind === 'scalar').map((r) => r.value));
		}
		await screenshot(page, 'console-darea');
	});

	it('plots a sweep with one path per order plus exact, and reads out values on hover', async () => {
		await run('sweep darea l=0.05..1.2:40 o=1,2,3,exact');
		const plot = lastStep().locator('figure.plot-view');
		await expect.poll(() => plot.count()).toBe(1);
		const cols = await plot.locator('path.series-path').evaluateAll((ps) => ps.map((p) => p.getAttribute('data-col')));
		expect(cols).toEqual(['o1', 'o2', 'o3', 'exact']);
		for (const d of await plot.locator('path.series-path').evaluateAll((ps) => ps.map((p) => p.getAttribute('d') ?? '')))
			expect(d).toMatch(/^M[\d.]+,[\d.]+L/);
		const box = (await plot.locator('svg').boundingBox())!;
		await page.mouse.move(box.x + box.width * 0.5, box.y + box.height * 0.5);
		await expect.poll(() => plot.locator('.plot-readout').textContent()).toMatch(/ℓ = [\d.]+.*order 1.*exact/);
		await plot.getByText('log ℓ').click();
		await expect.poll(() => plot.locator('path.series-path').count()).toBe(4);
		await screenshot(page, 'console-sweep');
		await plot.getByText('log ℓ').click();
	});

	it('opens the palette with Ctrl-K, filters it, and runs a verb from it', async () => {
		await page.keyboard.press('Control+k');
		const palette = page.locator('.palette');
		await expect.poll(() => palette.count()).toBe(1);
		await page.keyboard.type('tent');
		const selected = palette.locator('[data-cmdk-item][data-selected]');
		await expect.poll(() => selected.textContent()).toMatch(/tent/);
		await screenshot(page, 'palette');
		await page.keyboard.press('Enter');
		await expect.poll(() => palette.count()).toBe(0);
		await expect.poll(() => input().inputValue()).toMatch(/^tent /);
		const before = await stepCount();
		await page.keyboard.press('Enter');
		await expect.poll(stepCount, { timeout: 30_000 }).toBe(before + 1);
		await expect.poll(() => lastStep().textContent()).toMatch(/order 3|exact|tent|✗|error|unknown/i);
	});

	it('opens the palette with / on an empty line and closes it with Esc', async () => {
		await input().fill('');
		await page.keyboard.press('/');
		await expect.poll(() => page.locator('.palette').count()).toBe(1);
		await page.keyboard.press('Escape');
		await expect.poll(() => page.locator('.palette').count()).toBe(0);
		await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).toBe('input line');
	});

	it('recalls earlier lines with Up and comes back with Down', async () => {
		await input().fill('');
		await page.keyboard.press('ArrowUp');
		expect(await input().inputValue()).toMatch(/^tent /);
		await page.keyboard.press('ArrowUp');
		expect(await input().inputValue()).toBe('sweep darea l=0.05..1.2:40 o=1,2,3,exact');
		await page.keyboard.press('ArrowDown');
		await page.keyboard.press('ArrowDown');
		expect(await input().inputValue()).toBe('');
	});

	it('completes with Tab', async () => {
		await input().fill('');
		await page.keyboard.type('dare');
		await page.keyboard.press('Tab');
		expect(await input().inputValue()).toBe('darea ');
		await page.keyboard.type('l=0.3 o=ex');
		await page.keyboard.press('Tab');
		expect(await input().inputValue()).toBe('darea l=0.3 o=exact ');
		await page.keyboard.press('Escape');
		expect(await input().inputValue()).toBe('');
	});

	it('shows a bad line’s error with the offending characters marked, and keeps the line typed', async () => {
		await input().fill('dara l=0.4');
		await page.keyboard.press('Enter');
		const err = page.locator('.line-error');
		await expect.poll(() => err.count(), { timeout: 30_000 }).toBe(1);
		expect(await err.locator('mark.bad').textContent()).toBe('dara');
		expect(await err.textContent()).toMatch(/darea/);
		expect(await input().inputValue()).toBe('dara l=0.4');
		// the typo is an attempt: it took no step number
		expect(await page.locator('article.step[data-step]').evaluateAll((els) => els.map((e) => e.textContent ?? ''))).not.toContainEqual(
			expect.stringContaining('dara l=0.4')
		);
		await screenshot(page, 'console-error');
		await input().fill('');
		await page.keyboard.press('ArrowUp');
		expect(await input().inputValue()).toBe('dara l=0.4');
		await input().fill('');
	});

	it('keeps the pad across a reload', async () => {
		const url = page.url();
		const inputs = await page.locator('article.step .step-input').allTextContents();
		await page.reload();
		expect(page.url()).toBe(url);
		await expect.poll(() => page.locator('article.step .step-input').allTextContents()).toEqual(inputs);
		expect(inputs.slice(0, 2)).toEqual(['use boosted d=4 zh=1 v=0.6', 'darea l=0.4 o=1,2,3,exact']);
		expect(await page.locator('.status-bulk').textContent()).toMatch(/boosted/);
		// formulas were typeset on the server, before any script ran
		await expect.poll(() => page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).toBe('input line');
	});

	it('shows a long sweep’s progress and cancels it with Esc, keeping the line', async () => {
		// A line that can never finish while the test looks at it, on any machine: 2000 points of mutual information
		// in a metric bulk whose f and h are as long as a formula may be (~0.1 s a point here even when idle), so
		// minutes of work, far past the test server's budget. Whether the work is fast or slow, the test only sees
		// progress, then the cancel. (Exact balls served here until ball-shot.ts made them milliseconds.)
		const junk = (fn: string) => Array(52).fill(`${fn}(z)`).join('+');
		const line = `use metric f="1-z^4+0*(${junk('sin')})" h="1+0*(${junk('cos')})"; sweep mi pair l=0.2..1.2:2000 gap=0.1`;
		await input().fill(line);
		await page.keyboard.press('Enter');
		await expect.poll(() => page.locator('.status-running').textContent(), { timeout: 60_000, interval: 20 }).toMatch(/\d+\/2000/);
		await screenshot(page, 'console-running');
		await page.keyboard.press('Escape');
		await expect.poll(() => page.locator('.status-running').count(), { timeout: 60_000 }).toBe(0);
		await expect.poll(() => page.locator('.notice').textContent()).toMatch(/Cancelled/);
		expect(await input().inputValue()).toBe(line);
		// a cancelled line is kept as an attempt, not a numbered step: the server's record replaces the local mark
		// once the page data reloads
		const attempt = page.locator('article.attempt').last();
		await expect.poll(() => attempt.getAttribute('data-attempt'), { timeout: 60_000 }).toMatch(/\w+/);
		expect(await attempt.textContent()).toContain('sweep mi pair l=0.2..1.2:2000');
		await screenshot(page, 'console-cancelled');

		// one left to finish: a short sweep in a custom metric (milliseconds of work), so only its final state is
		// checked — a step with the plot — with room for a machine of any speed
		const before = await stepCount();
		await input().fill('use metric d=6 f="1 - (z/zh)^6 + 0.3*(z/zh)^8" zh=1; sweep darea l=0.05..1.5:30 o=exact');
		await page.keyboard.press('Enter');
		await expect.poll(stepCount, { timeout: 60_000 }).toBeGreaterThan(before);
		await expect.poll(() => page.locator('.status-running').count(), { timeout: 60_000 }).toBe(0);
		const last = lastStep();
		await expect.poll(() => last.getAttribute('data-status'), { timeout: 60_000 }).not.toBe('pending');
		expect(await last.getAttribute('data-status'), (await last.textContent()) ?? '').toBe('ok');
		await expect.poll(() => last.locator('path.series-path').count()).toBe(1);
	});

	it('queues lines typed while one runs, and a cancel gives back the running line and the queue', async () => {
		// the endless line of the test above: it is certainly still running while the next line is typed
		const junk = (fn: string) => Array(52).fill(`${fn}(z)`).join('+');
		const endless = `use metric f="1-z^4+0*(${junk('sin')})" h="1+0*(${junk('cos')})"; sweep mi pair l=0.2..1.2:2000 gap=0.1`;
		await input().fill(endless);
		await page.keyboard.press('Enter');
		await expect.poll(() => page.locator('.status-running').count(), { timeout: 60_000 }).toBe(1);
		expect(await input().inputValue()).toBe('');
		await page.keyboard.type('darea l=0.45');
		await page.keyboard.press('Enter');
		await expect.poll(() => page.locator('.line-queued').count()).toBe(1);
		expect(await page.locator('.line-queued').textContent()).toContain('darea l=0.45');
		await page.keyboard.type('zstar l=0.3');
		await screenshot(page, 'console-queued');
		await page.keyboard.press('Escape');
		await expect.poll(() => page.locator('.status-running').count(), { timeout: 60_000 }).toBe(0);
		// nothing typed is lost: the cancelled line, the queued one and the half-typed one, in that order
		await expect.poll(() => input().inputValue()).toBe(`${endless}\ndarea l=0.45\nzstar l=0.3`);
		expect(await page.locator('.line-queued').count()).toBe(0);
	});

	it('runs lines typed in quick succession in order, none lost, whether or not the first is still running', async () => {
		await input().fill('');
		const before = await stepCount();
		for (const l of ['darea l=0.31', 'darea l=0.32', 'darea l=0.33']) {
			await page.keyboard.type(l);
			await page.keyboard.press('Enter');
		}
		await expect.poll(stepCount, { timeout: 60_000 }).toBe(before + 3);
		await expect.poll(() => page.locator('.line-running').count(), { timeout: 60_000 }).toBe(0);
		const inputs = await page.locator('article.step code.step-input').evaluateAll((els) => els.slice(-3).map((e) => e.textContent));
		expect(inputs).toEqual(['darea l=0.31', 'darea l=0.32', 'darea l=0.33']);
	});

	it('renames and deletes a pad from the side panel, after a confirm', async () => {
		const id = new URL(page.url()).pathname.split('/').pop()!;
		await page.click('.pad-title button');
		await page.fill('input[name=title]', 'Console test pad');
		await page.keyboard.press('Enter');
		await expect.poll(() => page.locator(`li[data-pad="${id}"]`).textContent()).toMatch(/Console test pad/);
		const item = page.locator(`li[data-pad="${id}"]`);
		await item.hover();
		await item.locator('button[title=delete]').click();
		await expect.poll(() => item.textContent()).toMatch(/Delete “Console test pad”/);
		await screenshot(page, 'pad-delete-confirm');
		await item.locator('button.confirm-delete').click();
		await page.waitForURL((u) => !u.pathname.endsWith(id));
		await expect.poll(() => page.locator(`li[data-pad="${id}"]`).count()).toBe(0);
	});

	it('sends a signed-out visitor of a pad to sign in, and back after', async () => {
		const other = await launch();
		const p = await other.newPage();
		const url = page.url();
		await p.goto(url);
		expect(new URL(p.url()).pathname).toBe('/signin');
		expect(new URL(p.url()).searchParams.get('next')).toBe(new URL(url).pathname);
		await other.close();
	});
});

describe('the console on a tablet, dark', () => {
	let tab: BrowserContext;
	afterAll(async () => tab?.close());

	it('is usable at 820×1180 with the pad list in a drawer', async () => {
		tab = await launch({ width: 820, height: 1180 });
		const p = await tab.newPage();
		await p.addInitScript(() => localStorage.setItem('bulkpad-theme', 'dark'));
		await signInThroughForm(p, baseUrl, 'ines@sable.test');
		await p.waitForLoadState('networkidle');
		expect(await p.evaluate(() => document.documentElement.classList.contains('dark'))).toBe(true);
		// the seeded pad with formulas, tables and a plot
		await p.click('button.drawer-toggle');
		await p.locator('.pad-list a', { hasText: 'first law' }).click();
		await expect.poll(() => p.locator('article.step').count()).toBeGreaterThan(3);
		const wide = await p.evaluate(() => document.documentElement.scrollWidth);
		expect(wide).toBeLessThanOrEqual(820);
		await screenshot(p, 'tablet-dark');
		await p.click('button.drawer-toggle');
		// the drawer slides in: wait for where it ends, not for a fixed time
		await expect.poll(async () => (await p.locator('#side-panel').boundingBox())?.x ?? -1).toBeGreaterThanOrEqual(0);
		expect(await p.locator('.pad-list li').count()).toBeGreaterThan(1);
		await screenshot(p, 'tablet-dark-drawer');
	});
});
