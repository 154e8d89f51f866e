// Datasets: CSV uploads with their checks and limits, ownership, and `compare <dataset>` in the console.
import { beforeAll, describe, expect, it } from 'vitest';
import { Client, freshMember } from '../helpers/client';
import { expectFailure, freshWithRole, signInPatiently } from '../helpers/roles';

let member: Client;
let stranger: Client;
let reader: Client;
let limits: { bytes: number; rows: number; columns: number };

function form(content: BlobPart, fileName: string, type = 'text/csv', name?: string): FormData {
	const f = new FormData();
	f.append('file', new File([content], fileName, { type }));
	if (name !== undefined) f.append('name', name);
	return f;
}
const upload = (c: Client, content: BlobPart, fileName: string, type?: string, name?: string) =>
	c.post('/api/datasets', form(content, fileName, type, name));
const tag = () => Math.random().toString(36).slice(2, 7);

/** a small table of (l, y) with values that are not round, so a parser that lost digits would show it */
function table(n: number): { csv: string; rows: number[][] } {
	const rows = Array.from({ length: n }, (_, i) => [0.05 + 0.05 * i, Math.sin(1 + i) / 7]);
	return { csv: 'l,darea\n' + rows.map((r) => r.join(',')).join('\n') + '\n', rows };
}

beforeAll(async () => {
	const admin = await signInPatiently('curator@sable.test');
	member = await freshMember('uploader');
	stranger = await freshMember('stranger');
	reader = await freshWithRole(admin, 'reader-ds', 'reader');
	const r = await member.get('/api/datasets');
	limits = r.body.limits;
});

describe('who may do what', () => {
	it('answers 401 without an account', async () => {
		expectFailure(await new Client().get('/api/datasets'), 401);
		expectFailure(await upload(new Client(), table(3).csv, 'x.csv'), 401);
		expectFailure(await new Client().get('/api/datasets/whatever'), 401);
		expectFailure(await new Client().del('/api/datasets/whatever'), 401);
	});

	it('lets a reader list (nothing) but not upload', async () => {
		const r = await reader.get('/api/datasets');
		expect(r.status).toBe(200);
		expect(r.body.datasets).toEqual([]);
		expectFailure(await upload(reader, table(3).csv, 'mine.csv'), 403);
	});

	it('keeps each dataset to its owner', async () => {
		const up = await upload(member, table(4).csv, `private_${tag()}.csv`);
		expect(up.status).toBe(201);
		const id = up.body.dataset.id;
		expectFailure(await stranger.get(`/api/datasets/${id}`), 404);
		expectFailure(await stranger.del(`/api/datasets/${id}`), 404);
		expect((await stranger.get('/api/datasets')).body.datasets.map((d: { id: string }) => d.id)).not.toContain(id);
		expect((await member.get(`/api/datasets/${id}`)).status).toBe(200);
		expectFailure(await reader.del(`/api/datasets/${id}`), 403);
	});
});

describe('upload, read back, delete', () => {
	it('stores the numbers exactly and answers the documented shape', async () => {
		const { csv, rows } = table(9);
		const name = `mine_${tag()}`;
		const r = await upload(member, csv, 'numbers.csv', 'text/csv', name);
		expect(r.status, JSON.stringify(r.body)).toBe(201);
		expect(r.body).toMatchObject({
			ok: true,
			dataset: { name, columns: ['l', 'darea'], rows: rows.length, bytes: new TextEncoder().encode(csv).length }
		});
		const id = r.body.dataset.id;
		expect((await member.get('/api/datasets')).body.datasets.find((d: { id: string }) => d.id === id)).toMatchObject({
			name,
			rows: rows.length
		});
		const one = await member.get(`/api/datasets/${id}`);
		expect(one.body.dataset.columns).toEqual(['l', 'darea']);
		expect(one.body.dataset.rows).toEqual(rows);
		expect((await member.del(`/api/datasets/${id}`)).status).toBe(200);
		expectFailure(await member.get(`/api/datasets/${id}`), 404);
		expectFailure(await member.del(`/api/datasets/${id}`), 404);
	});

	it('names a dataset after its file when no name is given', async () => {
		const stem = `Lattice d=4 ${tag()}`;
		const r = await upload(member, table(3).csv, `${stem}.CSV`);
		expect(r.status, JSON.stringify(r.body)).toBe(201);
		expect(r.body.dataset.name).toMatch(/^[a-z][a-z0-9_]*$/);
		expect(r.body.dataset.name.startsWith('lattice_d_4_')).toBe(true);
	});

	it('refuses a name the console could not use, and a name the owner has already', async () => {
		expectFailure(await upload(member, table(3).csv, 'a.csv', 'text/csv', 'Has Spaces'), 400);
		expectFailure(await upload(member, table(3).csv, 'a.csv', 'text/csv', '4d'), 400);
		const name = `twice_${tag()}`;
		expect((await upload(member, table(3).csv, 'a.csv', 'text/csv', name)).status).toBe(201);
		expectFailure(await upload(member, table(3).csv, 'a.csv', 'text/csv', name), 409);
		// another member may use the same name for their own
		expect((await upload(stranger, table(3).csv, 'a.csv', 'text/csv', name)).status).toBe(201);
	});
});

