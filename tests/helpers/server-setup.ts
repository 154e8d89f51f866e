// Global setup for the API and browser tests: a fresh SQLite file seeded with the demo group, a fake SMTP
// server, and the real built app (build/index.js) on a free loopback port.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { TestProject } from 'vitest/node';
import { startFakeSmtp } from '../../scripts/fake-smtp.mjs';
import { buildDir } from '../../scripts/out-dirs.mjs';
import { freePort } from '../../scripts/free-port.mjs';

declare module 'vitest' {
	export interface ProvidedContext {
		baseUrl: string;
		mailDir: string;
		dbFile: string;
		/** the test server's time budget of one line and of one whole replay (ms) */
		evalBudgetMs: number;
		replayBudgetMs: number;
	}
}

export default async function setup(project: TestProject) {
	if (!existsSync(`${buildDir}/index.js`) || !existsSync(process.env.BULKPAD_WORKER ?? 'dist/eval-worker.mjs')) {
		throw new Error('The app is not built: run "npm test" (it builds first) or "npm run build".');
	}
	const dir = mkdtempSync(join(tmpdir(), 'bulkpad-test-'));
	const dbFile = join(dir, 'bulkpad.db');
	const mailDir = join(dir, 'mail');
	const smtp = await startFakeSmtp({ dir: mailDir });
	const env = {
		...process.env,
		DATABASE_URL: dbFile,
		NODE_ENV: 'production',
		// the suite runs against the demo group: say so, since a production seed makes no accounts
		BULKPAD_DEMO: '1',
		// many suites make fresh accounts from this one address; the sign-up limit has its own server in accounts-limits
		BULKPAD_SIGNUP_PER_HOUR_PER_ADDRESS: '100000',
		BULKPAD_INVITE_PER_HOUR_PER_ADDRESS: '100000',
		SMTP_PORT: String(smtp.port),
		BULKPAD_SIGNIN_PER_MINUTE: '30',
		BULKPAD_SIGNIN_PER_MINUTE_PER_ADDRESS: '100000',
		BULKPAD_REPLAY_PER_MINUTE: '1000',
		// Generous, so that no ordinary test line depends on the machine's speed (a busy machine may run a light
		// line many times slower than usual); the one budget test uses a line that can never finish in any
		// budget, so it only waits these seconds out.
		BULKPAD_EVAL_BUDGET_MS: '20000',
		// test-only evaluator hooks ('#test-hook allocate' / 'spin', src/lib/server/eval/child.ts) for tests/api/abuse.test.ts
		BULKPAD_TEST_HOOKS: '1',
		BULKPAD_DATASET_BYTES_PER_USER: '8000000',
		BULKPAD_REPLAY_BUDGET_MS: '20000',
		BODY_SIZE_LIMIT: String(1_000_000 + 65_536)
	};
	const seed = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/seed.ts'], { env, encoding: 'utf8' });
	if (seed.status !== 0) throw new Error(`seeding failed:\n${seed.stdout}\n${seed.stderr}`);

	const port = await freePort();
	const baseUrl = `http://127.0.0.1:${port}`;
	const server: ChildProcess = spawn(process.execPath, [`${buildDir}/index.js`], {
		env: { ...env, PORT: String(port), HOST: '127.0.0.1', ORIGIN: baseUrl },
		stdio: ['ignore', 'pipe', 'pipe']
	});
	let log = '';
	server.stdout?.on('data', (b) => (log += b));
	server.stderr?.on('data', (b) => (log += b));
	// only catches a server that never comes up: booting and warming the worker threads is slow on a busy machine
	const deadline = Date.now() + 180_000;
	for (;;) {
		try {
			const r = await fetch(`${baseUrl}/api/health`);
			if (r.ok) break;
		} catch {
			/* not up yet */
		}
		if (Date.now() > deadline || server.exitCode !== null) throw new Error(`server did not start:\n${log}`);
		await new Promise((r) => setTimeout(r, 150));
	}
	project.provide('baseUrl', baseUrl);
	project.provide('mailDir', mailDir);
	project.provide('dbFile', dbFile);
	project.provide('evalBudgetMs', Number(env.BULKPAD_EVAL_BUDGET_MS));
	project.provide('replayBudgetMs', Number(env.BULKPAD_REPLAY_BUDGET_MS));

	return async () => {
		server.kill('SIGTERM');
		await smtp.close();
		if (log.includes('Error') && process.env.BULKPAD_TEST_LOG) console.log(log);
		rmSync(dir, { recursive: true, force: true });
	};
}
