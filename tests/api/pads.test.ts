// Pads API: CRUD, who may read and change a pad, whole-pad export (Markdown, LaTeX, JSON) and import.
import { execFile, spawnSync } from 'node:child_process';
import { promisify } from 'node:util';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { Client, freshMember, inviteAndAccept } from '../helpers/client';
import { expectFailure, freshWithRole, signInPatiently } from '../helpers/roles';
import { padWithSteps, sql } from './support/pads';

const LINES = ['use brane d=3 zh=1', 'darea l=0.3 o=2', 'sweep darea l=0.1..0.5:5 o=1,exact', 'coeffs darea o=3 | tex', '#2 * 2', 'thermo'];

let owner: Client;
let other: Client;
let reader: Client;
let padId: string;

beforeAll(async () => {
	const admin = await signInPatiently('curator@sable.test');
	owner = await freshMember('pad-owner');
	other = await freshMember('pad-other');
	reader = await freshWithRole(admin, 'pad-reader', 'reader');
	padId = await padWithSteps(owner, 'Strip checks', LINES);
	// a line that fails is an attempt now (no number)...
	const bad = await owner.post('/api/eval', { input: 'darea l=', pad: padId });
	expect(bad.status).toBe(400);
	expect(bad.body.step).toBeUndefined();
	// ...but pads from before attempts existed hold numbered error steps, which must still travel through export
	// and import: one is written here as the old code wrote it
	sql(
		"INSERT INTO steps (id, pad_id, n, input, status, error, bulk_before, created_at) VALUES (?, ?, 7, 'darea l=', 'error', ?, ?, ?)",
		`legacy-${padId}`,
		padId,
		JSON.stringify(bad.body.error),
		JSON.stringify({ name: 'brane', params: { d: 3, zh: 1 } }),
		Date.now()
	);
});

describe('CRUD', () => {
	it('creates, lists, reads, renames and deletes a pad', async () => {
		const created = await owner.post('/api/pads', { title: 'Scratch' });
		expect(created.status).toBe(201);
		const pad = created.body.pad;
		expect(pad).toMatchObject({ title: 'Scratch', bulk: { name: 'brane', params: { d: 4, zh: 1 } }, history: [], lets: {} });
		expect(pad.owner.name).toBe('pad-owner');

		const list = await owner.get('/api/pads');
		expect(list.status).toBe(200);
		const listed = list.body.pads.find((p: { id: string }) => p.id === pad.id);
		expect(Object.keys(listed).sort()).toEqual(['bulk', 'id', 'title', 'updatedAt']);

		const renamed = await owner.patch(`/api/pads/${pad.id}`, { title: 'Scratch, renamed' });
		expect(renamed.status).toBe(200);
		expect((await owner.get(`/api/pads/${pad.id}`)).body.pad.title).toBe('Scratch, renamed');

		expect((await owner.del(`/api/pads/${pad.id}`)).status).toBe(200);
		expectFailure(await owner.get(`/api/pads/${pad.id}`), 404);
		expect((await owner.get('/api/pads')).body.pads.some((p: { id: string }) => p.id === pad.id)).toBe(false);
	});

	it('gives a default title to an empty body and refuses bad titles', async () => {
		const empty = await owner.request('POST', '/api/pads', undefined, { 'content-type': 'application/json' });
		expect(empty.status).toBe(201);
		expect(empty.body.pad.title.length).toBeGreaterThan(0);
		expectFailure(await owner.post('/api/pads', { title: '' }), 400);
		expectFailure(await owner.post('/api/pads', { title: 'two\nlines' }), 400);
		expectFailure(await owner.patch(`/api/pads/${padId}`, { title: 'x'.repeat(201) }), 400);
	});

	it('answers a pad with its steps in the shape of API.md', async () => {
		const r = await owner.get(`/api/pads/${padId}`);
		expect(r.status).toBe(200);
		expect(Object.keys(r.body.pad).sort()).toEqual([
			'bulk',
			'createdAt',
			'history',
			'id',
			'lets',
			'owner',
			'title',
			'units',
			'updatedAt',
			'validityTol'
		]);
		expect(r.body.pad.bulk).toEqual({ name: 'brane', params: { d: 3, zh: 1 } });
		expect(r.body.pad.history).toEqual([...LINES, 'darea l=']);
		const steps = r.body.steps;
		expect(steps.map((s: { n: number }) => s.n)).toEqual([1, 2, 3, 4, 5, 6, 7]);
		expect(steps.map((s: { input: string }) => s.input)).toEqual([...LINES, 'darea l=']);
		for (const s of steps)
			expect(Object.keys(s).sort()).toEqual([
				'error',
				'figureLabels',
				'hidden',
				'id',
				'input',
				'ms',
				'n',
				'name',
				'results',
				'status',
				'version'
			]);
		// the owner also sees the failed line, as an attempt after the last step
		expect(r.body.attempts).toEqual([expect.objectContaining({ input: 'darea l=', status: 'error', afterN: 6, dismissed: false })]);
		expect(steps[6]).toMatchObject({ status: 'error', results: null });
		expect(typeof steps[6].error.message).toBe('string');
		// #5 is twice #2, so the stored steps are the engine's, in order
		expect(steps[4].results[0].value).toBeCloseTo(2 * steps[1].results[0].value, 14);
	});

	it('asks for an account, and readers may not make pads', async () => {
		expectFailure(await new Client().get('/api/pads'), 401);
		expectFailure(await new Client().get(`/api/pads/${padId}`), 401);
		expectFailure(await reader.post('/api/pads', { title: 'mine' }), 403);
	});
});

