// Figures a paper takes, in a real browser: a sweep's figure exported as SVG, PNG (300 dpi), PDF and pgfplots
// (compiled with pdflatex where it and pgfplots exist), a comparison with a fitted zh and its residual panel,
// and `plot #2 #3` overlaying two steps. Screenshots of the overlay land in shots/ for the review.
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { BrowserContext, Download, Locator, Page } from 'playwright-core';
import { execFile, spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { promisify } from 'node:util';
import * as holo from '../../src/lib/holo/index';
import { readDpi } from '../../src/lib/client/figure/png';
import { launch, signInThroughForm, openFreshPad } from '../helpers/browser';

const baseUrl = inject('baseUrl');
const SHOTS = 'shots';
let ctx: BrowserContext;
let page: Page;
const hasPgfplots =
	spawnSync('pdflatex', ['--version']).status === 0 && spawnSync('kpsewhich', ['pgfplots.sty'], { encoding: 'utf8' }).stdout.trim() !== '';

const stepCount = () => page.locator('article.step').count();
const step = (n: number) => page.locator(`article.step[data-step="${n}"]`);

async function run(line: string) {
	const before = await stepCount();
	await page.locator('textarea[aria-label="input line"]').fill(line);
	await page.keyboard.press('Enter');
	await expect.poll(stepCount, { timeout: 60_000 }).toBeGreaterThan(before);
	await expect.poll(() => page.locator('.status-running').count()).toBe(0);
}

async function download(fig: Locator, kind: string): Promise<{ name: string; bytes: Buffer }> {
	const [d] = await Promise.all([page.waitForEvent('download') as Promise<Download>, fig.locator(`button[data-export="${kind}"]`).click()]);
	return { name: d.suggestedFilename(), bytes: readFileSync((await d.path())!) };
}

/** synthetic "numerics": ΔA of the d=4 brane with zh = 1.3 at ten widths, 1 % Gaussian noise from a fixed seed */
function syntheticCsv(): string {
	const b = holo.makeBulk('brane', { d: 4, zh: 1.3 });
	let seed = 11;
	const u = () => {
		seed = (seed * 1103515245 + 12345) % 2147483648;
		return (seed + 0.5) / 2147483648;
	};
	const rows = Array.from({ length: 10 }, (_, i) => {
		const l = 0.2 + 0.1 * i;
		const y = holo.deltaArea(b, l);
		const s = 0.01 * y;
		const g = Math.sqrt(-2 * Math.log(u())) * Math.cos(2 * Math.PI * u());
		return `${l},${y + s * g},${s}`;
	});
	return `l,darea,sigma\n${rows.join('\n')}\n`;
}

beforeAll(async () => {
	mkdirSync(SHOTS, { recursive: true });
	ctx = await launch({ width: 1280, height: 900 });
	page = await ctx.newPage();
	await signInThroughForm(page, baseUrl, 'ines@sable.test');
	const file = join(mkdtempSync(join(tmpdir(), 'bulkpad-fig-')), 'syn_zh.csv');
	writeFileSync(file, syntheticCsv());
	await page.goto(`${baseUrl}/datasets`);
	await page.setInputFiles('input[type=file]', file);
	await page.click('button:has-text("Upload")');
	await page.waitForFunction(() => /uploaded|replaced/.test(document.querySelector('[role=status]')?.textContent ?? ''));
	await page.goto(`${baseUrl}/pads`);
	await page.waitForURL(/\/pads\/[0-9a-f]+$/);
	await openFreshPad(page);
});
afterAll(async () => {
	await ctx?.close();
});

describe('figures for a paper', () => {
	it("shows a new plot from its top, with LaTeX axis labels, integer-free band labels that don't overlap", async () => {
		await run('use boosted d=4 zh=1 v=0.6');
		await run('sweep darea l=0.05..1.2:40 o=1,2,3,exact');
		const fig = step(2).locator('figure.plot-view');
		await expect.poll(() => fig.count()).toBe(1);
		// the top of the new step is in view
		const top = await step(2).evaluate((el) => {
			const s = el.closest('main')!.getBoundingClientRect();
			return el.getBoundingClientRect().top - s.top;
		});
		expect(top).toBeGreaterThanOrEqual(-1);
		const labels = await fig.locator('text.axis-label').allTextContents();
		expect(labels).toContain('ℓ');
		expect(labels).toContain('ΔA');
		const boxes = await fig
			.locator('text.band-label')
			.evaluateAll((ts) => ts.map((t) => ({ ...(t as SVGGraphicsElement).getBoundingClientRect().toJSON(), text: t.textContent })));
		for (let i = 0; i < boxes.length; i++)
			for (let j = i + 1; j < boxes.length; j++) {
				const a = boxes[i]!;
				const b = boxes[j]!;
				expect(
					a.right <= b.left || b.right <= a.left || a.bottom <= b.top || b.bottom <= a.top,
					`band labels ${JSON.stringify(a)} and ${JSON.stringify(b)}`
				).toBe(true);
			}
		expect(await fig.locator('text.legend-text').allTextContents()).toContain('shaded: series within 1e-3 of exact (relative), ℓ ≤ ℓ_max');
		await fig.screenshot({ path: join(SHOTS, 'sweep-orders-bands.png') });
	});

	it('exports the figure as SVG, PNG at 300 dpi, PDF and pgfplots, each named after ΔA', async () => {
		const fig = step(2).locator('figure.plot-view');
		const svg = await download(fig, 'svg');
		expect(svg.name).toBe('delta-a-vs-l-boosted-d-4-zh-1-v-0-6.svg');
		const text = svg.bytes.toString('utf8');
		expect(text).toMatch(/^<svg xmlns="http:\/\/www.w3.org\/2000\/svg"/);
		expect(text.match(/class="series-path"/g)).toHaveLength(4);
		expect(text).not.toContain('currentColor');

		const png = await download(fig, 'png');
		expect(png.name.endsWith('.png')).toBe(true);
		expect([...png.bytes.subarray(0, 8)]).toEqual([137, 80, 78, 71, 13, 10, 26, 10]);
		expect(png.bytes.readUInt32BE(16)).toBe(2000); // IHDR width: 640 px × 3.125
		expect(readDpi(new Uint8Array(png.bytes))).toBe(300);

		const pdf = await download(fig, 'pdf');
		expect(pdf.bytes.subarray(0, 8).toString('latin1')).toBe('%PDF-1.4');
		expect(pdf.bytes.toString('latin1')).toContain('/BaseFont /Symbol');

		const pgf = await download(fig, 'pgf');
		const tex = pgf.bytes.toString('utf8');
		expect(tex).toMatch(/^[\x20-\x7e\n]*$/);
		expect(tex).toContain('ylabel={$\\Delta A$}');
		if (hasPgfplots) {
			const dir = mkdtempSync(join(tmpdir(), 'bulkpad-pgf-'));
			writeFileSync(join(dir, 'fig.tex'), tex);
			const r = await promisify(execFile)('pdflatex', ['-interaction=nonstopmode', '-halt-on-error', '-no-shell-escape', 'fig.tex'], {
				cwd: dir
			}).then(
				() => 0,
				(e: { code: number; stdout: string }) => (console.error(e.stdout.slice(-1500)), e.code)
			);
			expect(r).toBe(0);
		}
	});

	it('edits a label as LaTeX and the file follows', async () => {
		const fig = step(2).locator('figure.plot-view');
		await fig.locator('button.figure-labels').click();
		await fig.locator('input[aria-label="y label (LaTeX)"]').fill('\\Delta A/\\ell^{2}');
		await expect.poll(() => fig.locator('text.axis-label').allTextContents()).toContain('ΔA/ℓ2');
		const pgf = await download(fig, 'pgf');
		expect(pgf.bytes.toString('utf8')).toContain('ylabel={$\\Delta A/\\ell^{2}$}');
		await fig.locator('button.figure-labels').click();
	});

	it('fits zh to a dataset with errors: markers with error bars, the engine line, a residual panel', async () => {
		await run('use brane d=4 zh=1');
		await run('sweep darea l=0.2..1.1:10 zh=1.3 o=exact');
		await run('compare syn_zh darea o=exact fit=zh');
		const s = step(5);
		const text = await s.innerText();
		const m = /zh fitted \(exact\) = ([\d.]+) ± ([\d.e-]+)/.exec(text);
		expect(m, text).not.toBeNull();
		expect(Math.abs(Number(m![1]) - 1.3)).toBeLessThan(3 * Number(m![2]));
		expect(text).toMatch(/χ²\/dof/);
		const fig = s.locator('figure.plot-view');
		expect(await fig.locator('text.residual-label').count()).toBe(1);
		expect(await fig.locator('line.error-bar').count()).toBeGreaterThanOrEqual(10);
		await fig.screenshot({ path: join(SHOTS, 'compare-fit-residual.png') });
	});

	it('plot #4 #5 overlays the two steps on one figure, with the residual panel, in light and dark', async () => {
		await run('plot #4 #5 ylabel="\\Delta A"');
		const fig = step(6).locator('figure.plot-view');
		await expect.poll(() => fig.count()).toBe(1);
		expect(await fig.locator('path.series-path').count()).toBe(2);
		expect(await fig.locator('text.legend-text').allTextContents()).toEqual(expect.arrayContaining(['#4 exact', '#5 engine', 'syn_zh ±σ']));
		expect(await fig.locator('text.residual-label').count()).toBe(1);
		await fig.scrollIntoViewIfNeeded();
		await fig.screenshot({ path: join(SHOTS, 'overlay-two-steps-residual.png') });
		await page.evaluate(() => document.documentElement.classList.add('dark'));
		await fig.screenshot({ path: join(SHOTS, 'overlay-two-steps-residual-dark.png') });
		await page.evaluate(() => document.documentElement.classList.remove('dark'));
		const pdf = await download(fig, 'pdf');
		expect(pdf.bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
		const png = await download(fig, 'png');
		writeFileSync(join(SHOTS, 'overlay-two-steps-residual-export.png'), png.bytes);
		const svg = await download(fig, 'svg');
		writeFileSync(join(SHOTS, 'overlay-two-steps-residual-export.svg'), svg.bytes);
		const pgf = await download(fig, 'pgf');
		expect(pgf.bytes.toString('utf8')).toContain('at={(main.south west)}');
	});

	it('help: ?darea in the pad, the palette detail pane, and the decimal-comma hint', async () => {
		await run('?darea');
		expect(await step(7).innerText()).toMatch(/method: .*accuracy: .*source: .*examples: /s);
		await page.keyboard.press('Control+k');
		await page.locator('.palette-input').fill('darea');
		const pane = page.locator('.palette-detail');
		await expect.poll(() => pane.count()).toBe(1);
		expect(await pane.innerText()).toMatch(/darea[\s\S]*forms[\s\S]*method[\s\S]*accuracy[\s\S]*source[\s\S]*examples/);
		await pane.screenshot({ path: join(SHOTS, 'palette-detail.png') });
		await page.keyboard.press('Escape');
		await page.locator('textarea[aria-label="input line"]').fill('darea l=0,4');
		await page.keyboard.press('Enter');
		await expect.poll(() => page.locator('.line-error').innerText()).toMatch(/decimal point[\s\S]*l=0\.4/);
	});
});
