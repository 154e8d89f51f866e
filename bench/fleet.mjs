// Fleet mode (README › Operations › Several machines) on this machine: a heavy sweep of 400 HRT surfaces after a
// quench (exact balls, a millisecond each since the one-shot method, are too light to show the split) with 1, 2 and 4 workers (each with BULKPAD_EVAL_THREADS=2: one light and one heavy evaluation process) against
// the in-process server, and the queue's overhead per light line (Redis round trips) against in-process.
// Needs a build (npm run build) and redis-server. Writes the "fleet" section of bench/RESULTS.md.
import { spawn, spawnSync } from 'node:child_process';
import { loadavg } from 'node:os';
import { freePort, sessionFor, startBuiltServer } from './lib/server.mjs';
import { emit, machineLine, median, writeSection } from './lib/results.mjs';

if (spawnSync('redis-server', ['--version'], { stdio: 'ignore' }).status !== 0) {
	console.error('redis-server is missing: apt-get install -y redis-server (or node scripts/ensure-redis.mjs)');
	process.exit(1);
}

const HEAVY = 'use vaidya d=3 zh=1; sweep darea l=2..4:400 t=1.5';
const LIGHT = 'darea l=0.5';
const LIGHT_RUNS = Number(process.env.BULKPAD_BENCH_LIGHT_RUNS ?? 300);
const WORKER_COUNTS = (process.env.BULKPAD_BENCH_WORKERS ?? '1,2,4').split(',').map(Number);
const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

const redisPort = await freePort();
const redis = spawn('redis-server', ['--port', String(redisPort), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no'], {
	stdio: 'ignore'
});
const queueUrl = `redis://127.0.0.1:${redisPort}`;
// budget far above the sweep: the bench times the work, not the refusal
const common = { BULKPAD_EVAL_BUDGET_MS: '1800000', BULKPAD_EVAL_QUEUE_MS: '1800000' };
const here = await startBuiltServer(common);
const fleet = await startBuiltServer({ ...common, BULKPAD_QUEUE: queueUrl });
const keys = { here: await sessionFor(here.baseUrl, 'tomas@sable.test'), fleet: await sessionFor(fleet.baseUrl, 'tomas@sable.test') };
let workers = [];

function startWorkers(n) {
	return Array.from({ length: n }, () => {
		const child = spawn(process.execPath, ['dist/fleet-worker.mjs'], {
			env: { ...process.env, BULKPAD_QUEUE: queueUrl, BULKPAD_EVAL_THREADS: '2' },
			stdio: ['ignore', 'pipe', 'inherit']
		});
		const w = { child, log: '' };
		child.stdout.on('data', (b) => (w.log += b));
		return w;
	});
}
async function stopWorkers() {
	await Promise.all(
		workers.map((w) => new Promise((r) => (w.child.exitCode !== null ? r() : (w.child.once('exit', r), w.child.kill('SIGTERM')))))
	);
	workers = [];
}
async function health(base) {
	return (await fetch(`${base}/api/health`)).json();
}

async function evalOnce(base, key, input) {
	const t0 = performance.now();
	const r = await fetch(`${base}/api/eval`, {
		method: 'POST',
		headers: { 'content-type': 'application/json', ...key },
		body: JSON.stringify({ input })
	});
	const body = await r.json();
	if (r.status !== 200) throw new Error(`${input}: ${r.status} ${JSON.stringify(body).slice(0, 300)}`);
	return { ms: performance.now() - t0, body };
}

async function lightLatencies(base, key) {
	for (let i = 0; i < 20; i++) await evalOnce(base, key, LIGHT); // warm-up
	const ms = [];
	for (let i = 0; i < LIGHT_RUNS; i++) ms.push((await evalOnce(base, key, LIGHT)).ms);
	ms.sort((a, b) => a - b);
	return { p50: median(ms), p90: ms[Math.floor(ms.length * 0.9)] };
}

const rows = [];
const load = [];
let lightHere;
let lightFleet;
/** Rewritten after each measurement, so a run stopped early still leaves what it measured. */
function report() {
	const s = (ms) => (ms / 1000).toFixed(1);
	const lightRows = lightHere
		? `| in-process | ${lightHere.p50.toFixed(1)} | ${lightHere.p90.toFixed(1)} |
| through the fleet (1 worker) | ${lightFleet.p50.toFixed(1)} | ${lightFleet.p90.toFixed(1)} |`
		: '';
	writeSection(
		'fleet',
		`## Fleet (\`npm run bench -- fleet\`)
${machineLine()}; Redis ${spawnSync('redis-server', ['--version'], { encoding: 'utf8' }).stdout.match(/v=(\S+)/)?.[1]} on 127.0.0.1, the server and every worker on this same machine. Load average when measured: ${load.map((l) => l.toFixed(1)).join(', ')} (other work on the machine slows everything; this machine has 2 cores, so more than two busy evaluation processes cannot go faster here).

\`${HEAVY}\` (400 HRT surfaces of strips after a quench) through \`POST /api/eval\`, one request:

| evaluated by | wall time (s) | speed-up | same numbers as in-process |
|---|---|---|---|
${rows.map((r) => `| ${r.label} | ${s(r.ms)} | ×${(rows[0].ms / r.ms).toFixed(2)} | ${r.same === undefined ? '(reference)' : r.same ? 'yes, bit for bit' : '**no**'} |`).join('\n')}

Light line \`${LIGHT}\`, ${LIGHT_RUNS} requests back to back, signed in (after 20 to warm up), latency per request:

| evaluated | p50 ms | p90 ms |
|---|---|---|
${lightRows}

Queue overhead per light line (p50 difference): ${(lightFleet.p50 - lightHere.p50).toFixed(1)} ms — a job added, taken and answered
through Redis (list, lock, event stream); it is paid once per line (or chunk), so it matters for light lines only.`
	);
}

try {
	// light lines: in-process, then through the fleet with one worker
	workers = startWorkers(1);
	while (!workers.every((w) => w.log.includes('ready'))) await sleep(200);
	while ((await health(fleet.baseUrl)).queue !== 'fleet') await sleep(200);
	lightHere = await lightLatencies(here.baseUrl, keys.here);
	lightFleet = await lightLatencies(fleet.baseUrl, keys.fleet);
	report();
	emit({ name: 'light line in-process', ...lightHere });
	emit({ name: 'light line through the fleet', ...lightFleet });

	// the heavy sweep in-process (one heavy evaluation process), then on 1, 2, 4 workers
	load.push(loadavg()[0]);
	const base = await evalOnce(here.baseUrl, keys.here, HEAVY);
	rows.push({ label: 'in-process (one heavy evaluation process)', ms: base.ms });
	emit({ name: 'heavy sweep in-process', ms: base.ms });
	report();
	const reference = JSON.stringify(base.body.results);
	for (const n of WORKER_COUNTS) {
		await stopWorkers();
		await sleep(1500);
		workers = startWorkers(n);
		while (!workers.every((w) => w.log.includes('ready'))) await sleep(200);
		await sleep(2500); // the server sees every heartbeat
		load.push(loadavg()[0]);
		const r = await evalOnce(fleet.baseUrl, keys.fleet, HEAVY);
		const same = JSON.stringify(r.body.results) === reference;
		rows.push({ label: `fleet, ${n} worker${n > 1 ? 's' : ''} (${n} heavy process${n > 1 ? 'es' : ''})`, ms: r.ms, same });
		emit({ name: `heavy sweep, ${n} workers`, ms: r.ms, same });
		report();
	}
} finally {
	await stopWorkers();
	await here.stop();
	await fleet.stop();
	redis.kill('SIGKILL');
}
