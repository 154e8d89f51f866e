// A built Bulkpad server of a test's own, on a database file the test chooses, so the test may kill it,
// restart it on the same file, or stop it to restore a backup. The suite's shared server is never touched.
import { spawn, type ChildProcess } from 'node:child_process';
import { buildDir } from '../../../scripts/out-dirs.mjs';
import { freePort } from '../../../scripts/free-port.mjs';

export interface OwnServer {
	baseUrl: string;
	child: ChildProcess;
	/** everything the server printed, for failure messages */
	log: () => string;
	/** SIGKILL (no chance to finish anything) or SIGTERM; resolves once the process is gone */
	stop: (signal: 'SIGKILL' | 'SIGTERM') => Promise<void>;
}

/** Starts build/index.js on `dbFile` and waits until /api/health answers (a hang guard, not a speed check). */
export async function startOwnServer(dbFile: string, env: Record<string, string> = {}): Promise<OwnServer> {
	const port = await freePort();
	const baseUrl = `http://127.0.0.1:${port}`;
	const child = spawn(process.execPath, [`${buildDir}/index.js`], {
		env: {
			...process.env,
			NODE_ENV: 'production',
			DATABASE_URL: dbFile,
			PORT: String(port),
			HOST: '127.0.0.1',
			ORIGIN: baseUrl,
			BULKPAD_EVAL_BUDGET_MS: '30000',
			...env
		},
		stdio: ['ignore', 'pipe', 'pipe']
	});
	let log = '';
	child.stdout?.on('data', (b) => (log += b));
	child.stderr?.on('data', (b) => (log += b));
	const exited = new Promise<void>((resolve) => child.once('exit', () => resolve()));
	const stop = async (signal: 'SIGKILL' | 'SIGTERM') => {
		if (child.exitCode === null && child.signalCode === null) child.kill(signal);
		await exited;
	};
	const deadline = Date.now() + 120_000;
	for (;;) {
		try {
			if ((await fetch(`${baseUrl}/api/health`)).ok) break;
		} catch {
			/* not up yet */
		}
		if (child.exitCode !== null || child.signalCode !== null || Date.now() > deadline) {
			await stop('SIGKILL');
			throw new Error(`own server did not start on ${dbFile}:\n${log}`);
		}
		await new Promise((r) => setTimeout(r, 150));
	}
	return { baseUrl, child, log: () => log, stop };
}
