/**
 * One line of help and one example for every verb, bulk, key, sink and statement, for the palette and the
 * console's `?` hints. Verbs bring their own (method, accuracy, source and examples too) from the registry;
 * the rest is plain data here. No heavy dependency, so the browser bundle stays small.
 */
import { verbSpecs, type VerbHelp } from './verbs/index';

export interface HelpEntry {
	name: string;
	kind: 'statement' | 'verb' | 'bulk' | 'key' | 'sink';
	summary: string;
	example: string;
	/** verbs: how it is computed, how far to trust it, where it is published, more examples */
	detail?: Omit<VerbHelp, 'summary'> & { forms: string[] };
}

const E = (kind: HelpEntry['kind'], name: string, summary: string, example: string): HelpEntry => ({ kind, name, summary, example });

const ENTRIES: HelpEntry[] = [
	E('statement', 'use', "set the pad's bulk (keys left out take their defaults)", 'use boosted d=4 zh=1 v=0.6'),
	E('statement', 'units', 'how entropy is reported: geo (G=…), cft (c=…, d=2) or sym (N=…, d=4)', 'units sym N=3'),
	E('statement', 'let', 'keep a result or a number under a name', 'let a0 = darea l=0.4'),
	E('statement', 'sweep', 'run a verb over a range or list: a table and a plot', 'sweep darea l=0.05..1.2:80 o=1,2,3,exact'),
	E('statement', 'compare', "a dataset's column against the engine point by point", 'compare mydata darea o=exact'),
	E(
		'statement',
		'plot',
		"overlay earlier steps' curves on one figure (xlabel=, ylabel= optional); `| plot` after a line plots that line",
		'plot #2 #3'
	),
	E('statement', 'help', 'what a verb, bulk, key, sink or statement does; also ?word', 'help darea'),
	E('statement', '@macro', 'run an approved macro from the library', '@standard_brane d=5'),
	E('statement', 'arithmetic', 'numbers, names, #n and #n.field with + - * / ^', '#3 / #2'),
	E('bulk', 'vacuum', 'pure AdS_{d+1}', 'use vacuum d=3'),
	E('bulk', 'brane', 'planar AdS black brane (the default: d=4 zh=1)', 'use brane d=4 zh=1'),
	E('bulk', 'boosted', 'black brane boosted along y; give v or rapidity', 'use boosted d=4 v=0.6'),
	E('bulk', 'charged', 'planar Reissner–Nordström–AdS brane (q ≠ 0 needs d ≥ 3)', 'use charged d=4 q=0.5'),
	E('bulk', 'dp', 'near-horizon non-conformal black Dp-brane', 'use dp p=4 zh=1'),
	E('bulk', 'wave', 'AdS plane wave (zero temperature)', 'use wave d=4 zp=1'),
	E('bulk', 'soliton', 'AdS soliton: strips show a transition; answers say their phase (RT by default, phase=…)', 'use soliton d=4 z0=1'),
	E('bulk', 'metric', 'custom static metric from f(z), g(z), h(z): strip, series, stress, thermo', 'use metric d=4 f="1 - (z/zh)^4" zh=1'),
	E(
		'bulk',
		'vaidya',
		'global quench: AdS until t=0, then a thin shell makes the brane (d ≤ 6); strip verbs take t=',
		'use vaidya d=3 zh=1'
	),
	E('key', 'l', 'strip width (a number, range a..b:N or list)', 'darea l=0.05..1.5:120'),
	E('key', 'R', 'ball radius', 'darea ball R=0.5'),
	E('key', 'gap', 'gap between the two strips of a pair', 'mi pair l=1 gap=0.3'),
	E('key', 'o', 'order: a whole number ≤ 12 or exact (default exact); also written order=', 'darea l=0.3 o=1,2,exact'),
	E('key', 'd', 'boundary spacetime dimension, 2 ≤ d ≤ 10', 'darea l=0.2 d=5'),
	E('key', 'zh', 'horizon depth', 'darea l=0.4 zh=2'),
	E('key', 'v', 'boost velocity, |v| < 1', 'use boosted v=0.6'),
	E('key', 'rapidity', 'boost rapidity (instead of v)', 'use boosted rapidity=0.7'),
	E('key', 'q', 'charge of the charged brane', 'use charged q=0.5'),
	E('key', 'p', 'the p of a Dp-brane', 'use dp p=4'),
	E('key', 'zp', 'scale of the plane wave', 'use wave zp=2'),
	E('key', 't', 'boundary time since the quench (vaidya; t ≤ 0 is before it)', 'sweep darea l=2 t=0..3:60'),
	E('key', 'z0', 'tip of the soliton', 'use soliton z0=1'),
	E(
		'key',
		'along',
		"a metric's first law along its named parameters: the first carries the energy, the rest are held as charges (mu gives the second's μ)",
		'use metric d=4 f="1 - m*z^4 + q^2*z^6" m=1.2 q=0.4; firstlaw l=0.3 o=2 along=m,q'
	),
	E('key', 'of', 'which chemical potential mu gives: charge or momentum', 'mu l=0.5 of=charge'),
	E('key', 'phase', 'soliton surface: rt (the minimal one, default), connected or disconnected', 'zstar l=0.65 phase=connected'),
	E('key', 'tol', 'tolerance (validity, firstlaw, compare)', 'validity o=3 tol=1e-4'),
	E('key', 'G', "Newton's constant for this line", 'entropy l=0.4 G=0.5'),
	E('key', 'f', 'custom metric: g_zz = 1/(z² f)', 'use metric f="1 - (z/zh)^4" zh=1'),
	E('key', 'h', 'custom metric: g_yy = h/z²', 'use metric f="1" h="1 + (z/zp)^4" zp=1'),
	E('key', 'g', 'custom metric: g_tt = −g/z² (default g = f)', 'use metric f="1 - z^4" g="1 - z^4"'),
	E('key', 'params', 'custom metric: parameters kept symbolic in coeffs (free names are too)', 'use metric f="1 - m*z^4" params="m" m=1'),
	E('sink', 'table', 'show the result as a table', 'darea l=0.4 | table'),
	E('sink', 'plot', 'plot the result (sweeps plot by default)', 'darea l=0.1..1 o=2,exact | plot'),
	E('sink', 'tex', 'add the LaTeX of the result', 'coeffs darea o=4 | tex'),
	E('sink', 'csv', 'offer the result as a CSV download', 'sweep darea l=0.1..1 | csv')
];

