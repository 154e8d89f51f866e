import Database from 'better-sqlite3';
import { drizzle, type BetterSQLite3Database } from 'drizzle-orm/better-sqlite3';
import { migrate } from 'drizzle-orm/better-sqlite3/migrator';
import { mkdirSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import * as schema from './schema';
import { env } from '../env';

export type Db = BetterSQLite3Database<typeof schema>;

let handle: { sqlite: Database.Database; db: Db } | undefined;

/**
 * Opens the SQLite file and applies pending migrations, once per process. WAL lets readers run beside the
 * one writer; `synchronous = FULL` makes every commit wait for the WAL's fsync, so an acknowledged step
 * survives a power cut too (with NORMAL, WAL only guarantees that after a process crash — the last commits
 * before a power loss could be rolled back). The cost is one fsync per commit, small next to an evaluation.
 */
export function openDb(url = env.databaseUrl): { sqlite: Database.Database; db: Db } {
	if (handle) return handle;
	if (url !== ':memory:') mkdirSync(dirname(resolve(url)), { recursive: true });
	const sqlite = new Database(url);
	sqlite.pragma('journal_mode = WAL');
	sqlite.pragma('synchronous = FULL');
	sqlite.pragma('foreign_keys = ON');
	sqlite.pragma('busy_timeout = 5000');
	const db = drizzle(sqlite, { schema });
	migrate(db, { migrationsFolder: resolve(process.env.BULKPAD_MIGRATIONS ?? 'drizzle') });
	handle = { sqlite, db };
	return handle;
}

/** The app's database; opened lazily so `vite build` never touches the file. */
export function getDb(): Db {
	return openDb().db;
}

export { schema };
