#!/usr/bin/env node
// Engine benchmarks: bundles src/lib/holo with esbuild (already in node_modules via vite), times the hot paths,
// prints one JSON line per benchmark and updates the "engine" section of bench/RESULTS.md.
import { build } from 'esbuild';
import { execFileSync, fork } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { writeSection } from './lib/results.mjs';
import { bench, loadEngine } from './lib/engine.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const tmp = mkdtempSync(join(tmpdir(), 'bulkpad-bench-'));

/** The engine of the tree at `dir`, with the cache resets and the packed LaTeX table's reader the benches use. */
function loadBenchEngine(dir, name) {
	// the packed LaTeX table's reader, where the tree has it (a base ref may predate it)
	const packed = existsSync(join(dir, 'src/lib/holo/series/boosted-latex.ts'))
		? ` export { clearBoostedLatex, unpackBoostedRow } from './src/lib/holo/series/boosted-latex.ts';`
		: '';
	return loadEngine(
		dir,
		name,
		` export { clearCoeffCache } from './src/lib/holo/series/coeffs.ts'; export { clearExactCache } from './src/lib/holo/series/exact-latex.ts';${packed}`
	);
}

const H = await loadBenchEngine(root, 'holo');

// BULKPAD_BENCH_BASE=<git ref> also bundles src/lib/holo as it is at that ref and times the exact ΔA rows of both
// engines in alternating rounds of the same run, so a refactor is judged against its base on the same load.
const baseRef = process.env.BULKPAD_BENCH_BASE;
let Base = null;
if (baseRef) {
	const baseDir = join(tmp, 'base');
	mkdirSync(baseDir);
	const tar = execFileSync('git', ['-C', root, 'archive', baseRef, 'src/lib/holo'], { maxBuffer: 1 << 28 });
	execFileSync('tar', ['-x', '-C', baseDir], { input: tar });
	Base = await loadBenchEngine(baseDir, 'base');
}

const brane = H.makeBulk('brane', { d: 4, zh: 1 });
const boosted = H.makeBulk('boosted', { d: 4, zh: 1, v: 0.6 });
const results = [];
results.push(bench('exact ΔA brane d=4 l=0.5 zh=1 (1e-10)', () => H.deltaArea(brane, 0.5), { minRuns: 2000 }));
results.push(bench('exact ΔA boosted d=4 v=0.6 l=0.5', () => H.deltaArea(boosted, 0.5), { minRuns: 2000 }));
results.push(bench('exact ΔA brane d=4 l=5 (near horizon)', () => H.deltaArea(brane, 5), { minRuns: 500 }));
const ls = Array.from({ length: 200 }, (_, i) => 0.05 + (1.15 * i) / 199);
results.push(
	bench('sweep 200 points, orders 1,2,3,exact (boosted d=4)', () => {
		for (const l of ls) {
			for (const n of [1, 2, 3]) H.deltaAreaSeries(boosted, l, n);
			H.deltaArea(boosted, l);
		}
	})
);
results.push(
	bench('coefficients a_k(κ) to order 12, cold (d=4)', () => {
		H.clearCoeffCache();
		H.boostedCoeffPolys(4, 12);
	})
);
const branes = [3, 6, 10].map((d) => H.makeBulk('brane', { d, zh: 1 }));
results.push(
	bench(
		'exact LaTeX a_1..a_12, cold (brane d=3, 6, 10)',
		() => {
			H.clearExactCache();
			for (const b of branes) H.seriesCoeffs(b, 12);
		},
		{ minRuns: 3, minMs: 0 }
	)
);
const boosts = [3, 6, 10].map((d) => H.makeBulk('boosted', { d, zh: 1, v: 0.6 }));
results.push(
	bench(
		'exact LaTeX a_1..a_12(κ), cold (boosted d=3, 6, 10)',
		() => {
			H.clearExactCache();
			for (const b of boosts) H.seriesCoeffs(b, 12);
		},
		{ minRuns: 3, minMs: 0 }
	)
);
results.push({
	...bench(
		'exact LaTeX a_1..a_12(κ), cold, one bulk (boosted d=4; table row unpacked on first use)',
		() => {
			H.clearExactCache();
			H.clearCoeffCache();
			H.clearBoostedLatex();
			H.seriesCoeffs(boosted, 12);
		},
		{ minRuns: 3, minMs: 0 }
	),
	goal: '≤ 100 ms'
});

