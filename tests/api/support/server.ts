// A second, private server for tests that need settings the shared test server relaxes (the default rate
// limits) or a trusted proxy header: the same built app on its own free port, its own fresh demo database and
// its own fake SMTP server.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startFakeSmtp } from '../../../scripts/fake-smtp.mjs';
import { buildDir } from '../../../scripts/out-dirs.mjs';
import { freePort } from '../../../scripts/free-port.mjs';

export interface PrivateServer {
	baseUrl: string;
	mailDir: string;
	dbFile: string;
	stop(): Promise<void>;
}

export async function startPrivateServer(extraEnv: Record<string, string>): Promise<PrivateServer> {
	const dir = mkdtempSync(join(tmpdir(), 'bulkpad-private-'));
	const dbFile = join(dir, 'bulkpad.db');
	const mailDir = join(dir, 'mail');
	const smtp = await startFakeSmtp({ dir: mailDir });
	const env: Record<string, string | undefined> = {
		...process.env,
		DATABASE_URL: dbFile,
		NODE_ENV: 'production',
		SMTP_PORT: String(smtp.port)
	};
	// the shared server's relaxed limits must not leak in from the environment
	for (const k of Object.keys(env)) if (/^BULKPAD_(SIGNIN|SIGNUP|INVITE)_/.test(k)) delete env[k];
	const seed = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/seed.ts', '--demo'], { env, encoding: 'utf8' });
	if (seed.status !== 0) throw new Error(`seeding failed:\n${seed.stdout}\n${seed.stderr}`);
	const port = await freePort();
	const baseUrl = `http://127.0.0.1:${port}`;
	const server: ChildProcess = spawn(process.execPath, [`${buildDir}/index.js`], {
		env: { ...env, ...extraEnv, PORT: String(port), HOST: '127.0.0.1', ORIGIN: baseUrl },
		stdio: ['ignore', 'pipe', 'pipe']
	});
	let log = '';
	server.stdout?.on('data', (b) => (log += b));
	server.stderr?.on('data', (b) => (log += b));
	const deadline = Date.now() + 60_000;
	for (;;) {
		try {
			if ((await fetch(`${baseUrl}/api/health`)).ok) break;
		} catch {
			/* not up yet */
		}
		if (Date.now() > deadline || server.exitCode !== null) throw new Error(`private server did not start:\n${log}`);
		await new Promise((r) => setTimeout(r, 150));
	}
	return {
		baseUrl,
		mailDir,
		dbFile,
		async stop() {
			server.kill('SIGTERM');
			await new Promise((r) => (server.exitCode !== null ? r(null) : server.once('exit', r)));
			await smtp.close();
			rmSync(dir, { recursive: true, force: true });
		}
	};
}
