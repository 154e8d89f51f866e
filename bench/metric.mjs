#!/usr/bin/env node
// Custom-metric benchmarks (src/lib/holo/metric): symbolic coefficients cold, and the numeric metric series
// against the brane's in the same run. Prints one JSON line per figure and writes the "metric" section of
// bench/RESULTS.md.
import { build } from 'esbuild';
import { mkdtempSync } from 'node:fs';
import { loadavg, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { emit, machineLine, median, writeSection } from './lib/results.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const outfile = join(mkdtempSync(join(tmpdir(), 'bulkpad-bench-metric-')), 'metric.mjs');
await build({
	stdin: {
		contents: [
			"export * from './src/lib/holo/index.ts';",
			"export { readMetric } from './src/lib/holo/metric/model.ts';",
			"export { metricCoeffsSymbolic, metricCoeffsNumeric } from './src/lib/holo/metric/coeffs.ts';",
			"export { clearCoeffCache } from './src/lib/holo/series/coeffs.ts';"
		].join('\n'),
		resolveDir: root,
		loader: 'ts'
	},
	bundle: true,
	format: 'esm',
	platform: 'node',
	outfile,
	logLevel: 'error',
	// nerdamer is CommonJS and calls require()
	banner: { js: "import { createRequire as __cr } from 'node:module'; const require = __cr(import.meta.url);" }
});
const H = await import(pathToFileURL(outfile).href);

/** Median of at least `runs` calls and `ms` milliseconds, µs. */
function time(fn, { runs = 20, ms = 400, warm = true } = {}) {
	if (warm) for (let i = 0; i < 3; i++) fn();
	const xs = [];
	const t0 = performance.now();
	while (xs.length < runs || performance.now() - t0 < ms) {
		const a = performance.now();
		fn();
		xs.push((performance.now() - a) * 1000);
		if (xs.length > 100000) break;
	}
	return { median_us: Number(median(xs).toFixed(2)), runs: xs.length };
}

const rows = [];
const row = (name, r, goal = '') => {
	const fig = { name, ...r };
	emit(fig);
	rows.push({ ...fig, goal });
};

// symbolic: the first call in this process (nerdamer and the series code not yet warmed up), then fresh models
const text = '1 - m*z^4 + q^2*z^6';
const symbolic = () => H.metricCoeffsSymbolic(H.readMetric({ d: 4, f: text, values: {} }), 6);
const a = performance.now();
const first = symbolic();
row(
	'coefficients to order 6, two-parameter symbolic metric d=4 (f="1 - m*z^4 + q^2*z^6"), first call in the process',
	{
		median_us: Number(((performance.now() - a) * 1000).toFixed(0)),
		runs: 1
	},
	'≤ 1 s'
);
row('the same, each call on a fresh model (no cache)', time(symbolic, { runs: 5, ms: 2000, warm: false }), '≤ 1 s');
console.error(`${first.coeffs.length} symbolic coefficients`);

// numeric: the brane and the same brane as a metric, coefficients cold and the order-6 value at l = 0.5
const brane = H.makeBulk('brane', { d: 4, zh: 1 });
const metric = H.makeBulk('metric', { d: 4, f: '1 - z^4' });
row(
	'brane d=4: series coefficients to order 6, cold (cache cleared)',
	time(() => {
		H.clearCoeffCache();
		H.seriesValues(brane, 6);
	})
);
row(
	'metric f="1 - z^4": series coefficients to order 6, cold (fresh model)',
	time(() => {
		H.metricCoeffsNumeric(H.readMetric({ d: 4, f: '1 - z^4', values: {} }), 6);
	})
);
row(
	'brane d=4: ΔA order 6 at l=0.5 (coefficients cached)',
	time(() => H.deltaAreaSeries(brane, 0.5, 6), { runs: 2000 })
);
row(
	'metric f="1 - z^4": ΔA order 6 at l=0.5 (coefficients cached)',
	time(() => H.deltaAreaSeries(metric, 0.5, 6), { runs: 2000 })
);
row(
	'metric f="1 - z^4*exp(-z^2)" (numeric Taylor): coefficients to order 6, cold',
	time(() => {
		H.metricCoeffsNumeric(H.readMetric({ d: 4, f: '1 - z^4*exp(-z^2)', values: {} }), 6);
	})
);
row(
	'brane d=4: exact ΔA at l=5 (near the horizon)',
	time(() => H.deltaArea(brane, 5), { runs: 500 })
);
row(
	'metric f="1 - z^4": exact ΔA at l=5 (near the horizon)',
	time(() => H.deltaArea(metric, 5), { runs: 500 })
);

writeSection(
	'metric',
	[
		'## metric (src/lib/holo/metric)',
		'',
		`${machineLine()}. Load average when measured: ${loadavg()[0].toFixed(1)}. Median µs; the brane and the metric rows ran in the same process.`,
		'',
		'| benchmark | median (µs) | runs | goal |',
		'|---|---|---|---|',
		...rows.map((r) => `| ${r.name} | ${r.median_us} | ${r.runs} | ${r.goal} |`)
	].join('\n')
);
