#!/usr/bin/env node
// Quench benchmarks (src/lib/holo/vaidya): one HRT ΔA(t) point cold (the family curve of its width is built) and
// warm (the curve cached, as every later point of a sweep), growth sweeps at one width as `sweep darea l=… t=…`
// runs them, and the mpmath fixture runner's time per point beside them. Prints one JSON line per benchmark and
// updates the "quench" section of bench/RESULTS.md. `npm run bench -- quench`.
import { readFileSync } from 'node:fs';
import { cpus, loadavg } from 'node:os';
import { join } from 'node:path';
import { writeSection } from './lib/results.mjs';
import { bench as timed, loadEngine, root } from './lib/engine.mjs';

const H = await loadEngine(root, 'quench');
const loadBefore = loadavg()[0];

/** Fewer runs than the engine's rows: a cold quench point is tens of milliseconds. */
const bench = (name, fn, opts = {}) => timed(name, fn, { minRuns: 5, minMs: 300, ...opts });

const sweep = (d, l, T, n) => () => {
	H.clearQuenchCache();
	for (let i = 0; i < n; i++) H.hrtDeltaArea(d, 1, l, (T * i) / (n - 1));
};
/** The mean time of one point of a sweep whose curve is already built (times 0..T, not including the build). */
const warmPoints = (d, l, T, n) => () => {
	for (let i = 0; i < n; i++) H.hrtDeltaArea(d, 1, l, (T * (i + 0.5)) / n);
};

const results = [];
const row = (r, goal, per = 1) => results.push({ ...r, goal, per_point_us: per > 1 ? Math.round(r.median_us / per) : undefined });
row(
	bench('one ΔA(t) point, cold (d=3 l=2 t=1)', () => (H.clearQuenchCache(), H.hrtDeltaArea(3, 1, 2, 1)), { minRuns: 10 }),
	'≤ 2 ms'
);
row(
	bench('one ΔA(t) point, cold (d=4 l=4 t=2)', () => (H.clearQuenchCache(), H.hrtDeltaArea(4, 1, 4, 2)), { minRuns: 3 }),
	'≤ 2 ms'
);
H.curveFor(3, 2);
row(bench('20 ΔA(t) points, curve cached (d=3 l=2 t=0..3)', warmPoints(3, 2, 3, 20)), '', 20);
H.curveFor(4, 4);
row(bench('20 ΔA(t) points, curve cached (d=4 l=4 t=0..4)', warmPoints(4, 4, 4, 20), { minRuns: 3 }), '', 20);
row(bench('growth sweep 60 points, cold (d=3 l=2 t=0..3)', sweep(3, 2, 3, 60)), '≤ 150 ms', 60);
row(bench('growth sweep 60 points, cold (d=4 l=4 t=0..4)', sweep(4, 4, 4, 60), { minRuns: 3 }), '≤ 150 ms', 60);
row(bench('growth sweep 200 points, cold (d=3 l=2 t=0..3)', sweep(3, 2, 3, 200), { minRuns: 3 }), 'inside the time budget', 200);
// wide strips (surfaces that hug the critical surface, holo/vaidya/climb.ts)
row(
	bench('one ΔA(t) point, cold (d=3 l=20 t=8)', () => (H.clearQuenchCache(), H.hrtDeltaArea(3, 1, 20, 8)), { minRuns: 3 }),
	''
);
row(bench('growth sweep 60 points, cold (d=4 l=20 t=0..20)', sweep(4, 20, 20, 60), { minRuns: 3 }), '', 60);
row(
	bench('`growth l=50` record, cold (d=4)', () => (H.clearQuenchCache(), H.analyseGrowth(4, 1, 50)), { minRuns: 3 }),
	'inside the 5 s line budget'
);
// the goal's whole range (widths ≤ 4 zh): one cold point at half the saturation time, per d and width
const WIDTHS = [1, 2, 3, 4];
const matrix = [2, 3, 4].map((d) =>
	WIDTHS.map((l) => {
		const t = 0.5 * H.hrtDeltaArea(d, 1, l, 1).tsat;
		return bench(`cold d=${d} l=${l} t=${t.toFixed(3)}`, () => (H.clearQuenchCache(), H.hrtDeltaArea(d, 1, l, t)), {
			minRuns: 5,
			minMs: 200
		}).median_us;
	})
);
const loadAfter = loadavg()[0];

let runner = null;
try {
	runner = JSON.parse(readFileSync(join(root, 'tests/fixtures/holo/vaidya.json'), 'utf8'));
} catch {
	// the fixture is not generated here
}

const lines = [
	'## quench (src/lib/holo/vaidya, `npm run bench -- quench`)',
	'',
	`Node ${process.version}, ${new Date().toISOString().slice(0, 10)}. Median of repeated runs after warm-up; "cold" clears the family-curve cache first. Load average (1 min) before / after: ${loadBefore.toFixed(1)} / ${loadAfter.toFixed(1)} on ${cpus().length} cores (other work on the machine slows the times).`,
	'',
	'| benchmark | median (µs) | per point (µs) | runs | goal |',
	'|---|---|---|---|---|',
	...results.map((r) => `| ${r.name} | ${r.median_us} | ${r.per_point_us ?? ''} | ${r.runs} | ${r.goal} |`),
	'',
	"One cold ΔA(t) point at t = t_sat/2 (µs, median), across the goal's range (≤ 2 ms at widths ≤ 4 zh):",
	'',
	`| d | ${WIDTHS.map((l) => `l = ${l} zh`).join(' | ')} |`,
	`|---|${WIDTHS.map(() => '---').join('|')}|`,
	...matrix.map((r, i) => `| ${i + 2} | ${r.map((v) => Math.round(v)).join(' | ')} |`),
	'',
	runner
		? `mpmath fixture runner (tests/fixtures/holo/vaidya_runner.py, 24 digits, every surface from scratch): ${runner.secondsPerPoint} s per (l, t) point, mean over ${runner.rows.length} rows`
		: 'mpmath fixture runner: vaidya.json not generated'
];
writeSection('quench', lines.join('\n'));