// what the boosted LaTeX table costs every evaluation process at its start: the bundle of scripts/build-worker.mjs
// forked until it says 'ready', built three ways and forked in alternating rounds of the same run — with the table
// packed (as shipped), with it as the object literal of 4 MB it used to be, and without it (the floor)
const forkRows = await forkToReady();
results.push(...forkRows);

async function forkToReady() {
	const file = join(root, 'src/lib/holo/series/boosted-latex.json');
	const packedTable = JSON.parse(readFileSync(file, 'utf8'));
	const unpacked = Object.fromEntries(Object.entries(packedTable).map(([d, row]) => [d, H.unpackBoostedRow(Number(d), row)]));
	const variants = { packed: null, 'object literal (before)': JSON.stringify(unpacked), 'no table': '{}' };
	const bundles = {};
	for (const [name, contents] of Object.entries(variants)) {
		const outfile = join(tmp, `eval-${name.replace(/\W+/g, '-')}.mjs`);
		await build({
			entryPoints: [join(root, 'src/lib/server/eval/child.ts')],
			outfile,
			bundle: true,
			platform: 'node',
			format: 'esm',
			target: 'node20',
			logLevel: 'error',
			banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" },
			plugins:
				contents === null
					? []
					: [{ name: 'table', setup: (b) => b.onLoad({ filter: /boosted-latex\.json$/ }, () => ({ contents, loader: 'json' })) }]
		});
		bundles[name] = { outfile, mb: (readFileSync(outfile).length / 1e6).toFixed(1), times: [] };
	}
	// wall time to 'ready', and the process's own CPU time then (Linux /proc; steadier than wall time under load)
	const cpuMs = (pid) => {
		try {
			const f = readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1].split(' ');
			return ((Number(f[11]) + Number(f[12])) * 1000) / 100; // utime + stime, in clock ticks of 10 ms
		} catch {
			return NaN;
		}
	};
	const forkOnce = (outfile) =>
		new Promise((resolve, reject) => {
			const t0 = performance.now();
			const c = fork(outfile, [], { stdio: 'ignore', env: { ...process.env, BULKPAD_EVAL_WARMUP: '0' } });
			c.on('error', reject);
			c.on('message', (m) => {
				if (m?.type !== 'ready') return;
				resolve({ wall: (performance.now() - t0) * 1000, cpu: cpuMs(c.pid) });
				c.disconnect();
			});
		});
	const ROUNDS_FORK = Number(process.env.BULKPAD_BENCH_FORKS ?? 7);
	const names = Object.keys(bundles);
	for (let k = 0; k < ROUNDS_FORK; k++)
		for (const n of k % 2 ? [...names].reverse() : names) bundles[n].times.push(await forkOnce(bundles[n].outfile));
	const med = (xs) => [...xs].sort((a, b) => a - b)[xs.length >> 1];
	const wall = (n) => med(bundles[n].times.map((t) => t.wall));
	const cpu = (n) => med(bundles[n].times.map((t) => t.cpu));
	return names.map((n) => {
		const r = {
			name: `evaluation process fork-to-ready, boosted table ${n} (bundle ${bundles[n].mb} MB; its CPU ${cpu(n)} ms)`,
			median_us: Number(wall(n).toFixed(0)),
			runs: ROUNDS_FORK,
			goal:
				n === 'no table'
					? ''
					: `table's share: ${((wall(n) - wall('no table')) / 1000).toFixed(0)} ms wall, ${(cpu(n) - cpu('no table')).toFixed(0)} ms CPU`
		};
		console.log(JSON.stringify(r));
		return r;
	});
}

