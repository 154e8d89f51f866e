// Starts the built app on a free loopback port with a fresh seeded database, for load benches.
import { spawn, spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, existsSync } from 'node:fs';
import { freePort } from '../../scripts/free-port.mjs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';

export { freePort };

export async function startBuiltServer(extraEnv = {}) {
	if (!existsSync('build/index.js') || !existsSync('dist/eval-worker.mjs')) throw new Error('build first: npm run build');
	const dir = mkdtempSync(join(tmpdir(), 'bulkpad-bench-'));
	const env = { ...process.env, DATABASE_URL: join(dir, 'bench.db'), NODE_ENV: 'production', ...extraEnv };
	const seed = spawnSync(process.execPath, ['--import', 'tsx', 'scripts/seed.ts', '--demo'], { env, encoding: 'utf8' });
	if (seed.status !== 0) throw new Error(seed.stderr);
	const port = await freePort();
	const baseUrl = `http://127.0.0.1:${port}`;
	const child = spawn(process.execPath, ['build/index.js'], {
		env: { ...env, PORT: String(port), HOST: '127.0.0.1', ORIGIN: baseUrl },
		stdio: 'ignore'
	});
	for (let i = 0; i < 200; i++) {
		try {
			if ((await fetch(`${baseUrl}/api/health`)).ok) break;
		} catch {
			/* starting */
		}
		await new Promise((r) => setTimeout(r, 100));
	}
	return {
		baseUrl,
		async stop() {
			child.kill('SIGTERM');
			await new Promise((r) => child.once('exit', r));
			rmSync(dir, { recursive: true, force: true });
		}
	};
}

/** `headers` go with both requests (e.g. X-Forwarded-For when the server reads addresses from it). */
/**
 * The headers of a signed-in browser: the session cookie and the origin a cookie-authenticated POST must carry.
 * Benches sign in rather than use an API key: a key has a requests-a-minute budget (at most 6000), far below what
 * a load test sends, and the console itself is a signed-in browser.
 */
export async function sessionFor(baseUrl, email, password = 'bulkpad-demo', headers = {}) {
	const r = await fetch(`${baseUrl}/api/auth/signin`, {
		method: 'POST',
		headers: { 'content-type': 'application/json', origin: baseUrl, ...headers },
		body: JSON.stringify({ email, password })
	});
	const cookie = r.headers
		.getSetCookie()
		.find((c) => c.startsWith('auth_session='))
		?.split(';')[0];
	if (!cookie) throw new Error(`could not sign in as ${email}: ${r.status}`);
	return { cookie, origin: baseUrl };
}
