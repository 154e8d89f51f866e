// The production start on temporary databases: a production seed makes no account (so none with a known
// password) and no pad; the production path refuses a database holding the demo's accounts unless told to keep
// them; the first admin comes from setup-admin with the password on stdin, never echoed; the demo path still
// seeds the README's accounts.
import Database from 'better-sqlite3';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';

const dir = mkdtempSync(join(tmpdir(), 'bulkpad-prod-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

// each step spawns node with tsx, which on a busy machine takes a while: generous limits, no timing claims
const SLOW = 400_000;

function node(args: string[], env: Record<string, string>, input?: string) {
	const clean: Record<string, string | undefined> = { ...process.env };
	delete clean.BULKPAD_DEMO;
	delete clean.BULKPAD_KEEP_DEMO;
	return spawnSync(process.execPath, args, {
		env: { ...clean, NODE_ENV: 'production', ...env },
		encoding: 'utf8',
		input,
		timeout: 300_000
	});
}

const tsx = (script: string, ...args: string[]) => ['--import', 'tsx', script, ...args];

function rows<T>(dbFile: string, query: string): T[] {
	const db = new Database(dbFile, { readonly: true });
	try {
		return db.prepare(query).all() as T[];
	} finally {
		db.close();
	}
}

describe('production seed', () => {
	const dbFile = join(dir, 'prod.db');

	it(
		'makes no account and no pad, and says how to make the first admin',
		() => {
			expect(node(tsx('scripts/migrate.ts'), { DATABASE_URL: dbFile }).status).toBe(0);
			const seed = node(tsx('scripts/seed.ts'), { DATABASE_URL: dbFile });
			expect(seed.status, seed.stderr).toBe(0);
			expect(seed.stdout).toContain('npm run setup-admin');
			expect(seed.stdout + seed.stderr).not.toContain('bulkpad-demo');
			expect(rows(dbFile, 'select * from users')).toHaveLength(0);
			expect(rows(dbFile, 'select * from pads')).toHaveLength(0);
			expect(rows(dbFile, 'select * from shares')).toHaveLength(0);
			// no policy row: sign-up is invitation-only until an admin opens it
			expect(rows(dbFile, "select * from settings where key = 'signup'")).toHaveLength(0);
		},
		SLOW
	);

	it(
		'setup-admin makes one confirmed admin from a password on stdin, never printing it, and only once',
		() => {
			const secret = 'a long production secret';
			const made = node(
				tsx('scripts/setup-admin.ts', '--email', 'Lead@Example.org', '--name', 'Group Lead'),
				{ DATABASE_URL: dbFile },
				`${secret}\n`
			);
			expect(made.status, made.stderr).toBe(0);
			expect(made.stdout + made.stderr).not.toContain(secret);
			const users = rows<{ email: string; role: string; email_confirmed_at: number | null; password_hash: string }>(
				dbFile,
				'select * from users'
			);
			expect(users).toHaveLength(1);
			expect(users[0]).toMatchObject({ email: 'lead@example.org', role: 'admin' });
			expect(users[0].email_confirmed_at).not.toBeNull();
			expect(users[0].password_hash.startsWith('$argon2id$')).toBe(true);

			const again = node(tsx('scripts/setup-admin.ts', '--email', 'second@example.org'), { DATABASE_URL: dbFile }, 'another long secret\n');
			expect(again.status).toBe(1);
			expect(again.stderr).toMatch(/admin already/);
			const short = node(tsx('scripts/setup-admin.ts', '--email', 'x@example.org'), { DATABASE_URL: join(dir, 'other.db') }, 'short\n');
			expect(short.status).toBe(1);
			expect(short.stdout + short.stderr).not.toContain('short\n');
			expect(rows(join(dir, 'other.db'), 'select * from users')).toHaveLength(0);
			// a later production seed keeps it that way
			expect(node(tsx('scripts/seed.ts'), { DATABASE_URL: dbFile }).status).toBe(0);
			expect(rows(dbFile, 'select * from users')).toHaveLength(1);
		},
		SLOW
	);
});

describe('demo data and production', () => {
	const dbFile = join(dir, 'demo.db');

	it(
		'the demo path seeds the README accounts; the production path refuses that database unless told to keep the demo',
		() => {
			const seeded = node(tsx('scripts/seed.ts', '--demo'), { DATABASE_URL: dbFile });
			expect(seeded.status, seeded.stderr).toBe(0);
			const emails = rows<{ email: string }>(dbFile, 'select email from users order by email').map((u) => u.email);
			expect(emails).toEqual(['curator@sable.test', 'ines@sable.test', 'referee@sable.test', 'tomas@sable.test']);
			expect(rows(dbFile, "select * from shares where slug = 'sable-boosted-first-law'")).toHaveLength(1);

			const refused = node(tsx('scripts/seed.ts'), { DATABASE_URL: dbFile });
			expect(refused.status).toBe(2);
			expect(refused.stderr).toContain('curator@sable.test');
			expect(refused.stderr).toContain('BULKPAD_KEEP_DEMO=1');
			expect(node(tsx('scripts/seed.ts'), { DATABASE_URL: dbFile, BULKPAD_KEEP_DEMO: '1' }).status).toBe(0);
		},
		SLOW
	);

	it(
		'`NODE_ENV=production npm start` stops before serving a database with the demo accounts',
		() => {
			const start = node(['scripts/start.mjs'], { DATABASE_URL: dbFile, PORT: '1' });
			expect(start.status).toBe(2);
			expect(start.stderr).toContain('published');
			expect(start.stdout).not.toContain('Bulkpad on');
		},
		SLOW
	);
});
