// A local stand-in for a mail server: accepts every message on 127.0.0.1 and writes it, parsed, as JSON
// into a folder (one file a message). Development and tests send real SMTP to it through nodemailer.
// A message to an address listed in <dir>/undeliverable.txt (one a line) is written, then refused with 550:
// the sender sees a failed send, and a test can still read what a link in it would have been.
import { SMTPServer } from 'smtp-server';
import { simpleParser } from 'mailparser';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

/**
 * @param {{ port?: number; dir: string }} options
 * @returns {Promise<{ port: number; close: () => Promise<void> }>}
 */
export async function startFakeSmtp({ port = 0, dir }) {
	mkdirSync(dir, { recursive: true });
	let seq = 0;
	const server = new SMTPServer({
		authOptional: true,
		disabledCommands: ['STARTTLS'],
		logger: false,
		size: 1_000_000,
		onData(stream, _session, callback) {
			simpleParser(stream)
				.then((mail) => {
					const to = [mail.to].flat().flatMap((a) => (a ? a.value.map((v) => v.address) : []));
					const record = { to, from: mail.from?.text, subject: mail.subject, text: mail.text, date: new Date().toISOString() };
					writeFileSync(join(dir, `${Date.now()}-${++seq}.json`), JSON.stringify(record, null, 2));
					const refusedFile = join(dir, 'undeliverable.txt');
					const refused = existsSync(refusedFile) ? readFileSync(refusedFile, 'utf8').split('\n').filter(Boolean) : [];
					if (to.some((a) => !!a && refused.includes(a))) {
						const err = /** @type {Error & { responseCode?: number }} */ (new Error('mailbox unavailable'));
						err.responseCode = 550;
						return callback(err);
					}
					callback();
				})
				.catch(callback);
		}
	});
	await /** @type {Promise<void>} */ (
		new Promise((resolve, reject) => {
			server.once('error', reject);
			server.listen(port, '127.0.0.1', () => resolve());
		})
	);
	const address = /** @type {import('node:net').AddressInfo} */ (server.server.address());
	return { port: address.port, close: () => new Promise((r) => server.close(() => r())) };
}

if (import.meta.url === `file://${process.argv[1]}`) {
	const dir = process.env.MAIL_DIR ?? 'data/mail';
	const { port } = await startFakeSmtp({ port: Number(process.env.SMTP_PORT ?? 2525), dir });
	console.log(`fake SMTP on 127.0.0.1:${port}, messages in ${dir}/`);
}
