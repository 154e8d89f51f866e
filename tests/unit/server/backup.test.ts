// Backup and restore of the SQLite file (src/lib/server/db/backup.ts) on real files, with another process
// writing to or holding the database where that matters.
import Database from 'better-sqlite3';
import { drizzle } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { spawn, type ChildProcess } from 'node:child_process';
import { closeSync, existsSync, mkdirSync, mkdtempSync, openSync, readdirSync, rmSync, statSync, writeFileSync, writeSync } from 'node:fs';
import { createRequire } from 'node:module';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { backupDatabase, checkDatabaseFile, isDatabaseInUse, restoreDatabase } from '../../../src/lib/server/db/backup';

let dir: string;
const children: ChildProcess[] = [];

/** A migrated Bulkpad database with `n` users, in WAL mode as the server keeps it. */
function bulkpadDb(file: string, n: number, tag = 'u') {
	const db = new Database(file);
	db.pragma('journal_mode = WAL');
	migrate(drizzle(db), { migrationsFolder: 'drizzle' });
	const insert = db.prepare("INSERT INTO users (id, email, name, password_hash, role, created_at) VALUES (?, ?, ?, 'x', 'member', 0)");
	db.transaction(() => {
		for (let i = 0; i < n; i++) insert.run(`${tag}${i}`, `${tag}${i}@t.test`, `${tag} ${i}`);
	})();
	db.close();
}
const users = (file: string) => {
	const db = new Database(file, { readonly: true });
	try {
		return (db.prepare('SELECT id FROM users ORDER BY id').all() as { id: string }[]).map((r) => r.id);
	} finally {
		db.close();
	}
};

/** Another process that opens `file` and keeps it open; with `write`, it inserts a user every few ms. */
function holder(file: string, write = false): Promise<ChildProcess> {
	const code = `
		const Database = require(${JSON.stringify(createRequire(import.meta.url).resolve('better-sqlite3'))});
		const db = new Database(${JSON.stringify(file)});
		db.pragma('journal_mode = WAL'); db.pragma('busy_timeout = 5000');
		let i = 0;
		const ins = db.prepare("INSERT INTO users (id, email, name, password_hash, role, created_at) VALUES (?, ?, 'w', 'x', 'member', 0)");
		if (${write}) setInterval(() => { ins.run('w' + i, 'w' + i + '@t.test'); i++; }, 2);
		else setInterval(() => {}, 1000);
		process.stdout.write('ready\\n');`;
	const child = spawn(process.execPath, ['-e', code], { stdio: ['ignore', 'pipe', 'inherit'] });
	children.push(child);
	return new Promise((resolve, reject) => {
		child.stdout!.once('data', () => resolve(child));
		child.once('exit', (c) => reject(new Error(`holder exited with ${c}`)));
	});
}
async function stop(child: ChildProcess) {
	if (child.exitCode !== null || child.signalCode !== null) return;
	const gone = new Promise((r) => child.once('exit', r));
	child.kill('SIGKILL');
	await gone;
}

beforeEach(() => {
	dir = mkdtempSync(join(tmpdir(), 'bulkpad-backup-'));
});
afterEach(async () => {
	for (const c of children.splice(0)) await stop(c);
	rmSync(dir, { recursive: true, force: true });
});

