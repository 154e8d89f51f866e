// static/bulkpad.py, run by Debian's python3 against the built server: tests/python/check_client.py asserts what
// a script sees (eval, sweep columns, streamed progress, pads, snapshot replay, errors with their span, a key's
// rate limit). Without python3 on the machine this file says so loudly and skips.
import { spawn, spawnSync } from 'node:child_process';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, freshMember } from '../helpers/client';

const python = spawnSync('python3', ['--version'], { encoding: 'utf8' });
const hasPython = python.status === 0;
if (!hasPython) console.warn('\n*** python3 is not installed: the Python client (static/bulkpad.py) is NOT tested ***\n');

let member: Client;

beforeAll(async () => {
	if (hasPython) member = await freshMember('pyclient');
});

async function makeKey(body: Record<string, unknown>): Promise<string> {
	const r = await member.post('/api/keys', body);
	expect(r.status, JSON.stringify(r.body)).toBe(201);
	return r.body.key as string;
}

function run(args: string[]): Promise<{ code: number | null; out: string }> {
	return new Promise((resolve) => {
		const child = spawn('python3', ['tests/python/check_client.py', ...args], { env: { ...process.env, PYTHONDONTWRITEBYTECODE: '1' } });
		let out = '';
		child.stdout.on('data', (d) => (out += d));
		child.stderr.on('data', (d) => (out += d));
		child.on('close', (code) => resolve({ code, out }));
	});
}

describe.skipIf(!hasPython)(`the Python client (${python.stdout?.trim() || 'no python3'})`, () => {
	it('passes every check of tests/python/check_client.py against this server', async () => {
		const key = await makeKey({ label: 'python check' });
		const tight = await makeKey({ label: 'python check, tight', perMinute: 2 });
		const { code, out } = await run([inject('baseUrl'), key, tight]);
		expect(code, out).toBe(0);
		expect(out).toContain('all checks passed');
		expect(out).toContain('ok - progress arrives through the stream');
		expect(out).toContain('ok - a key over its budget raises 429 with retry_after');
	});

	it('is served for download where the Keys page links it', async () => {
		const r = await new Client().get('/bulkpad.py');
		expect(r.status).toBe(200);
		expect(String(r.body)).toContain('class Bulkpad');
		expect(String(r.body)).toContain('class BulkpadError');
	});
});