// exact balls (ball-shot.ts): one answer, and a sweep continued from point to point
results.push({ ...bench('exact ball ΔA brane d=4 R=1', () => H.ballDeltaArea(4, 1, 1), { minRuns: 50 }), goal: '≤ 5 ms' });
const Rs = Array.from({ length: 200 }, (_, i) => 0.1 + (1.9 * i) / 199);
results.push({
	...bench('exact ball sweep 200 points R=0.1..2 (brane d=4)', () => H.ballDeltaAreaSweep(4, Rs, 1), { minRuns: 3, minMs: 0 }),
	goal: '≤ 0.5 s'
});
const ballRow = results.at(-2);
let scipyBall = null;
try {
	execFileSync('python3', ['-c', 'import scipy'], { stdio: 'ignore' });
	const [us, v] = execFileSync('python3', [join(root, 'bench/ball_scipy.py'), '4', '1', '1'], { encoding: 'utf8', timeout: 300000 })
		.trim()
		.split(' ');
	scipyBall = { us: Number(us), value: Number(v.replace(/[^0-9.e+-]/g, '')) };
	const rel = Math.abs(scipyBall.value / H.ballDeltaArea(4, 1, 1).value - 1);
	const r = {
		name: `scipy exact ball ΔA brane d=4 R=1 (solve_ivp DOP853 + brentq, bench/ball_scipy.py; agrees to ${rel.toExponential(1)})`,
		median_us: Number(scipyBall.us.toFixed(0)),
		runs: 1,
		goal: `engine ≥ 20× faster: ×${(scipyBall.us / ballRow.median_us).toFixed(0)}`
	};
	console.log(JSON.stringify(r));
	results.push(r);
} catch (e) {
	const r = { name: 'scipy exact ball comparison skipped: python3 with scipy is not available here', median_us: '—', runs: 0, goal: '' };
	console.error(r.name, e.message.split('\n')[0]);
	results.push(r);
}

// the quench (holo/vaidya): one HRT ΔA(t) point from cold (the family curve of that width is built), and growth
// sweeps at one width (the curve is built once and every time reuses it), as `sweep darea l=2 t=0..3:N` runs them
const quench = (n) => {
	H.clearQuenchCache();
	for (let i = 0; i < n; i++) H.hrtDeltaArea(3, 1, 2, (3 * i) / (n - 1));
};
for (const [name, fn, goal, opts] of [
	['quench ΔA(t) one point, cold (d=3 l=2 t=1)', () => (H.clearQuenchCache(), H.hrtDeltaArea(3, 1, 2, 1)), '≤ 2 ms', { minRuns: 10 }],
	['quench ΔA(t) one point, cold (d=4 l=4 t=2)', () => (H.clearQuenchCache(), H.hrtDeltaArea(4, 1, 4, 2)), '≤ 2 ms', { minRuns: 10 }],
	['quench growth sweep 60 points, cold (d=3 l=2 t=0..3)', () => quench(60), '≤ 150 ms', { minRuns: 5 }],
	['quench growth sweep 200 points, cold (d=3 l=2 t=0..3)', () => quench(200), 'inside the time budget', { minRuns: 3, minMs: 0 }]
]) {
	results.push({ ...bench(name, fn, opts), goal });
}
let quenchRunner = null;
try {
	quenchRunner = JSON.parse(readFileSync(join(root, 'tests/fixtures/holo/vaidya.json'), 'utf8')).secondsPerPoint;
} catch {
	// the fixture is not there (not generated yet)
}

/**
 * Base against current for the exact ΔA rows: ROUNDS alternating rounds (base first in even rounds, current first
 * in odd ones, so neither always gets the warmer machine), each a full `bench`; the figure is the median of
 * the rounds' medians.
 */
