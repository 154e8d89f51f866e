import nodemailer, { type Transporter } from 'nodemailer';
import { desc, eq } from 'drizzle-orm';
import { getDb, schema } from '../db';
import { env } from '../env';
import { newId } from '../auth/accounts';

export type MailKind = (typeof schema.MAIL_KINDS)[number];

export interface MailMessage {
	to: string;
	subject: string;
	text: string;
	kind: MailKind;
	/** links that carry a token: mailed, but replaced by LINK_WITHHELD in the outbox */
	secrets?: string[];
}

export type OutboxRow = typeof schema.outbox.$inferSelect;

/** What the outbox shows in place of a link that carries a token. */
export const LINK_WITHHELD = '[link withheld: only the recipient receives it]';

/** The body as the outbox keeps it: every secret link cut out, so an admin reading it cannot use it. */
export function redactSecrets(text: string, secrets: string[] = []): string {
	return secrets.reduce((t, s) => (s ? t.split(s).join(LINK_WITHHELD) : t), text);
}

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
 * delivery failure. A token mailed in it counts only once the row says 'sent' (`wasSent`); the caller may pick
 * the row's id beforehand so the token's row can point at it.
 */
export async function sendMail(message: MailMessage, id = newId()): Promise<OutboxRow> {
	const db = getDb();
	const { secrets, ...mail } = message;
	const row: OutboxRow = { id, ...mail, text: redactSecrets(mail.text, secrets), status: 'queued', error: null, createdAt: new Date() };
	db.insert(schema.outbox).values(row).run();
	try {
		await getTransport().sendMail({ from: env.mailFrom, to: mail.to, subject: mail.subject, text: mail.text });
		row.status = 'sent';
	} catch (e) {
		row.status = 'failed';
		row.error = e instanceof Error ? e.message : String(e);
	}
	db.update(schema.outbox).set({ status: row.status, error: row.error }).where(eq(schema.outbox.id, row.id)).run();
	return row;
}

/** Whether a message went out: a token mailed in a message that failed (or never left) opens nothing. */
export function wasSent(outboxId: string | null): boolean {
	if (!outboxId) return false;
	return (
		getDb().select({ status: schema.outbox.status }).from(schema.outbox).where(eq(schema.outbox.id, outboxId)).get()?.status === 'sent'
	);
}

/** The outbox, newest first, for the admin page and GET /api/admin/outbox. */
export function listOutbox(limit = 200): OutboxRow[] {
	return getDb().select().from(schema.outbox).orderBy(desc(schema.outbox.createdAt)).limit(limit).all();
}
