// Durability of acknowledged work, against the built server on a database file of the test's own (a copy of
// the seeded test database made with the online backup): SIGKILL in the middle of a stream of writes, restart
// on the same file, every acknowledged step is there; online backup while writing, restore refused while the
// server holds the file, restore after it stops.
//
// A SIGKILL loses the process, not the operating system's cache, so this proves that an acknowledgement is
// given only after the commit (and that WAL recovery after a crash is sound); what `synchronous = FULL` adds
// — surviving a power cut — cannot be shown without cutting power, and is checked as a setting below.
import Database from 'better-sqlite3';
import { execFile, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, signedIn } from '../helpers/client';
import { backupDatabase } from '../../src/lib/server/db/backup';
import { startOwnServer, type OwnServer } from './support/own-server';

interface Ack {
	pad: string;
	id: string;
	n: number;
	input: string;
	value: number;
}

let dir: string;
let cookie: string;
const servers: OwnServer[] = [];

beforeAll(async () => {
	dir = mkdtempSync(join(tmpdir(), 'bulkpad-durability-'));
	// a session on the shared server travels with the copy of its database
	cookie = (await signedIn('tomas@sable.test')).cookie;
});
afterAll(async () => {
	for (const s of servers) await s.stop('SIGKILL');
	rmSync(dir, { recursive: true, force: true });
});

async function serverOn(file: string): Promise<{ server: OwnServer; client: Client }> {
	const server = await startOwnServer(file);
	servers.push(server);
	const client = new Client(server.baseUrl);
	client.cookie = cookie;
	return { server, client };
}

/** `k + 0.25` as step input: cheap, and its stored result says which write it was. */
const line = (k: number) => `${k} + 0.25`;

/**
 * Writes steps to the pads from `pads.length` concurrent clients until `until()` says stop or the server
 * stops answering; returns the acknowledged ones. `onAck` runs after each acknowledgement.
 */
async function writeSteps(
	client: Client,
	pads: string[],
	next: () => number,
	until: (acks: Ack[]) => boolean,
	onAck: (acks: Ack[]) => void = () => {}
) {
	const acks: Ack[] = [];
	await Promise.all(
		pads.map(async (pad) => {
			while (!until(acks)) {
				const k = next();
				let r;
				try {
					r = await client.post('/api/eval', { input: line(k), pad });
				} catch {
					return; // the server went away: this write was never acknowledged
				}
				if (r.status !== 200) throw new Error(`write ${k} answered ${r.status}: ${JSON.stringify(r.body)}`);
				acks.push({ pad, id: r.body.step.id, n: r.body.step.n, input: line(k), value: r.body.results[0].value });
				onAck(acks);
			}
		})
	);
	return acks;
}

/** Opens the file (recovering its WAL, as a restart would), runs integrity_check and reads the steps. */
function inspect(file: string) {
	const db = new Database(file);
	try {
		const integrity = db.pragma('integrity_check', { simple: true });
		const steps = db.prepare('SELECT id, pad_id AS pad, n, input, status, results FROM steps').all() as {
			id: string;
			pad: string;
			n: number;
			input: string;
			status: string;
			results: string | null;
		}[];
		return { integrity, steps: new Map(steps.map((s) => [s.id, s])) };
	} finally {
		db.close();
	}
}

function expectAllPresent(acks: Ack[], steps: ReturnType<typeof inspect>['steps']) {
	const missing = acks.filter((a) => !steps.has(a.id));
	expect(missing, `acknowledged but missing: ${JSON.stringify(missing.slice(0, 5))}`).toEqual([]);
	for (const a of acks) {
		const s = steps.get(a.id)!;
		expect({ pad: s.pad, n: s.n, input: s.input, status: s.status }).toEqual({ pad: a.pad, n: a.n, input: a.input, status: 'ok' });
		expect(JSON.parse(s.results!)[0].value).toBe(a.value);
	}
}

