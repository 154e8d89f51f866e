// Shared pieces of the pad, transcript and mail tests: a pad with evaluated steps, direct access to the test
// server's SQLite file (to tamper with stored results or age a link), and the fake SMTP server's folder.
import Database from 'better-sqlite3';
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { expect, inject } from 'vitest';
import type { Client } from '../../helpers/client';

/** A second connection to the running server's database (WAL lets both write). */
export function openTestDb(): Database.Database {
	const db = new Database(inject('dbFile'));
	db.pragma('busy_timeout = 5000');
	return db;
}

export function sql<T = unknown>(query: string, ...params: unknown[]): T[] {
	const db = openTestDb();
	try {
		const stmt = db.prepare(query);
		return (stmt.reader ? stmt.all(...params) : (stmt.run(...params), [])) as T[];
	} finally {
		db.close();
	}
}

/** A new pad of the client's with each line evaluated as a step, in order. */
export async function padWithSteps(c: Client, title: string, lines: string[]): Promise<string> {
	const created = await c.post('/api/pads', { title });
	expect(created.status, JSON.stringify(created.body)).toBe(201);
	const id = created.body.pad.id as string;
	for (const input of lines) {
		const r = await c.post('/api/eval', { input, pad: id });
		expect(r.status, `${input}: ${JSON.stringify(r.body)}`).toBe(200);
	}
	return id;
}

export async function emailOf(c: Client): Promise<string> {
	const me = await c.get('/api/auth/me');
	expect(me.status).toBe(200);
	return me.body.user.email as string;
}

export interface ReceivedMail {
	to: string[];
	from: string;
	subject: string;
	text: string;
}

export function receivedMail(): ReceivedMail[] {
	const dir = inject('mailDir');
	return readdirSync(dir)
		.filter((f) => f.endsWith('.json'))
		.sort()
		.map((f) => JSON.parse(readFileSync(join(dir, f), 'utf8')) as ReceivedMail);
}

/** The first message to `to` that `match` accepts, waiting for the fake SMTP server to write it. */
export async function waitForMail(to: string, match: (m: ReceivedMail) => boolean = () => true, timeoutMs = 60_000): Promise<ReceivedMail> {
	const deadline = Date.now() + timeoutMs;
	for (;;) {
		const found = receivedMail().find((m) => m.to.includes(to) && match(m));
		if (found) return found;
		if (Date.now() > deadline) throw new Error(`no mail to ${to} arrived within ${timeoutMs} ms`);
		await new Promise((r) => setTimeout(r, 100));
	}
}
