/**
 * Online backup and offline restore of Bulkpad's SQLite file (what `npm run backup` and `npm run restore` run).
 *
 * Backup uses SQLite's backup API through better-sqlite3, so it works while the server runs: in WAL mode the
 * copy reads one consistent snapshot while the server keeps writing. The pages go over in one step, because
 * SQLite restarts a stepwise backup whenever another process writes between steps — on a busy server that
 * could restart forever. The copy is checked with `integrity_check` and switched to a rollback journal, so a
 * backup is one self-contained file.
 *
 * Restore replaces the database file only while nothing holds it open (it takes SQLite's exclusive lock to
 * find out), after checking the backup the same way; the file it replaces is kept aside, never deleted.
 */
import Database from 'better-sqlite3';
import { closeSync, copyFileSync, existsSync, fsyncSync, mkdirSync, openSync, renameSync, rmSync, statSync } from 'node:fs';
import { basename, dirname, join } from 'node:path';

/** Tables every Bulkpad database has (drizzle's journal among them): a file without them is not one. */
const REQUIRED_TABLES = ['__drizzle_migrations', 'users', 'pads', 'steps'];

export class BackupError extends Error {}

/** `bulkpad-20261202-140501.db`: a name for a backup made now (sorts by time). */
export function backupFileName(now = new Date()): string {
	const stamp = now.toISOString().replace(/[-:]/g, '').replace('T', '-').slice(0, 15);
	return `bulkpad-${stamp}.db`;
}

/** `why` when a file is not a sound Bulkpad database, else null. Opens it read-only. */
export function checkDatabaseFile(file: string): string | null {
	if (!existsSync(file)) return `${file} does not exist`;
	let db: Database.Database | undefined;
	try {
		db = new Database(file, { readonly: true, fileMustExist: true });
		const problems = (db.pragma('integrity_check') as { integrity_check: string }[]).map((r) => r.integrity_check);
		if (problems.length !== 1 || problems[0] !== 'ok') return `integrity_check failed: ${problems.slice(0, 3).join('; ')}`;
		const tables = new Set(
			(db.prepare("SELECT name FROM sqlite_master WHERE type = 'table'").all() as { name: string }[]).map((t) => t.name)
		);
		const missing = REQUIRED_TABLES.filter((t) => !tables.has(t));
		if (missing.length) return `not a Bulkpad database (no table ${missing.join(', ')})`;
		return null;
	} catch (e) {
		return `cannot be read as SQLite: ${e instanceof Error ? e.message : String(e)}`;
	} finally {
		db?.close();
	}
}

/**
 * Copies the database at `source` (which a server may be using) into `dest`, a new file, or a new file named
 * by backupFileName() when `dest` is a folder. The copy appears under its name only once it is complete and
 * checked. Returns the file written and its page count.
 */
export async function backupDatabase(source: string, dest: string): Promise<{ file: string; pages: number }> {
	const file = existsSync(dest) && statSync(dest).isDirectory() ? join(dest, backupFileName()) : dest;
	if (existsSync(file)) throw new BackupError(`${file} exists already; give a new file name or a folder`);
	if (!existsSync(source)) throw new BackupError(`no database at ${source} (set DATABASE_URL)`);
	const partial = join(dirname(file), `.${basename(file)}.partial`);
	rmSync(partial, { force: true });
	const db = new Database(source, { fileMustExist: true });
	try {
		db.pragma('busy_timeout = 5000');
		const progress = await db.backup(partial, { progress: () => 0x7fffffff });
		const copy = new Database(partial);
		try {
			copy.pragma('journal_mode = DELETE');
		} finally {
			copy.close();
		}
		const why = checkDatabaseFile(partial);
		if (why) throw new BackupError(`the copy failed its check: ${why}`);
		renameSync(partial, file);
		return { file, pages: progress.totalPages };
	} finally {
		db.close();
		rmSync(partial, { force: true });
	}
}

/** Whether another connection (a running server, a script) has `file` open: it then refuses SQLite's exclusive lock. */
export function isDatabaseInUse(file: string): boolean {
	if (!existsSync(file)) return false;
	const db = new Database(file, { fileMustExist: true, timeout: 0 });
	try {
		// exclusive locking mode makes BEGIN EXCLUSIVE wait for every other connection, WAL readers included
		db.pragma('locking_mode = EXCLUSIVE');
		db.exec('BEGIN EXCLUSIVE');
		db.exec('COMMIT');
		return false;
	} catch (e) {
		if ((e as { code?: string }).code === 'SQLITE_BUSY' || (e as { code?: string }).code === 'SQLITE_LOCKED') return true;
		throw e;
	} finally {
		// closing the last connection checkpoints the WAL into the file, so the file kept aside is whole
		db.close();
	}
}

/** Flushes a file's (or a folder's entries') data to the disk, so a power cut cannot leave half a restore. */
function syncPath(path: string) {
	const fd = openSync(path, 'r');
	try {
		fsyncSync(fd);
	} finally {
		closeSync(fd);
	}
}

/**
 * Puts the checked backup in place of `target` while no process holds `target`; the old file (with any WAL
 * and shared-memory files beside it) is renamed to `<target>.before-restore-<time>` and kept.
 */
export function restoreDatabase(backup: string, target: string, now = new Date()): { keptAside: string | null } {
	const why = checkDatabaseFile(backup);
	if (why) throw new BackupError(`will not restore ${backup}: ${why}`);
	if (isDatabaseInUse(target)) {
		throw new BackupError(`${target} is open in another process (a running Bulkpad?): stop the server, restore, then start it`);
	}
	const stamp = now.toISOString().replace(/[-:]/g, '').replace('T', '-').slice(0, 15);
	let keptAside: string | null = null;
	if (existsSync(target)) {
		keptAside = `${target}.before-restore-${stamp}`;
		for (const suffix of ['', '-wal', '-shm']) if (existsSync(target + suffix)) renameSync(target + suffix, keptAside + suffix);
	}
	// copy next to the target, then rename: the target is either the old file's absence or the whole backup
	mkdirSync(dirname(target), { recursive: true });
	const incoming = join(dirname(target), `.${basename(target)}.restoring`);
	copyFileSync(backup, incoming);
	syncPath(incoming);
	renameSync(incoming, target);
	syncPath(dirname(target));
	return { keptAside };
}
