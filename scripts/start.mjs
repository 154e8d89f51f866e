// `npm start`: migrate, seed the demo group when the database is empty, build when the sources are newer
// than the build, then serve the built app with adapter-node on http://localhost:3000.
// `NODE_ENV=production npm start` is the production start: no demo data, and it refuses to run while the
// demo's accounts are in the database (BULKPAD_KEEP_DEMO=1 keeps them); the first admin comes from
// `npm run setup-admin`. BULKPAD_DEMO=1 or 0 overrides the choice. The server itself always runs as a
// production build: whether there is a demo is decided here, not by NODE_ENV inside the server.
import { spawnSync, spawn } from 'node:child_process';
import { statSync } from 'node:fs';
import { built, newest } from './freshness.mjs';

const run = (args, env = {}) => {
	const r = spawnSync(process.execPath, args, { stdio: 'inherit', env: { ...process.env, ...env } });
	if (r.status !== 0) process.exit(r.status ?? 1);
};

const sources = Math.max(newest('src'), newest('static'), statSync('package.json').mtimeMs, statSync('svelte.config.js').mtimeMs);

const demo = process.env.BULKPAD_DEMO ? process.env.BULKPAD_DEMO === '1' : process.env.NODE_ENV !== 'production';

run(['--import', 'tsx', 'scripts/migrate.ts']);
run(['--import', 'tsx', 'scripts/seed.ts', ...(demo ? ['--demo'] : [])]);
if (built('dist/eval-worker.mjs') < newest('src/lib')) run(['scripts/build-worker.mjs']);
if (built('build/handler.js') < sources) run(['node_modules/vite/bin/vite.js', 'build']);

// The demo has no mail server: unless SMTP_HOST names one, mail (sign-up confirmations, invitations, resets)
// goes to the local stand-in and lands as JSON files in data/mail/.
if (demo && !process.env.SMTP_HOST) {
	const { startFakeSmtp } = await import('./fake-smtp.mjs');
	try {
		const smtp = await startFakeSmtp({ port: Number(process.env.SMTP_PORT ?? 2525), dir: process.env.MAIL_DIR ?? 'data/mail' });
		console.log(`demo mail: fake SMTP on 127.0.0.1:${smtp.port}, messages in ${process.env.MAIL_DIR ?? 'data/mail'}/`);
	} catch (e) {
		console.log(`demo mail: port ${process.env.SMTP_PORT ?? 2525} is taken (${e.code ?? e.message}); using whatever listens there`);
	}
}

const port = process.env.PORT ?? '3000';
// request bodies may carry a whole dataset upload (BULKPAD_UPLOAD_MAX_BYTES) plus its multipart envelope
const uploadMax = Number(process.env.BULKPAD_UPLOAD_MAX_BYTES ?? 1_000_000);
const env = { NODE_ENV: 'production', PORT: port, HOST: '127.0.0.1', BODY_SIZE_LIMIT: String(uploadMax + 65_536), ...process.env };
// with ORIGIN (a deployment behind TLS) adapter-node's own server; without it, plain local HTTP
const entry = process.env.ORIGIN ? 'build/index.js' : 'scripts/serve.mjs';
console.log(`Bulkpad on ${process.env.ORIGIN ?? `http://localhost:${port}`}${demo ? ' with the demo group (accounts in the README)' : ''}`);
const server = spawn(process.execPath, [entry], { stdio: 'inherit', env });
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => server.kill(sig));
server.on('exit', (code) => process.exit(code ?? 0));
