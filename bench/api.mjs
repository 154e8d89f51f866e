// Load on POST /api/eval with an API key (autocannon, loopback): requests/s and latency for a light line,
// then the p99 of light lines while heavy sweeps run. Run after `npm run build`.
import autocannon from 'autocannon';
import { apiKeyFor, startBuiltServer } from './lib/server.mjs';
import { emit, machineLine, writeSection } from './lib/results.mjs';

const DURATION = Number(process.env.BENCH_SECONDS ?? 20);
const server = await startBuiltServer({ BULKPAD_EVAL_BUDGET_MS: '5000' });
try {
	const key = await apiKeyFor(server.baseUrl, 'tomas@sable.test');
	const light = (extra = {}) =>
		autocannon({
			url: `${server.baseUrl}/api/eval`,
			method: 'POST',
			connections: 50,
			duration: DURATION,
			headers: { 'content-type': 'application/json', authorization: `Bearer ${key}` },
			body: JSON.stringify({ input: 'darea l=0.5' }),
			...extra
		});
	await light({ duration: 3 }); // warm the pool and the JIT
	// one client at a time: the latency of a single request, with no queueing behind others
	const single = await light({ connections: 1, duration: Math.min(DURATION, 10) });
	emit({ name: 'eval darea l=0.5, 1 connection', rps: single.requests.average, p50_ms: single.latency.p50, p99_ms: single.latency.p99 });
	const a = await light();
	const base = { rps: a.requests.average, p50_ms: a.latency.p50, p99_ms: a.latency.p99, errors: a.errors, non2xx: a.non2xx };
	emit({ name: 'eval darea l=0.5, 50 connections', ...base });

	// heavy sweeps from another user, back to back, while the light load runs
	let stop = false;
	const heavyKey = await apiKeyFor(server.baseUrl, 'ines@sable.test');
	// exact ball surfaces by shooting: minutes of work, so each one runs until its time budget stops it
	const heavyLine = 'sweep darea ball R=0.1..2:300';
	let heavyRuns = 0;
	const heavyLoop = (async () => {
		while (!stop) {
			await fetch(`${server.baseUrl}/api/eval`, {
				method: 'POST',
				headers: { 'content-type': 'application/json', authorization: `Bearer ${heavyKey}` },
				body: JSON.stringify({ input: heavyLine })
			});
			heavyRuns++;
		}
	})();
	const b = await light();
	stop = true;
	await heavyLoop;
	const loaded = {
		rps: b.requests.average,
		p50_ms: b.latency.p50,
		p99_ms: b.latency.p99,
		errors: b.errors,
		non2xx: b.non2xx,
		heavy_runs: heavyRuns
	};
	emit({ name: 'eval darea l=0.5 during heavy sweeps', ...loaded });

	writeSection(
		'api',
		`## API (\`npm run bench -- api\`)
${machineLine()}; autocannon, 50 connections, ${DURATION} s, \`POST /api/eval {"input":"darea l=0.5"}\` with an API key.

| load | requests/s | p50 ms | p99 ms | errors | non-2xx |
|---|---|---|---|---|---|
| one connection, requests back to back | ${single.requests.average.toFixed(0)} | ${single.latency.p50} | ${single.latency.p99} | ${single.errors} | ${single.non2xx} |
| light lines only | ${base.rps.toFixed(0)} | ${base.p50_ms} | ${base.p99_ms} | ${base.errors} | ${base.non2xx} |
| while \`${heavyLine}\` runs back to back (${heavyRuns} sweeps) | ${loaded.rps.toFixed(0)} | ${loaded.p50_ms} | ${loaded.p99_ms} | ${loaded.errors} | ${loaded.non2xx} |

Goals (issue): p50 < 5 ms, ≥ 1,000 requests/s. With 50 connections the p50 is bounded below by
connections ÷ throughput (Little's law), so the single-connection row is the per-request latency.`
	);
} finally {
	await server.stop();
}
