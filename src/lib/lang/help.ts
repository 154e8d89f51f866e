/**
 * One line of help and one example for every verb, bulk, key, sink and statement, for the palette and the
 * console's `?` hints. Plain data with no dependency, so the browser bundle stays small.
 */
export interface HelpEntry {
	name: string;
	kind: 'statement' | 'verb' | 'bulk' | 'key' | 'sink';
	summary: string;
	example: string;
}

const E = (kind: HelpEntry['kind'], name: string, summary: string, example: string): HelpEntry => ({ kind, name, summary, example });

const ENTRIES: HelpEntry[] = [
	E('statement', 'use', "set the pad's bulk (keys left out take their defaults)", 'use boosted d=4 zh=1 v=0.6'),
	E('statement', 'units', 'how entropy is reported: geo (G=…), cft (c=…, d=2) or sym (N=…, d=4)', 'units sym N=3'),
	E('statement', 'let', 'keep a result or a number under a name', 'let a0 = darea l=0.4'),
	E('statement', 'sweep', 'run a verb over a range or list: a table and a plot', 'sweep darea l=0.05..1.2:80 o=1,2,3,exact'),
	E('statement', 'compare', "a dataset's column against the engine point by point", 'compare mydata darea o=exact'),
	E('statement', '@macro', 'run an approved macro from the library', '@standard_brane d=5'),
	E('statement', 'arithmetic', 'numbers, names, #n and #n.field with + - * / ^', '#3 / #2'),
	E('verb', 'zstar', 'turning point z* of the RT surface for width l', 'zstar l=0.8'),
	E('verb', 'width', 'width l of the strip whose turning point is zstar', 'width zstar=0.5'),
	E('verb', 'area', 'finite part of the RT area, A_fin', 'area l=0.4'),
	E('verb', 'darea', 'ΔA = A_fin(bulk) − A_fin(vacuum) at the same width', 'darea l=0.4 o=1,2,3,exact'),
	E(
		'verb',
		'entropy',
		"finite part S_fin = A_fin/(4G) in the pad's units: the area-law term 2/((d−2)ε^{d−2}) (d = 2: 2 ln(1/ε)) per unit transverse volume is subtracted, cutoff z ≥ ε, minimal subtraction (no finite term removed)",
		'entropy l=0.4'
	),
	E('verb', 'dentropy', 'ΔS = ΔA/(4G): cutoff-independent, no scheme', 'dentropy l=0.4 o=2'),
	E('verb', 'energy', 'ΔE (and ΔP_y when boosted) in the strip, from the stress tensor', 'energy l=0.4'),
	E(
		'verb',
		'tent',
		'entanglement temperature 1/α of δΔS = α δΔE + ζ δΔX at order n (order 1: c_d/l); X = P_y (boosted), Q (charged); large l: T_H (T/γ when boosted)',
		'tent l=0.4 o=3'
	),
	E(
		'verb',
		'mu',
		'chemical potential −ζ/α of the first law, of=momentum (ΔP_y = l T^{ty}, boosted/wave) or of=charge (μ_Q, charged; normalised by the action (R + d(d−1) − F²)/16πG, μ = √((d−1)/(2(d−2))) q/zh). Its small-l sign and size are a convention of that split (μ < 0 and |μ| > 1 happen); the large-l limit is thermodynamic: μ → v, μ_Q → μ',
		'mu l=0.4 o=3 of=momentum'
	),
	E(
		'verb',
		'firstlaw',
		'checks T_ent δΔS = δΔE − μ δΔX at order n (X = P_y or Q) in each parameter direction; each side and the residual',
		'firstlaw l=0.4 o=3'
	),
	E('verb', 'stress', '⟨T_μν⟩ from the Fefferman–Graham expansion: tt, ty, xx, yy', 'stress'),
	E('verb', 'thermo', 'temperature, entropy density, energy density, pressure: T, s, e, p', 'thermo'),
	E('verb', 'coeffs', 'closed-form series coefficients of ΔA up to order n', 'coeffs darea o=4 | tex'),
	E(
		'verb',
		'validity',
		'largest l where order n stays within tol of exact, and the radius of convergence ± its uncertainty (Domb–Sykes)',
		'validity o=3 tol=1e-3'
	),
	E('verb', 'mi', 'mutual information of a pair of strips and the critical gap', 'mi pair l=1 gap=0.3'),
	E(
		'verb',
		'resum',
		'Padé-resummed series at l ± an error estimate (neighbouring approximants), warned when unreliable, with the exact value beside it',
		'resum l=0.8 o=6'
	),
	E('verb', 'phases', 'soliton: critical width l_c, largest connected width l_max, the jump of ∂A/∂l at l_c', 'use soliton d=4; phases'),
	E('bulk', 'vacuum', 'pure AdS_{d+1}', 'use vacuum d=3'),
	E('bulk', 'brane', 'planar AdS black brane (the default: d=4 zh=1)', 'use brane d=4 zh=1'),
	E('bulk', 'boosted', 'black brane boosted along y; give v or rapidity', 'use boosted d=4 v=0.6'),
	E('bulk', 'charged', 'planar Reissner–Nordström–AdS brane (q ≠ 0 needs d ≥ 3)', 'use charged d=4 q=0.5'),
	E('bulk', 'dp', 'near-horizon non-conformal black Dp-brane', 'use dp p=4 zh=1'),
	E('bulk', 'wave', 'AdS plane wave (zero temperature)', 'use wave d=4 zp=1'),
	E('bulk', 'soliton', 'AdS soliton: strips show a transition; answers say their phase (RT by default, phase=…)', 'use soliton d=4 z0=1'),
	E('bulk', 'metric', 'custom static slice from f(z) and h(z)', 'use metric d=4 f="1 - (z/zh)^4" zh=1'),
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
	E('key', 'z0', 'tip of the soliton', 'use soliton z0=1'),
	E('key', 'of', 'which chemical potential mu gives: charge or momentum', 'mu l=0.5 of=charge'),
	E('key', 'phase', 'soliton surface: rt (the minimal one, default), connected or disconnected', 'zstar l=0.65 phase=connected'),
	E('key', 'tol', 'tolerance (validity, firstlaw, compare)', 'validity o=3 tol=1e-4'),
	E('key', 'G', "Newton's constant for this line", 'entropy l=0.4 G=0.5'),
	E('key', 'f', 'custom metric: g_zz = 1/(z² f)', 'use metric f="1 - (z/zh)^4" zh=1'),
	E('key', 'h', 'custom metric: g_yy = h/z²', 'use metric f="1" h="1 + (z/zp)^4" zp=1'),
	E('sink', 'table', 'show the result as a table', 'darea l=0.4 | table'),
	E('sink', 'plot', 'plot the result (sweeps plot by default)', 'darea l=0.1..1 o=2,exact | plot'),
	E('sink', 'tex', 'add the LaTeX of the result', 'coeffs darea o=4 | tex'),
	E('sink', 'csv', 'offer the result as a CSV download', 'sweep darea l=0.1..1 | csv')
];

export function helpEntries(kind?: HelpEntry['kind']): readonly HelpEntry[] {
	return kind ? ENTRIES.filter((e) => e.kind === kind) : ENTRIES;
}

/** The entry for a word; a bulk and a key can share a name (none do today), statements and verbs win. */
export function help(name: string): HelpEntry | undefined {
	const n = name.startsWith('@') ? '@macro' : name === 'order' ? 'o' : name;
	return ENTRIES.find((e) => e.name === n);
}