describe('other people', () => {
	it("answers 404 for another member's pad, whatever the method", async () => {
		for (const r of [
			await other.get(`/api/pads/${padId}`),
			await other.patch(`/api/pads/${padId}`, { title: 'taken' }),
			await other.del(`/api/pads/${padId}`),
			await other.get(`/api/pads/${padId}/export?format=json`),
			await other.post(`/api/pads/${padId}/share`, {}),
			await other.post(`/api/pads/${padId}/invite`, { email: 'x@tests.test' }),
			await other.get('/api/pads/no-such-pad')
		]) {
			expectFailure(r, 404);
		}
		expect((await owner.get(`/api/pads/${padId}`)).body.pad.title).toBe('Strip checks');
	});

	it('lets an invited reader read and export but not change the pad', async () => {
		expectFailure(await reader.get(`/api/pads/${padId}`), 404);
		await inviteAndAccept(owner, padId, reader);

		const r = await reader.get(`/api/pads/${padId}`);
		expect(r.status).toBe(200);
		expect(r.body.steps).toHaveLength(7);
		expect((await reader.get(`/api/pads/${padId}/export?format=md`)).status).toBe(200);

		expectFailure(await reader.patch(`/api/pads/${padId}`, { title: 'mine now' }), 403);
		expectFailure(await reader.del(`/api/pads/${padId}`), 403);
		expectFailure(await reader.post('/api/eval', { input: 'thermo', pad: padId }), 403);
		expectFailure(await reader.post(`/api/pads/${padId}/share`, {}), 403);
		expect((await owner.get(`/api/pads/${padId}`)).body.steps).toHaveLength(7);
	});

	it('lets an invited member read but answers 404 to changes, as for any pad not theirs', async () => {
		const invited = await freshMember('pad-invited');
		await inviteAndAccept(owner, padId, invited);
		expect((await invited.get(`/api/pads/${padId}`)).status).toBe(200);
		expectFailure(await invited.patch(`/api/pads/${padId}`, { title: 'taken' }), 404);
		expectFailure(await invited.del(`/api/pads/${padId}`), 404);
		expectFailure(await invited.post('/api/eval', { input: 'thermo', pad: padId }), 404);
		// their own list is theirs only; the invitation shows on /shared
		expect((await invited.get('/api/pads')).body.pads).toEqual([]);
	});
});