describe('type and content checks', () => {
	it('refuses files that are not CSV by name, type or content', async () => {
		expectFailure(await upload(member, table(3).csv, 'numbers.txt', 'text/plain'), 400);
		expectFailure(await upload(member, table(3).csv, 'numbers.csv', 'image/png'), 400);
		const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);
		expectFailure(await upload(member, png, 'disguised.csv'), 400);
		expectFailure(await member.post('/api/datasets', { file: 'l,darea\n1,2' }), 400);
		const noFile = new FormData();
		noFile.append('name', 'nothing');
		expectFailure(await member.post('/api/datasets', noFile), 400);
	});

	it('names the row and column of a cell that is not a number', async () => {
		const r = await upload(member, 'l,darea\n0.1,0.25\n0.2,0.31\n0.3,n/a\n', 'bad.csv');
		const message = expectFailure(r, 400);
		expect(r.body.error).toMatchObject({ row: 3, column: 'darea' });
		expect(message).toMatch(/row 3/);
		expect(message).toMatch(/darea/);
	});

	it('refuses ragged rows, a missing header and an empty file', async () => {
		expect(expectFailure(await upload(member, 'l,darea\n0.1,0.2\n0.2\n', 'ragged.csv'), 400)).toMatch(/row 2/);
		expectFailure(await upload(member, '0.1,0.2\n0.2,0.3\n', 'nohead.csv'), 400);
		expectFailure(await upload(member, '', 'empty.csv'), 400);
		expectFailure(await upload(member, 'l,darea\n', 'header-only.csv'), 400);
	});
});

describe('limits', () => {
	it('publishes its limits', () => {
		expect(limits.bytes).toBeGreaterThan(0);
		expect(limits.rows).toBe(20_000);
		expect(limits.columns).toBe(20);
	});

	it('answers 413 for a file over the size limit', async () => {
		const line = '0.123456789,0.987654321\n';
		const big = 'l,darea\n' + line.repeat(Math.ceil((limits.bytes + 1) / line.length));
		const r = await upload(member, big, 'big.csv');
		expect(expectFailure(r, 413)).toMatch(/limit/);
	});

	it('accepts a file just under the size limit', async () => {
		// 20 columns of long numbers keep it under the row limit while near the byte limit
		const header = Array.from({ length: 20 }, (_, i) => `c${i}`).join(',') + '\n';
		const row = Array.from({ length: 20 }, (_, i) => (1 / (i + 3)).toFixed(12)).join(',') + '\n';
		const n = Math.min(limits.rows, Math.floor((limits.bytes * 0.95 - header.length) / row.length));
		const r = await upload(member, header + row.repeat(n), `near_${tag()}.csv`);
		expect(r.status, JSON.stringify(r.body).slice(0, 300)).toBe(201);
		expect(r.body.dataset.rows).toBe(n);
		await member.del(`/api/datasets/${r.body.dataset.id}`);
	});

	it('refuses more columns or rows than allowed', async () => {
		const wide =
			Array.from({ length: limits.columns + 1 }, (_, i) => `c${i}`).join(',') +
			'\n' +
			Array(limits.columns + 1)
				.fill('1')
				.join(',') +
			'\n';
		expect(expectFailure(await upload(member, wide, 'wide.csv'), 400)).toMatch(/columns/);
		const long = 'l\n' + '1\n'.repeat(limits.rows + 1);
		expect(expectFailure(await upload(member, long, 'long.csv'), 400)).toMatch(/rows/);
	});
});