describe('SIGKILL during a stream of 200 acknowledged writes', () => {
	it('keeps every acknowledged step, and the file passes integrity_check', { timeout: 600_000 }, async () => {
		const file = join(dir, 'crash.db');
		await backupDatabase(inject('dbFile'), file);
		let k = 0;
		const first = await serverOn(file);
		const pads: string[] = [];
		for (let i = 0; i < 4; i++) {
			const r = await first.client.post('/api/pads', { title: `durability ${i}` });
			expect(r.status, JSON.stringify(r.body)).toBe(201);
			pads.push(r.body.pad.id);
		}
		// kill with writes in flight: the 100th acknowledgement pulls the plug while three more are running
		const before = await writeSteps(
			first.client,
			pads,
			() => k++,
			() => false,
			(acks) => {
				if (acks.length === 100) first.server.child.kill('SIGKILL');
			}
		);
		await first.server.stop('SIGKILL');
		expect(first.server.child.signalCode).toBe('SIGKILL');
		expect(before.length).toBeGreaterThanOrEqual(100);
		const afterCrash = inspect(file);
		expect(afterCrash.integrity).toBe('ok');
		expectAllPresent(before, afterCrash.steps);

		// restart on the same file and finish the stream: 200 acknowledged in all
		const second = await serverOn(file);
		const after = await writeSteps(
			second.client,
			pads,
			() => k++,
			(acks) => before.length + acks.length >= 200
		);
		const all = [...before, ...after];
		expect(all.length).toBeGreaterThanOrEqual(200);
		// the restarted server sees them all too, numbered without gaps or repeats per pad
		for (const pad of pads) {
			const r = await second.client.get(`/api/pads/${pad}`);
			expect(r.status).toBe(200);
			const ns = r.body.steps.map((s: { n: number }) => s.n);
			expect(ns).toEqual(ns.map((_: number, i: number) => i + 1));
			const ids = new Set(r.body.steps.map((s: { id: string }) => s.id));
			expect(all.filter((a) => a.pad === pad && !ids.has(a.id))).toEqual([]);
		}
		await second.server.stop('SIGTERM');
		const final = inspect(file);
		expect(final.integrity).toBe('ok');
		expectAllPresent(all, final.steps);
	});

	it('opens the database with WAL and synchronous=FULL', async () => {
		const file = join(dir, 'pragma.db');
		await backupDatabase(inject('dbFile'), file);
		// a file already in WAL mode, as the server's is on every start after the first: opening one, this
		// SQLite build defaults to synchronous=NORMAL (SQLITE_DEFAULT_WAL_SYNCHRONOUS=1), so the setting must be ours
		const wal = new Database(file);
		wal.pragma('journal_mode = WAL');
		wal.close();
		// synchronous is per connection: read it from a connection made by the server's own openDb
		const r = spawnSync(
			process.execPath,
			[
				'--import',
				'tsx',
				'-e',
				"import('./src/lib/server/db/index.ts').then(({ openDb }) => { const { sqlite } = openDb(); console.log(JSON.stringify([sqlite.pragma('journal_mode', { simple: true }), sqlite.pragma('synchronous', { simple: true })])); })"
			],
			{ env: { ...process.env, DATABASE_URL: file }, encoding: 'utf8' }
		);
		expect(r.status, r.stderr).toBe(0);
		expect(JSON.parse(r.stdout.trim().split('\n').at(-1)!)).toEqual(['wal', 2]);
	});
});

describe('online backup and restore', () => {
	const run = (script: 'backup' | 'restore', arg: string, db: string) =>
		spawnSync(process.execPath, ['--import', 'tsx', `scripts/${script}.ts`, arg], {
			env: { ...process.env, DATABASE_URL: db },
			encoding: 'utf8'
		});

	it('backs up while the server writes, refuses to restore under it, restores once it stops', { timeout: 600_000 }, async () => {
		const file = join(dir, 'live.db');
		await backupDatabase(inject('dbFile'), file);
		const { server, client } = await serverOn(file);
		const pad = (await client.post('/api/pads', { title: 'backed up' })).body.pad.id as string;
		let k = 0;
		const early = await writeSteps(
			client,
			[pad],
			() => k++,
			(acks) => acks.length >= 20
		);

		// the backup runs in its own process while a client keeps writing
		let backingUp = true;
		const during = writeSteps(
			client,
			[pad],
			() => k++,
			() => !backingUp
		);
		const backup = join(dir, 'backup.db');
		const made = await new Promise<{ code: number | null; stdout: string; stderr: string }>((resolve) => {
			const env = { ...process.env, DATABASE_URL: file };
			const child = execFile(process.execPath, ['--import', 'tsx', 'scripts/backup.ts', backup], { env }, (_e, stdout, stderr) =>
				resolve({ code: child.exitCode, stdout, stderr })
			);
		});
		backingUp = false;
		const duringAcks = await during;
		expect(made.code, made.stderr).toBe(0);
		expect(made.stdout).toMatch(/integrity_check ok/);
		expect(duringAcks.length, 'writes acknowledged while the backup ran').toBeGreaterThan(0);
		const late = await writeSteps(
			client,
			[pad],
			() => k++,
			(acks) => acks.length >= 5
		);

		const inBackup = inspect(backup);
		expect(inBackup.integrity).toBe('ok');
		expectAllPresent(early, inBackup.steps);
		expect(late.filter((a) => inBackup.steps.has(a.id))).toEqual([]);
		// the steps written while it ran are a prefix: the copy is one consistent moment
		const ns = [...inBackup.steps.values()]
			.filter((s) => s.pad === pad)
			.map((s) => s.n)
			.sort((a, b) => a - b);
		expect(ns).toEqual(ns.map((_, i) => i + 1));
		expect(ns.length).toBeLessThanOrEqual(early.length + duringAcks.length);

		// the running server holds the file: restore says so and changes nothing
		const refused = run('restore', backup, file);
		expect(refused.status).toBe(1);
		expect(refused.stderr).toMatch(/open in another process \(a running Bulkpad\?\): stop the server, restore, then start it/);
		expect(readdirSync(dir).filter((f) => f.startsWith('live.db.before-restore'))).toEqual([]);

		await server.stop('SIGTERM');
		const restored = run('restore', backup, file);
		expect(restored.status, restored.stderr).toBe(0);
		const aside = /kept as (\S+)/.exec(restored.stdout)![1]!;
		expect(existsSync(aside)).toBe(true);
		// the replaced database kept everything, the late writes included
		expectAllPresent([...early, ...duringAcks, ...late], inspect(aside).steps);

		const again = await serverOn(file);
		const r = await again.client.get(`/api/pads/${pad}`);
		expect(r.status).toBe(200);
		expect(r.body.steps.map((s: { n: number }) => s.n)).toEqual(ns);
		expect(r.body.steps.slice(0, early.length).map((s: { id: string }) => s.id)).toEqual(early.map((a) => a.id));
		const next = await again.client.post('/api/eval', { input: '1 + 1', pad });
		expect(next.status).toBe(200);
		expect(next.body.step.n).toBe(ns.length + 1);
		await again.server.stop('SIGTERM');
		expect(inspect(file).integrity).toBe('ok');
	});
});
