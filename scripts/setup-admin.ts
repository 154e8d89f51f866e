// `npm run setup-admin -- --email you@example.org [--name "Your Name"]`: makes the first admin of a production
// database, once. The password is read from stdin — typed without echo at a terminal, or the first line of a
// pipe (`printf '%s\n' "$PW" | npm run setup-admin -- --email …`) — and never printed or put on the command
// line, where `ps` and the shell's history would keep it. Refuses when the database has an admin already.
import { count, eq } from 'drizzle-orm';
import { createInterface } from 'node:readline';
import { openDb, schema } from '../src/lib/server/db/index';
import { createUser, emailSchema, passwordSchema } from '../src/lib/server/auth/accounts';

function option(name: string): string | undefined {
	const i = process.argv.indexOf(`--${name}`);
	return i > 0 ? process.argv[i + 1] : undefined;
}

/** One line from stdin; at a terminal the typed characters are not echoed. */
function readSecretLine(prompt: string): Promise<string> {
	const stdin = process.stdin;
	if (!stdin.isTTY) {
		return new Promise((resolve) => {
			const rl = createInterface({ input: stdin });
			let done = false;
			rl.once('line', (line) => ((done = true), rl.close(), resolve(line)));
			rl.once('close', () => !done && resolve(''));
		});
	}
	return new Promise((resolve) => {
		process.stdout.write(prompt);
		let typed = '';
		stdin.setRawMode(true);
		stdin.resume();
		stdin.setEncoding('utf8');
		const onData = (chunk: string) => {
			for (const ch of chunk) {
				if (ch === '\r' || ch === '\n') {
					stdin.setRawMode(false);
					stdin.pause();
					stdin.off('data', onData);
					process.stdout.write('\n');
					return resolve(typed);
				}
				if (ch === '\u0003') process.exit(130);
				if (ch === '\u007f') typed = typed.slice(0, -1);
				else typed += ch;
			}
		};
		stdin.on('data', onData);
	});
}

async function main(): Promise<number> {
	const email = emailSchema.safeParse(option('email') ?? '');
	if (!email.success) {
		console.error('usage: npm run setup-admin -- --email you@example.org [--name "Your Name"] (password on stdin)');
		return 1;
	}
	const { db } = openDb();
	const admins = db.select({ n: count() }).from(schema.users).where(eq(schema.users.role, 'admin')).get()?.n ?? 0;
	if (admins > 0) {
		console.error('This database has an admin already; further roles are given on the Users page.');
		return 1;
	}
	const password = await readSecretLine(`password for ${email.data} (8 characters or more): `);
	const again = process.stdin.isTTY ? await readSecretLine('once more: ') : password;
	if (password !== again) {
		console.error('The two passwords differ; nothing was made.');
		return 1;
	}
	const checked = passwordSchema.safeParse(password);
	if (!checked.success) {
		console.error(`${checked.error.issues[0]?.message ?? 'Choose another password.'} Nothing was made.`);
		return 1;
	}
	const name = option('name') ?? email.data.slice(0, email.data.indexOf('@'));
	try {
		await createUser({ email: email.data, name, password: checked.data }, 'admin', { confirmed: true });
	} catch (e) {
		console.error((e as Error).message);
		return 1;
	}
	console.log(`made the admin ${email.data}; sign in and set who may make accounts on the Users page`);
	return 0;
}

process.exit(await main());
