// Mixed load (isolation issue): 50 connections of light lines from one member (autocannon) while another
// member runs heavy sweeps back to back and 10 anonymous clients replay the demo transcript back to back.
// Light p50/p99 are compared with an idle run of the same light load in the same invocation.
// Run after `npm run build`: `npm run bench -- mixed`.
import autocannon from 'autocannon';
import { loadavg } from 'node:os';
import { sessionFor, startBuiltServer } from './lib/server.mjs';
import { emit, machineLine, writeSection } from './lib/results.mjs';

const DURATION = Number(process.env.BENCH_SECONDS ?? 20);
const LIGHT = 'darea l=0.5';
const HEAVY = 'sweep darea ball R=0.1..2:300';
const HEAVY_CONCURRENCY = 3;
const REPLAYERS = 10;
const SLUG = 'sable-boosted-first-law';

// every bench client comes from 127.0.0.1, so each replayer says who it is in X-Forwarded-For (read through
// adapter-node's ADDRESS_HEADER) and meets the real per-address replay limit as ten separate clients would
const server = await startBuiltServer({ BULKPAD_EVAL_BUDGET_MS: '5000', ADDRESS_HEADER: 'x-forwarded-for' });
try {
	const local = { 'x-forwarded-for': '127.0.0.1' };
	const lightSession = await sessionFor(server.baseUrl, 'tomas@sable.test', undefined, local);
	const heavySession = await sessionFor(server.baseUrl, 'ines@sable.test', undefined, local);
	const light = (duration = DURATION) =>
		autocannon({
			url: `${server.baseUrl}/api/eval`,
			method: 'POST',
			connections: 50,
			duration,
			// a request still unanswered after 30 s counts as an error (autocannon's default is 10 s)
			timeout: 30,
			headers: { 'content-type': 'application/json', ...lightSession, ...local },
			body: JSON.stringify({ input: LIGHT })
		});
	await light(3); // warm the processes and the JIT
	const idle = await light();
	const load0 = loadavg()[0];
	emit({
		name: 'light, idle',
		p50_ms: idle.latency.p50,
		p99_ms: idle.latency.p99,
		rps: idle.requests.average,
		errors: idle.errors,
		non2xx: idle.non2xx
	});

	let stop = false;
	const statuses = { heavy: {}, replay: {} };
	const count = (kind, s) => (statuses[kind][s] = (statuses[kind][s] ?? 0) + 1);
	// a refused client waits as the answer says (Retry-After, else the seconds named in the message), at most
	// 5 s so it keeps asking during the run, instead of hammering the server with refusals
	const loop = async (kind, call) => {
		while (!stop) {
			try {
				const r = await call();
				count(kind, r.status);
				if (r.status === 429) await new Promise((ok) => setTimeout(ok, 1000 * Math.min(5, r.wait ?? 1)));
			} catch {
				count(kind, 'network error');
			}
		}
	};
	const heavyCall = () =>
		fetch(`${server.baseUrl}/api/eval`, {
			method: 'POST',
			headers: { 'content-type': 'application/json', ...heavySession, ...local },
			body: JSON.stringify({ input: HEAVY })
		}).then(async (r) => (await r.arrayBuffer(), r));
	const replayCall = (i) => () =>
		fetch(`${server.baseUrl}/api/t/${SLUG}/replay`, {
			method: 'POST',
			headers: { origin: server.baseUrl, 'content-type': 'application/json', 'x-forwarded-for': `10.0.0.${i + 1}` },
			body: '{}'
		}).then(async (r) => {
			const body = await r.json().catch(() => ({}));
			const named = /try again in (\d+) s/.exec(body?.error?.message ?? '');
			return { status: r.status, wait: Number(r.headers.get('retry-after') ?? named?.[1] ?? 1) };
		});
	const background = [
		...Array.from({ length: HEAVY_CONCURRENCY }, () => loop('heavy', heavyCall)),
		...Array.from({ length: REPLAYERS }, (_, i) => loop('replay', replayCall(i)))
	];
	await new Promise((r) => setTimeout(r, 500)); // let the heavy lines reach their processes
	const mixed = await light();
	const load1 = loadavg()[0];
	stop = true;
	await Promise.all(background);
	emit({
		name: 'light, mixed',
		p50_ms: mixed.latency.p50,
		p99_ms: mixed.latency.p99,
		rps: mixed.requests.average,
		errors: mixed.errors,
		non2xx: mixed.non2xx,
		statuses
	});

	const ratio = mixed.latency.p99 / Math.max(idle.latency.p99, 1);
	const fmt = (o) =>
		Object.entries(o)
			.map(([s, n]) => `${n}× ${s}`)
			.join(', ') || 'none';
	writeSection(
		'mixed',
		`## Mixed load (\`npm run bench -- mixed\`)
${machineLine()}; autocannon, 50 connections, ${DURATION} s of \`POST /api/eval {"input":"${LIGHT}"}\` from one member (signed in),
first alone, then while another member sends \`${HEAVY}\` from ${HEAVY_CONCURRENCY} connections back to back and ${REPLAYERS}
anonymous clients replay the demo transcript back to back. ${machineLine().startsWith('2 ') ? 'Two cores for the server, its two evaluation processes and the load generators. ' : ''}Load average ${load0.toFixed(1)} before, ${load1.toFixed(1)} after the mixed run.

| light lines | requests/s | p50 ms | p99 ms | errors | non-2xx |
|---|---|---|---|---|---|
| idle | ${idle.requests.average.toFixed(0)} | ${idle.latency.p50} | ${idle.latency.p99} | ${idle.errors} | ${idle.non2xx} |
| mixed | ${mixed.requests.average.toFixed(0)} | ${mixed.latency.p50} | ${mixed.latency.p99} | ${mixed.errors} | ${mixed.non2xx} |

A request unanswered after 30 s would count as an error. Light p99 under mixed load / idle p99: **×${ratio.toFixed(2)}** (goal ≤ ×3, zero errors and zero 5xx).
Heavy answers: ${fmt(statuses.heavy)} (422 = stopped at its own 5 s budget; one heavy line per member runs at a time).
Replay answers: ${fmt(statuses.replay)} (each client at the default limit of ${process.env.BULKPAD_REPLAY_PER_MINUTE ?? 20} replays a minute per address, then 429, after
which it waits as told, at most 5 s, before asking again;
an unchanged transcript reuses its last fresh run; clients replaying at once share one run).`
	);
} finally {
	await server.stop();
}
