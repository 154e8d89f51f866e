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
			"export { metricCoeffsSymbolic, metricCoeffsNumeric, metricTerms } from './src/lib/holo/metric/coeffs.ts';",
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
// the first call goes the way `coeffs darea o=6 | tex` does: the polynomials and their exact π/B LaTeX
const a = performance.now();
const first = { coeffs: H.metricTerms(H.readMetric({ d: 4, f: text, values: {} }), 6, undefined).terms };
row(
	'coefficients to order 6 with exact π/B LaTeX, two-parameter symbolic metric d=4 (f="1 - m*z^4 + q^2*z^6"), first call in the process',
	{
		median_us: Number(((performance.now() - a) * 1000).toFixed(0)),
		runs: 1
	},
	'≤ 1 s'
);
row(
	'the polynomials only (decimal monomials), each call on a fresh model (no cache)',
	time(symbolic, { runs: 5, ms: 2000, warm: false }),
	'≤ 1 s'
);
console.error(`${first.coeffs.length} symbolic coefficients`);
row(
	'the same with exact π/B LaTeX (coeffs darea o=6, then tex), each call on a fresh model',
	time(() => H.metricTerms(H.readMetric({ d: 4, f: text, values: {} }), 6, undefined), { runs: 3, ms: 2000, warm: false }),
	'≤ 1 s'
);

// numeric: the brane and the same brane as a metric, coefficients cold and the order-6 value at l = 0.5
const brane = H.makeBulk('brane', { d: 4, zh: 1 });
const metric = H.makeBulk('metric', { d: 4, f: '1 - z^4' });
const mixed = H.makeBulk('metric', { d: 4, f: '1 - 1.25*z^4 + 0.25*z^6' });
/** A ratio row: the metric's median over the brane's, both measured just above in this process. */
const ratio = (name, a, b) => {
	const r = { ratio: Number((a.median_us / b.median_us).toFixed(2)), runs: Math.min(a.runs, b.runs) };
	emit({ name, ...r });
	rows.push({ name, median_us: `×${r.ratio}`, runs: r.runs, goal: '≤ ×1' });
};
const braneCold = time(() => {
	H.clearCoeffCache();
	H.seriesValues(brane, 6);
});
row('brane d=4: series coefficients to order 6, cold (cache cleared)', braneCold);
const metricCold = time(() => {
	H.metricCoeffsNumeric(H.readMetric({ d: 4, f: '1 - z^4', values: {} }), 6);
});
row('metric f="1 - z^4": series coefficients to order 6, cold (fresh model: reading f, exact Taylor, series)', metricCold);
const model = H.readMetric({ d: 4, f: '1 - z^4', values: {} });
H.metricCoeffsNumeric(model, 1);
const metricSeriesOnly = time(() => H.metricCoeffsNumeric(H.readMetric({ d: 4, f: '1 - z^4', values: {} }), 1));
row('metric f="1 - z^4": the same to order 1 (reading f and its Taylor coefficients: the fixed part of the cold cost)', metricSeriesOnly);
const braneEval = time(() => H.deltaAreaSeries(brane, 0.5, 6), { runs: 2000 });
row('brane d=4: ΔA order 6 at l=0.5 (coefficients cached)', braneEval);
const metricEval = time(() => H.deltaAreaSeries(metric, 0.5, 6), { runs: 2000 });
row('metric f="1 - z^4": ΔA order 6 at l=0.5 (coefficients cached)', metricEval);
ratio('ratio metric/brane: ΔA order 6 at l=0.5, cached (same run)', metricEval, braneEval);
// mixed powers use the charged brane's evaluation (one Math.pow per term): compared with the charged brane
const charged = H.makeBulk('charged', { d: 4, zh: 1, q: 0.5 });
const chargedEval = time(() => H.deltaAreaSeries(charged, 0.5, 6), { runs: 2000 });
row('charged d=4 q=0.5: ΔA order 6 at l=0.5 (coefficients cached)', chargedEval);
const mixedEval = time(() => H.deltaAreaSeries(mixed, 0.5, 6), { runs: 2000 });
row('metric f="1 - 1.25*z^4 + 0.25*z^6" (the same charged brane, mixed powers): ΔA order 6 at l=0.5 (coefficients cached)', mixedEval);
ratio('ratio mixed-power metric/charged: ΔA order 6 at l=0.5, cached (same run)', mixedEval, chargedEval);
row(
	'metric f="1 - z^4*exp(-z^2)" (numeric Taylor): coefficients to order 6, cold',
	time(() => {
		H.metricCoeffsNumeric(H.readMetric({ d: 4, f: '1 - z^4*exp(-z^2)', values: {} }), 6);
	})
);
const braneExact = time(() => H.deltaArea(brane, 5), { runs: 500 });
row('brane d=4: exact ΔA at l=5 (near the horizon)', braneExact);
const metricExact = time(() => H.deltaArea(metric, 5), { runs: 500 });
row('metric f="1 - z^4": exact ΔA at l=5 (near the horizon)', metricExact);
ratio('ratio metric/brane: exact ΔA at l=5 (same run)', metricExact, braneExact);

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
