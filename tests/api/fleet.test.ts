// Fleet mode against real processes: Debian's redis-server on a free port, two evaluation workers
// (`dist/fleet-worker.mjs`, what `npm run worker` starts) and a private server with BULKPAD_QUEUE set. A split
// sweep answers what the shared in-process test server answers, bit for bit; killing a worker mid-sweep still
// completes it (its chunk is retried on the other); hanging up stops the chunks on both workers; a job of
// another code version is refused; Redis going away sends lines back in-process and /api/health says so.
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Queue } from 'bullmq';
import { freePort } from '../../scripts/free-port.mjs';
import { emptyContext, runLine } from '../../src/lib/lang';
import { codeVersion, queueNames } from '../../src/lib/server/eval/fleet/config';
import { Client, DEMO_PASSWORD, signedIn } from '../helpers/client';
import { padWithSteps } from './support/pads';
import { startPrivateServer, type PrivateServer } from './support/server';

const HAVE_REDIS = spawnSync('redis-server', ['--version'], { stdio: 'ignore' }).status === 0;
if (!HAVE_REDIS) {
	console.warn(
		'\n!!! SKIPPING tests/api/fleet.test.ts: redis-server is not installed. `npm test` installs it ' +
			'(scripts/ensure-redis.mjs); by hand: apt-get install -y redis-server\n'
	);
}

const WORKER_BUNDLE = process.env.BULKPAD_WORKER ?? 'dist/eval-worker.mjs';
/** short locks, so a killed worker's chunk goes back to the queue within seconds */
const LOCK_MS = '3000';
/** a heavy line (a sweep) that is cheap, so the in-process test server answers it within its budget however busy */
const STRIP_SWEEP = 'sweep darea l=0.1..3:400';
/**
 * 80 HRT surfaces of very wide quench strips (l = 60…80 zh in d = 6: a family curve each, ~40 ms on a quiet machine
 * since the loose curve grid; ~65 ms before, and d = 4, l = 6…8 became far cheaper): over half a second of work per
 * chunk of twenty, so a kill ~50 ms after the chunk starts lands inside it. A faster solver may need more points here.
 */
const SWEEP = 'use vaidya d=6 zh=1; sweep darea l=60..80:80 t=30';
/**
 * Minutes of work (HRT surfaces of very wide quench strips, ~40 ms each, and no two alike): every chunk runs
 * for twenty seconds or more, so each worker is inside one when the client hangs up, and the line can only stop by being
 * cancelled. (Exact balls are no longer a candidate: they take about a millisecond each.)
 */
/** the pad's bulk for it: a stateless line of two statements would run whole, unsplit */
const ENDLESS_BULK = 'use vaidya d=6 zh=1';
const ENDLESS = 'sweep darea l=60..80:2000 t=30';

interface Proc {
	child: ChildProcess;
	log: string;
	dead?: boolean;
}

let redisPort = 0;
let redis: ChildProcess | undefined;
const workers: Proc[] = [];
let server: PrivateServer | undefined;
let fleet: Client;
let local: Client;

function startWorker(): Proc {
	const child = spawn(process.execPath, ['dist/fleet-worker.mjs'], {
		env: { ...process.env, BULKPAD_QUEUE: `redis://127.0.0.1:${redisPort}`, BULKPAD_EVAL_THREADS: '2', BULKPAD_FLEET_LOCK_MS: LOCK_MS },
		stdio: ['ignore', 'pipe', 'pipe'],
		// its own process group: killing the group is a machine dying, evaluation processes and all
		detached: true
	});
	const p: Proc = { child, log: '' };
	child.stdout?.on('data', (b) => (p.log += b));
	child.stderr?.on('data', (b) => (p.log += b));
	workers.push(p);
	return p;
}

function killGroup(p: Proc) {
	p.dead = true;
	try {
		process.kill(-p.child.pid!, 'SIGKILL');
	} catch {
		/* gone already */
	}
}

const started = (p: Proc) => [...p.log.matchAll(/job (\S+) started/g)].map((m) => m[1]!);
const cancelledJobs = (p: Proc) => [...p.log.matchAll(/job (\S+) cancelled/g)].map((m) => m[1]!);
const ready = (p: Proc) => p.log.includes('ready: code version');

/** expect.poll for hooks (where vitest does not allow it): waits for `ok()` or fails with `what`. */
async function until(what: string, ok: () => boolean | Promise<boolean>, timeoutMs: number) {
	const deadline = Date.now() + timeoutMs;
	while (!(await ok())) {
		if (Date.now() > deadline) throw new Error(`gave up waiting: ${what}`);
		await new Promise((r) => setTimeout(r, 250));
	}
}