describe('backup', () => {
	it('copies a database another process keeps writing to, checked and self-contained', async () => {
		const live = join(dir, 'live.db');
		bulkpadDb(live, 2000);
		const writer = await holder(live, true);
		await new Promise((r) => setTimeout(r, 100)); // let some writes land in the WAL
		const { file, pages } = await backupDatabase(live, join(dir, 'copy.db'));
		await stop(writer);
		expect(file).toBe(join(dir, 'copy.db'));
		expect(pages).toBeGreaterThan(10);
		expect(checkDatabaseFile(file)).toBeNull();
		// one file: a rollback journal, no WAL beside it
		const copy = new Database(file, { readonly: true });
		expect(copy.pragma('journal_mode', { simple: true })).toBe('delete');
		copy.close();
		expect(existsSync(`${file}-wal`)).toBe(false);
		// everything committed before the copy started is in it, plus a prefix of the writer's rows
		const ids = users(file);
		expect(ids.filter((id) => id.startsWith('u'))).toHaveLength(2000);
		const written = ids
			.filter((id) => id.startsWith('w'))
			.map((id) => Number(id.slice(1)))
			.sort((a, b) => a - b);
		expect(written).toEqual(written.map((_, i) => i));
	});

	it('names the copy by time inside a folder, and never overwrites a file', async () => {
		const live = join(dir, 'live.db');
		bulkpadDb(live, 3);
		const { file } = await backupDatabase(live, dir);
		expect(file).toMatch(/bulkpad-\d{8}-\d{6}\.db$/);
		await expect(backupDatabase(live, file)).rejects.toThrow(/exists already/);
		await expect(backupDatabase(join(dir, 'none.db'), join(dir, 'x.db'))).rejects.toThrow(/no database at/);
		expect(readdirSync(dir).filter((f) => f.includes('partial'))).toEqual([]);
	});
});

describe('restore', () => {
	let live: string;
	let backup: string;
	beforeEach(async () => {
		live = join(dir, 'data', 'bulkpad.db');
		backup = join(dir, 'backup.db');
		bulkpadDb(join(dir, 'old.db'), 5, 'b');
		await backupDatabase(join(dir, 'old.db'), backup);
		mkdirSync(join(dir, 'data'));
		bulkpadDb(live, 7, 'n');
	});

	it('puts the backup in place and keeps the replaced database aside', () => {
		const { keptAside } = restoreDatabase(backup, live, new Date('2026-12-02T14:05:01Z'));
		expect(keptAside).toBe(`${live}.before-restore-20261202-140501`);
		expect(users(live)).toEqual(['b0', 'b1', 'b2', 'b3', 'b4']);
		expect(users(keptAside!)).toEqual(['n0', 'n1', 'n2', 'n3', 'n4', 'n5', 'n6']);
		expect(readdirSync(join(dir, 'data')).filter((f) => f.includes('restoring'))).toEqual([]);
	});

	it('restores into an empty place too', () => {
		const fresh = join(dir, 'new', 'bulkpad.db');
		expect(restoreDatabase(backup, fresh)).toEqual({ keptAside: null });
		expect(users(fresh)).toHaveLength(5);
	});

	it('refuses while another process has the database open, and changes nothing', async () => {
		const server = await holder(live);
		expect(isDatabaseInUse(live)).toBe(true);
		expect(() => restoreDatabase(backup, live)).toThrow(
			/open in another process \(a running Bulkpad\?\): stop the server, restore, then start it/
		);
		await stop(server);
		expect(users(live)).toHaveLength(7);
		expect(readdirSync(join(dir, 'data')).filter((f) => f.includes('before-restore'))).toEqual([]);
		expect(isDatabaseInUse(live)).toBe(false);
	});

	it('refuses a file that is not a sound Bulkpad database', () => {
		const text = join(dir, 'notes.txt');
		writeFileSync(text, 'not a database at all, just some text that is long enough to have a header'.repeat(20));
		const other = join(dir, 'other.db');
		const o = new Database(other);
		o.exec('CREATE TABLE t (x)');
		o.close();
		const corrupt = join(dir, 'corrupt.db');
		bulkpadDb(corrupt, 3000);
		const c = new Database(corrupt);
		c.pragma('journal_mode = DELETE');
		c.close();
		// scribble over pages in the middle of the file (the users table's b-tree)
		const size = statSync(corrupt).size;
		const fd = openSync(corrupt, 'r+');
		writeSync(fd, Buffer.alloc(8192, 0x5a), 0, 8192, Math.floor(size / 2 / 4096) * 4096);
		closeSync(fd);
		for (const [file, why] of [
			[join(dir, 'missing.db'), /does not exist/],
			[text, /cannot be read as SQLite|integrity_check failed/],
			[other, /not a Bulkpad database \(no table __drizzle_migrations, users, pads, steps\)/],
			[corrupt, /integrity_check failed|cannot be read as SQLite/]
		] as const) {
			expect(() => restoreDatabase(file, live), file).toThrow(why);
		}
		expect(users(live)).toHaveLength(7);
	});
});