describe('export', () => {
	let steps: { n: number; input: string; status: string; results: any[] | null; error: any }[];
	beforeAll(async () => {
		steps = (await owner.get(`/api/pads/${padId}`)).body.steps;
	});

	it('writes Markdown with every step input and its values', async () => {
		const r = await owner.get(`/api/pads/${padId}/export?format=md`);
		expect(r.status).toBe(200);
		expect(r.headers.get('content-type')).toMatch(/^text\/markdown/);
		expect(r.headers.get('content-disposition')).toBe('attachment; filename="strip-checks.md"');
		const md = r.body as string;
		expect(md.startsWith('# Strip checks\n')).toBe(true);
		for (const s of steps) {
			expect(md).toContain(`## Step ${s.n}`);
			expect(md).toContain('```bulkpad\n' + s.input + '\n```');
		}
		const darea = steps[1].results![0].value as number;
		expect(md).toContain(String(Number(darea.toPrecision(10))));
		// the sweep is a Markdown table with the engine's columns and one line per row
		const table = steps[2].results![0];
		expect(md).toContain(`| ${table.columns.join(' | ')} |`);
		for (const row of table.rows) expect(md).toContain(`| ${row.map((v: number) => String(Number(v.toPrecision(10)))).join(' | ')} |`);
		expect(md).toContain(`- error: ${steps[6].error.message.replace(/([\\`*_[\]<>|])/g, '\\$1')}`);
	});

	it('writes a LaTeX article: steps verbatim, tables as tabular, formulas in display math', async () => {
		const r = await owner.get(`/api/pads/${padId}/export?format=tex`);
		expect(r.status).toBe(200);
		expect(r.headers.get('content-disposition')).toBe('attachment; filename="strip-checks.tex"');
		const tex = r.body as string;
		expect(tex).toMatch(/^% Exported from Bulkpad[^\n]*\n\\documentclass\[11pt\]\{article\}/);
		expect(tex).toContain('\\begin{document}');
		expect(tex.trimEnd().endsWith('\\end{document}')).toBe(true);
		// failed steps are left out of the paper's export, the others keep their numbers
		for (const s of steps.filter((x) => x.status === 'ok'))
			expect(tex).toContain(`\\subsection*{Step \\#${s.n}}\n\\begin{verbatim}\n${s.input}\n\\end{verbatim}`);
		expect(tex).not.toContain(`Step \\#${steps[6].n}}`);
		expect(tex).toContain('1 failed or hidden step left out');
		expect(tex).toContain('\\begin{longtable}{rrr}');
		// a series is its coefficient list (one a_k per row, symbols defined) in align*, as the console's list shows it
		const list = (steps[3].results![0] as { list: string }).list.split(' \\\\\n');
		expect(tex).toContain(`\\begin{align*}\n${list[0].replace('\\begin{aligned}\n', '')} \\\\\n${list[1]} \\\\\n`);
		expect(tex.match(/\\begin\{verbatim\}/g)).toHaveLength(steps.filter((x) => x.status === 'ok').length);
	});

	const hasPdflatex = spawnSync('pdflatex', ['--version']).status === 0;
	it.runIf(hasPdflatex)('the LaTeX export compiles with pdflatex', { timeout: 120_000 }, async () => {
		const tex = (await owner.get(`/api/pads/${padId}/export?format=tex`)).body as string;
		const dir = mkdtempSync(join(tmpdir(), 'bulkpad-tex-'));
		writeFileSync(join(dir, 'pad.tex'), tex);
		// asynchronously: a blocked event loop would leave the client's keep-alive socket stale
		const run = await promisify(execFile)('pdflatex', ['-interaction=nonstopmode', '-halt-on-error', '-no-shell-escape', 'pad.tex'], {
			cwd: dir
		}).catch((e: { stdout?: string }) => ({ stdout: e.stdout ?? '', failed: true }));
		expect('failed' in run, run.stdout.slice(-2000)).toBe(false);
		expect(run.stdout).toMatch(/Output written on pad\.pdf/);
	});

	it.runIf(hasPdflatex)('the LaTeX export of the longest series the language writes compiles too', { timeout: 180_000 }, async () => {
		const id = await padWithSteps(owner, 'Long series', ['use boosted d=4 v=0.5', 'coeffs darea o=12']);
		const tex = (await owner.get(`/api/pads/${id}/export?format=tex`)).body as string;
		expect(tex).toContain('a_{12}');
		const dir = mkdtempSync(join(tmpdir(), 'bulkpad-tex-'));
		writeFileSync(join(dir, 'pad.tex'), tex);
		const run = await promisify(execFile)('pdflatex', ['-interaction=nonstopmode', '-halt-on-error', '-no-shell-escape', 'pad.tex'], {
			cwd: dir,
			maxBuffer: 16 * 1024 * 1024
		}).catch((e: { stdout?: string }) => ({ stdout: e.stdout ?? '', failed: true }));
		expect('failed' in run, run.stdout.slice(-2000)).toBe(false);
		expect(run.stdout).toMatch(/Output written on pad\.pdf/);
	});

	it('writes versioned JSON with every step as stored', async () => {
		const r = await owner.get(`/api/pads/${padId}/export?format=json`);
		expect(r.status).toBe(200);
		expect(r.headers.get('content-disposition')).toBe('attachment; filename="strip-checks.json"');
		const doc = r.body;
		expect(doc).toMatchObject({
			format: 'bulkpad-pad',
			version: 1,
			title: 'Strip checks',
			bulk: { name: 'brane', params: { d: 3, zh: 1 } },
			units: { system: 'geo', G: 1 }
		});
		expect(doc.steps.map((s: object) => pick(s))).toEqual(steps.map((s) => pick(s)));
	});

	it('refuses an unknown format', async () => {
		expect(expectFailure(await owner.get(`/api/pads/${padId}/export?format=docx`), 400)).toMatch(/md, tex or json/);
	});
});