async function health(): Promise<{ ok: boolean; db: string; queue: string }> {
	return (await fetch(`${server!.baseUrl}/api/health`)).json();
}

describe.skipIf(!HAVE_REDIS)('evaluation fleet (Redis + two workers)', () => {
	beforeAll(async () => {
		redisPort = await freePort();
		redis = spawn('redis-server', ['--port', String(redisPort), '--bind', '127.0.0.1', '--save', '', '--appendonly', 'no'], {
			stdio: 'ignore'
		});
		startWorker();
		startWorker();
		server = await startPrivateServer({
			BULKPAD_QUEUE: `redis://127.0.0.1:${redisPort}`,
			BULKPAD_FLEET_LOCK_MS: LOCK_MS,
			BULKPAD_EVAL_BUDGET_MS: '120000'
		});
		await until(`both workers ready:\n${workers.map((w) => w.log).join('\n')}`, () => workers.every(ready), 120_000);
		await until('health says fleet', async () => (await health()).queue === 'fleet', 60_000);
		// the server reads the workers' heartbeats every second: let it have seen both
		await new Promise((r) => setTimeout(r, 2500));
		fleet = new Client(server.baseUrl);
		const r = await fleet.post('/api/auth/signin', { email: 'tomas@sable.test', password: DEMO_PASSWORD });
		expect(r.status).toBe(200);
		local = await signedIn('tomas@sable.test');
	}, 300_000);

	afterAll(async () => {
		for (const w of workers) killGroup(w);
		await server?.stop();
		redis?.kill('SIGKILL');
	});

	const logs = () => workers.map((w, i) => `worker ${i}:\n${w.log}`).join('\n');

	it('health keeps {ok, db} and says the lines go to the fleet', async () => {
		expect(await health()).toEqual({ ok: true, db: 'ok', queue: 'fleet' });
		expect((await new Client().get('/api/health')).body).toEqual({ ok: true, db: 'ok', queue: 'in-process' });
	});

	it('a light line answers what in-process evaluation answers', async () => {
		for (const input of ['darea l=0.5', 'thermo', 'entropy l=0.3 o=3']) {
			const [a, b] = await Promise.all([fleet.post('/api/eval', { input }), local.post('/api/eval', { input })]);
			expect(a.status, JSON.stringify(a.body)).toBe(200);
			expect(a.body.results).toEqual(b.body.results);
		}
	});

	it('splits a sweep into chunks and answers what the in-process server answers, bit for bit', async () => {
		const count = () => workers.reduce((n, w) => n + started(w).length, 0);
		const before = count();
		const [a, b] = await Promise.all([fleet.post('/api/eval', { input: STRIP_SWEEP }), local.post('/api/eval', { input: STRIP_SWEEP })]);
		expect(a.status, JSON.stringify(a.body)).toBe(200);
		expect(b.status, JSON.stringify(b.body)).toBe(200);
		// JSON numbers print every bit of a double: equal text is equal doubles
		expect(JSON.stringify(a.body.results)).toBe(JSON.stringify(b.body.results));
		expect(a.body.results[0].rows).toHaveLength(400);
		// four chunks: two per heavy process of the two workers
		expect(count() - before, logs()).toBe(4);
	}, 300_000);

	it('completes a quench sweep when a worker is killed in the middle of it, with the in-process numbers', async () => {
		const [victim, survivor] = workers;
		const before = started(victim!).length;
		const survivorBefore = started(survivor!).length;
		const answer = fleet.post('/api/eval', { input: SWEEP });
		await expect.poll(() => started(victim!).length, { timeout: 120_000, interval: 50 }).toBeGreaterThan(before);
		killGroup(victim!);
		// the language itself, in this process: what in-process evaluation answers
		const reference = runLine(SWEEP, emptyContext()).results;
		const a = await answer;
		expect(a.status, JSON.stringify(a.body)).toBe(200);
		expect(JSON.stringify(a.body.results)).toBe(JSON.stringify(reference));
		// the survivor ran the lost chunk as well as its own
		const lost = started(victim!)
			.slice(before)
			.filter((j) => !victim!.log.includes(`job ${j} done`));
		expect(lost.length, logs()).toBeGreaterThan(0);
		for (const j of lost) expect(started(survivor!).slice(survivorBefore), logs()).toContain(j);
	}, 300_000);

	it('cancel stops the chunks on both workers', async () => {
		// two live workers (a replacement for the one killed above), both known to the server
		while (workers.filter((w) => !w.dead).length < 2) startWorker();
		const live = workers.filter((w) => !w.dead);
		await expect.poll(() => live.every(ready), { timeout: 120_000, interval: 250 }).toBe(true);
		await new Promise((r) => setTimeout(r, 3000)); // a heartbeat or two
		// the fleet takes a heavy line again (and has forgotten the killed worker)
		expect((await fleet.post('/api/eval', { input: STRIP_SWEEP })).status).toBe(200);
		const pad = await padWithSteps(fleet, 'endless', [ENDLESS_BULK]);
		const before = live.map((w) => started(w).length);
		const hangUp = new AbortController();
		const pending = fetch(`${server!.baseUrl}/api/eval`, {
			method: 'POST',
			headers: { 'content-type': 'application/json', origin: server!.baseUrl, cookie: fleet.cookie },
			body: JSON.stringify({ input: ENDLESS, pad }),
			signal: hangUp.signal
		}).catch(() => undefined);
		for (const [i, w] of live.entries()) {
			await expect.poll(() => started(w).length, { timeout: 120_000, interval: 100, message: logs() }).toBeGreaterThan(before[i]!);
		}
		const running = live.map((w) => started(w).slice(-1)[0]!);
		hangUp.abort();
		await pending;
		for (const [i, w] of live.entries()) {
			await expect.poll(() => cancelledJobs(w), { timeout: 60_000, interval: 100, message: logs() }).toContain(running[i]);
		}
		// nothing of the sweep is left running or waiting on the fleet
		const q = new Queue(queueNames(codeVersion(WORKER_BUNDLE)).heavy, { connection: { host: '127.0.0.1', port: redisPort } });
		try {
			await expect
				.poll(
					async () => {
						const c = await q.getJobCounts('active', 'waiting', 'prioritized', 'delayed');
						return c.active + c.waiting + c.prioritized + c.delayed;
					},
					{ timeout: 60_000, interval: 200 }
				)
				.toBe(0);
		} finally {
			await q.close();
		}
		// and the fleet still answers
		const after = await fleet.post('/api/eval', { input: 'darea l=0.5' });
		expect(after.status).toBe(200);
	}, 300_000);

	it('a worker refuses a job made by another code version', async () => {
		const q = new Queue(queueNames(codeVersion(WORKER_BUNDLE)).light, { connection: { host: '127.0.0.1', port: redisPort } });
		try {
			const job = await q.add('eval', { version: '0123456789abcdef', payload: '' });
			await expect.poll(() => job.getState(), { timeout: 60_000, interval: 200 }).toBe('failed');
			const failed = await q.getJob(job.id!);
			expect(failed?.failedReason).toMatch(
				/^refused: this worker runs code version [0-9a-f]{16}, the job was made by version 0123456789abcdef$/
			);
		} finally {
			await q.close();
		}
	}, 120_000);

	it('a server told to stop lets go of Redis: its fleet connections keep no process alive', async () => {
		// what the web server does at shutdown (fleet/index.ts): start the fleet runner, close it — the process must
		// then end by itself (BullMQ's event readers used to retry on a timer forever after a bare disconnect)
		const script = `
			import { FleetRunner } from './src/lib/server/eval/fleet/runner.ts';
			const r = new FleetRunner({ connection: { host: '127.0.0.1', port: ${redisPort} }, version: 'shutdown-check', chunks: 2, lockMs: 3000 });
			await r.start();
			await r.close();
			console.log('closed');`;
		const child = spawn(process.execPath, ['--import', 'tsx', '--input-type=module', '-e', script], { stdio: ['ignore', 'pipe', 'pipe'] });
		let out = '';
		child.stdout?.on('data', (b) => (out += b));
		child.stderr?.on('data', (b) => (out += b));
		const exited = new Promise<number | null>((r) => child.once('exit', (code) => r(code)));
		try {
			// generous: this is about ending at all, not about how fast
			await expect.poll(() => child.exitCode, { timeout: 60_000, interval: 200, message: out }).not.toBeNull();
			expect(await exited, out).toBe(0);
			expect(out).toContain('closed');
		} finally {
			child.kill('SIGKILL');
		}
	});

	it('falls back to in-process evaluation when Redis is gone, and health says so', async () => {
		redis!.kill('SIGKILL');
		await expect.poll(async () => (await health()).queue, { timeout: 60_000, interval: 250 }).toBe('fallback: redis unreachable');
		expect((await health()).ok).toBe(true);
		const [a, b] = await Promise.all([
			fleet.post('/api/eval', { input: 'darea l=0.45' }),
			local.post('/api/eval', { input: 'darea l=0.45' })
		]);
		expect(a.status, JSON.stringify(a.body)).toBe(200);
		expect(a.body.results).toEqual(b.body.results);
	}, 120_000);
});