/** Verbs' entries, read from the registry at call time (a verb registered later appears too). */
function verbEntries(): HelpEntry[] {
	return verbSpecs().map((v) => ({
		kind: 'verb',
		name: v.name,
		summary: v.help.summary,
		example: v.help.examples[0] ?? v.name,
		detail: {
			method: v.help.method,
			accuracy: v.help.accuracy,
			source: v.help.source,
			examples: v.help.examples,
			forms: Object.entries(v.forms).map(([shape, f]) => [v.name, shape, ...f.keys.map((k) => `${k}=…`)].filter(Boolean).join(' '))
		}
	}));
}

function allEntries(): HelpEntry[] {
	const i = ENTRIES.findIndex((e) => e.kind !== 'statement');
	return [...ENTRIES.slice(0, i), ...verbEntries(), ...ENTRIES.slice(i)];
}

export function helpEntries(kind?: HelpEntry['kind']): readonly HelpEntry[] {
	if (kind === 'verb') return verbEntries();
	return kind ? ENTRIES.filter((e) => e.kind === kind) : allEntries();
}

/** The entry for a word; a bulk and a key can share a name (none do today), statements and verbs win. */
export function help(name: string): HelpEntry | undefined {
	const n = name.startsWith('@') ? '@macro' : name === 'order' ? 'o' : name;
	return (
		ENTRIES.find((e) => e.kind === 'statement' && e.name === n) ??
		verbEntries().find((e) => e.name === n) ??
		ENTRIES.find((e) => e.name === n)
	);
}