const ROUNDS = 7;
const compared = [];
if (Base) {
	const exact = [
		[
			'exact ΔA brane d=4 l=0.5 zh=1',
			(E) =>
				(
					(b) => () =>
						E.deltaArea(b, 0.5)
				)(E.makeBulk('brane', { d: 4, zh: 1 }))
		],
		[
			'exact ΔA boosted d=4 v=0.6 l=0.5',
			(E) =>
				(
					(b) => () =>
						E.deltaArea(b, 0.5)
				)(E.makeBulk('boosted', { d: 4, zh: 1, v: 0.6 }))
		],
		[
			'exact ΔA brane d=4 l=5 (near horizon)',
			(E) =>
				(
					(b) => () =>
						E.deltaArea(b, 5)
				)(E.makeBulk('brane', { d: 4, zh: 1 }))
		]
	];
	const median = (xs) => [...xs].sort((a, b) => a - b)[xs.length >> 1];
	for (const [name, make] of exact) {
		const fns = { base: make(Base), current: make(H) };
		const runs = { base: [], current: [] };
		for (let k = 0; k < ROUNDS; k++) {
			for (const which of k % 2 ? ['current', 'base'] : ['base', 'current']) {
				runs[which].push(bench(name, fns[which], { minRuns: 2000, quiet: true }).median_us);
			}
		}
		const r = { name, base_us: median(runs.base), current_us: median(runs.current) };
		console.log(JSON.stringify({ ...r, base: baseRef }));
		compared.push(r);
	}
}

// the same exact computation with mpmath (15 digits), for the ratio
let py = null;
const runner = join(root, 'tests/fixtures/holo');
try {
	const code = `
import sys, time; sys.path.insert(0, ${JSON.stringify(runner)})
import mpmath as mp, runner
mp.mp.dps = 15
def dA(l):
    def w(x):
        eta = 1/(1+mp.exp(x)); return mp.log(runner.strip('brane', 4, 1-eta, eta)[0]) - mp.log(l)
    x = mp.findroot(w, 0.0, solver='secant', tol=1e-20)
    eta = 1/(1+mp.exp(x)); wd, A = runner.strip('brane', 4, 1-eta, eta)
    return A - runner.vac_area(4, mp.mpf(l))
runner.strip.__globals__['mp'].mp.dps = 15
t = time.perf_counter(); n = 0
while time.perf_counter() - t < 3 or n < 2:
    v = dA(0.5); n += 1
print((time.perf_counter() - t) / n * 1e6, v)
`;
	const [us] = execFileSync('python3', ['-c', code], { encoding: 'utf8', timeout: 120000 }).trim().split(' ');
	py = Number(us);
	const r = { name: 'mpmath exact ΔA brane d=4 l=0.5 (dps 15, tanh-sinh + secant)', median_us: Number(py.toFixed(0)), runs: 1 };
	console.log(JSON.stringify(r));
	results.push(r);
} catch (e) {
	console.error('python/mpmath comparison skipped:', e.message.split('\n')[0]);
}

const ratio = py ? py / results[0].median_us : null;
const lines = [
	'## engine (src/lib/holo)',
	'',
	`Node ${process.version}, ${new Date().toISOString().slice(0, 10)}. Median of repeated runs after warm-up. Load average when measured: ${loadavg()[0].toFixed(1)} (other work on the machine slows the times).`,
	'',
	'| benchmark | median (µs) | runs | goal |',
	'|---|---|---|---|',
	...results.map(
		(r, i) =>
			`| ${r.name} | ${r.median_us} | ${r.runs} | ${r.goal ?? ['< 20 µs', '', '', '< 10 ms', '< 10 ms', '< 1 s each', '< 1 s each', ''][i] ?? ''} |`
	),
	'',
	ratio ? `mpmath / engine for one exact ΔA: ×${ratio.toFixed(0)}` : 'mpmath comparison not run',
	quenchRunner
		? `mpmath quench runner (tests/fixtures/holo/vaidya_runner.py, 24 digits, all surfaces from scratch): ${quenchRunner} s per (l, t) point`
		: 'mpmath quench runner time: fixture not generated',
	...(compared.length
		? [
				'',
				`Against \`${baseRef}\` in the same run (BULKPAD_BENCH_BASE; median of ${ROUNDS} alternating rounds, µs):`,
				'',
				'| benchmark | base | current |',
				'|---|---|---|',
				...compared.map((r) => `| ${r.name} | ${r.base_us} | ${r.current_us} |`)
			]
		: [])
];
writeSection('engine', lines.join('\n'));