function pick(s: any) {
	return { n: s.n, input: s.input, status: s.status, results: s.results, error: s.error };
}

describe('import', () => {
	let doc: any;
	beforeAll(async () => {
		doc = (await owner.get(`/api/pads/${padId}/export?format=json`)).body;
	});

	it('round-trips: export JSON → import → the same steps and state', async () => {
		const imported = await other.post('/api/pads/import', doc);
		expect(imported.status, JSON.stringify(imported.body)).toBe(201);
		expect(imported.body.steps).toBe(7);
		const id = imported.body.pad.id;
		expect(id).not.toBe(padId);
		const back = await other.get(`/api/pads/${id}`);
		expect(back.body.pad).toMatchObject({ title: 'Strip checks', bulk: doc.bulk, units: doc.units, owner: { name: 'pad-other' } });
		expect(back.body.steps.map(pick)).toEqual(doc.steps.map(pick));
		// the references came along: `#2` in the imported pad is the recorded step 2
		const next = await other.post('/api/eval', { input: '#2 * 3', pad: id });
		expect(next.status).toBe(200);
		expect(next.body.step.n).toBe(8);
		expect(next.body.results[0].value).toBeCloseTo(3 * doc.steps[1].results[0].value, 14);
		// and exporting the import gives the same document
		const again = (await other.get(`/api/pads/${id}/export?format=json`)).body;
		expect(again.steps.slice(0, 7).map(pick)).toEqual(doc.steps.map(pick));
	});

	it('takes a multipart upload as well', async () => {
		const form = new FormData();
		form.set('file', new Blob([JSON.stringify({ ...doc, title: 'From a file' })], { type: 'application/json' }), 'pad.json');
		const r = await other.request('POST', '/api/pads/import', form);
		expect(r.status, JSON.stringify(r.body)).toBe(201);
		expect((await other.get(`/api/pads/${r.body.pad.id}`)).body.steps.map(pick)).toEqual(doc.steps.map(pick));
	});

	it('says what is wrong with a bad file', async () => {
		const cases: [unknown, RegExp][] = [
			[{ ...doc, format: 'something-else' }, /format must be "bulkpad-pad"/],
			[{ ...doc, version: 2 }, /version must be 1/],
			[{ ...doc, steps: [{ ...doc.steps[1], n: 5 }] }, /steps\.0\.n: steps must be numbered 1, 2, 3/],
			[{ ...doc, steps: [{ ...doc.steps[1], results: [{ kind: 'plot', label: 'x' }] }] }, /steps\.0\.results\.0/],
			[{ ...doc, steps: [{ ...doc.steps[1], input: 'x'.repeat(2001) }] }, /steps\.0\.input/],
			[{ ...doc, bulk: { name: 'brane', params: 'd=4' } }, /bulk\.params/],
			[{ ...doc, title: undefined }, /title/]
		];
		for (const [body, message] of cases) expect(expectFailure(await other.post('/api/pads/import', body), 400)).toMatch(message);
		const notJson = await other.request('POST', '/api/pads/import', undefined, { 'content-type': 'application/json' });
		expect(expectFailure(notJson, 400)).toMatch(/not JSON/);
	});

	it('takes a file just under 1 MB and refuses one over it', async () => {
		const step = (n: number) => ({
			n,
			input: `darea l=0.3 o=2 // ${'x'.repeat(900)}`,
			status: 'error',
			results: null,
			error: { message: 'kept' }
		});
		const near = { ...doc, title: 'Big', steps: Array.from({ length: 1000 }, (_, i) => step(i + 1)) };
		const nearBytes = Buffer.byteLength(JSON.stringify(near));
		expect(nearBytes).toBeGreaterThan(900_000);
		expect(nearBytes).toBeLessThan(1_000_000);
		const ok = await other.post('/api/pads/import', near);
		expect(ok.status, JSON.stringify(ok.body).slice(0, 300)).toBe(201);
		expect(ok.body.steps).toBe(1000);

		const over = {
			...near,
			title: 'x'.repeat(150),
			lets: { pad: { fields: Object.fromEntries(Array.from({ length: 3000 }, (_, i) => [`k${i}`, i])) } }
		};
		expect(Buffer.byteLength(JSON.stringify(over))).toBeGreaterThan(1_000_000);
		expect(expectFailure(await other.post('/api/pads/import', over), 413)).toMatch(/1 MB/);
	});

	it('is for members: readers get 403, strangers 401', async () => {
		expectFailure(await reader.post('/api/pads/import', doc), 403);
		expectFailure(await new Client().post('/api/pads/import', doc), 401);
	});
});