describe('compare in the console', () => {
	const tableOf = (results: any[]) => results.find((x) => x.kind === 'table');

	it('compares the seeded lattice_d4 for its owner, and for nobody else', async () => {
		const tomas = await signInPatiently('tomas@sable.test');
		const listed = (await tomas.get('/api/datasets')).body.datasets.find((d: { name: string }) => d.name === 'lattice_d4');
		expect(listed).toBeDefined();
		const stored = (await tomas.get(`/api/datasets/${listed.id}`)).body.dataset;
		const r = await tomas.post('/api/eval', { input: 'compare lattice_d4 darea d=4 zh=1' });
		expect(r.status, JSON.stringify(r.body)).toBe(200);
		const t = tableOf(r.body.results);
		expect(t, JSON.stringify(r.body.results)).toBeDefined();
		expect(t.rows).toHaveLength(stored.rows.length);
		// the console sees the very numbers the API stored: x and the dataset's column, row by row
		const y = stored.columns.indexOf('darea');
		expect(t.rows.map((row: number[]) => row[0])).toEqual(stored.rows.map((row: number[]) => row[0]));
		expect(t.rows.map((row: number[]) => row[t.columns.indexOf('dataset')])).toEqual(stored.rows.map((row: number[]) => row[y]));
		const other = await member.post('/api/eval', { input: 'compare lattice_d4 darea d=4 zh=1' });
		expect(expectFailure(other, 400)).toMatch(/lattice_d4/);
	});

	it('compares an uploaded dataset point by point against the engine', async () => {
		// the uploaded numbers are the engine's own ΔA, so engine and dataset agree at every point
		const ls = [0.2, 0.4, 0.6];
		const values: number[] = [];
		for (const l of ls) {
			const e = await member.post('/api/eval', { input: `darea l=${l} d=4 zh=1` });
			expect(e.status, JSON.stringify(e.body)).toBe(200);
			values.push(e.body.results.find((x: any) => x.kind === 'scalar').value);
		}
		const name = `own_${tag()}`;
		const csv = 'l,darea\n' + ls.map((l, i) => `${l},${values[i]}`).join('\n');
		expect((await upload(member, csv, 'own.csv', 'text/csv', name)).status).toBe(201);
		const r = await member.post('/api/eval', { input: `compare ${name} darea d=4 zh=1` });
		expect(r.status, JSON.stringify(r.body)).toBe(200);
		const t = tableOf(r.body.results);
		expect(t.rows.map((row: unknown[]) => row[0])).toEqual(ls);
		const engine = t.columns.indexOf('engine');
		const data = t.columns.indexOf('dataset');
		expect(engine, JSON.stringify(t.columns)).toBeGreaterThan(0);
		t.rows.forEach((row: number[], i: number) => {
			expect(row[data]).toBe(values[i]);
			expect(Math.abs(row[engine] - values[i]), `l=${ls[i]}: engine ${row[engine]}, dataset ${values[i]}`).toBeLessThan(
				1e-9 * Math.abs(values[i]) + 1e-12
			);
		});
	});
});

describe('the datasets page', () => {
	it('lists the owner’s datasets with the line to use them, and offers uploading only to writers', async () => {
		const name = `page_${tag()}`;
		expect((await upload(member, table(5).csv, 'p.csv', 'text/csv', name)).status).toBe(201);
		const page = await member.get('/datasets');
		expect(page.status).toBe(200);
		expect(page.body).toContain(`compare ${name} darea`);
		expect(page.body).toContain('Upload');
		expect((await stranger.get('/datasets')).body).not.toContain(name);
		const asReader = await reader.get('/datasets');
		expect(asReader.status).toBe(200);
		expect(asReader.body).not.toContain('aria-label="upload a dataset"');
	});
});
