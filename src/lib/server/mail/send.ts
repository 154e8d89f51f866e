import nodemailer, { type Transporter } from 'nodemailer';
import { desc, eq } from 'drizzle-orm';
import { getDb, schema } from '../db';
import { env } from '../env';
import { newId } from '../auth/accounts';

export interface MailMessage {
	to: string;
	subject: string;
	text: string;
}

export type OutboxRow = typeof schema.outbox.$inferSelect;

let transport: Transporter | undefined;

/** One pooled SMTP connection to env.smtpHost:smtpPort (the fake SMTP server in development and tests). */
function getTransport(): Transporter {
	transport ??= nodemailer.createTransport({
		host: env.smtpHost,
		port: env.smtpPort,
		secure: false,
		// short timeouts: a dead mail server should fail a message, not hang the request that sent it
		connectionTimeout: 5000,
		greetingTimeout: 5000,
		socketTimeout: 10_000
	});
	return transport;
}

/**
 * Sends one message through real SMTP and records it in the outbox: queued before the attempt (so a crash
 * mid-send still leaves a trace), then sent or failed with the transport's reason. Never throws for a
 * delivery failure — the caller's action (an invitation, a reset) has happened either way.
 */
export async function sendMail(message: MailMessage): Promise<OutboxRow> {
	const db = getDb();
	const row: OutboxRow = { id: newId(), ...message, status: 'queued', error: null, createdAt: new Date() };
	db.insert(schema.outbox).values(row).run();
	try {
		await getTransport().sendMail({ from: env.mailFrom, ...message });
		row.status = 'sent';
	} catch (e) {
		row.status = 'failed';
		row.error = e instanceof Error ? e.message : String(e);
	}
	db.update(schema.outbox).set({ status: row.status, error: row.error }).where(eq(schema.outbox.id, row.id)).run();
	return row;
}

/** The outbox, newest first, for the admin page and GET /api/admin/outbox. */
export function listOutbox(limit = 200): OutboxRow[] {
	return getDb().select().from(schema.outbox).orderBy(desc(schema.outbox.createdAt)).limit(limit).all();
}
