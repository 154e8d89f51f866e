/**
 * The console's words with one-line help and an example, for the palette and Tab completion.
 *
 * The language module publishes this as `$lib/lang/help.ts` and `$lib/lang/complete.ts` (mathjs-free, so
 * they can ship to the browser); `words.ts` prefers those. This copy of LANGUAGE.md's tables is the
 * fallback so the console still helps while that module is being finished.
 */
export interface Word {
	name: string;
	help: string;
	example: string;
}

export const FALLBACK_VERBS: Word[] = [
	{ name: 'zstar', help: 'turning point z* of the RT surface for width l', example: 'zstar l=0.4' },
	{ name: 'width', help: 'width l for a turning point zstar=', example: 'width zstar=0.5' },
	{ name: 'area', help: 'finite part of the RT area, A_fin', example: 'area l=0.4 o=exact' },
	{ name: 'darea', help: 'ΔA = A_fin(bulk) − A_fin(vacuum) at the same width', example: 'darea l=0.4 o=1,2,3,exact' },
	{ name: 'entropy', help: 'S = A/(4 G_N) in the pad’s units', example: 'entropy l=0.4' },
	{ name: 'dentropy', help: 'ΔS = ΔA/(4 G_N) in the pad’s units', example: 'dentropy l=0.5' },
	{ name: 'energy', help: 'ΔE of the region from the Fefferman–Graham stress tensor', example: 'energy l=0.4' },
	{ name: 'tent', help: 'entanglement temperature at order n', example: 'tent l=0.4 o=3' },
	{ name: 'mu', help: 'chemical potential conjugate to the momentum along y', example: 'mu l=0.4 o=3' },
	{ name: 'firstlaw', help: 'checks the first-law relation at order n, with the residual', example: 'firstlaw l=0.4 o=3' },
	{ name: 'stress', help: '⟨T_μν⟩ from the Fefferman–Graham expansion', example: 'stress' },
	{ name: 'thermo', help: 'temperature, entropy, energy density and pressures of the bulk', example: 'thermo' },
	{ name: 'coeffs', help: 'closed-form series coefficients up to order n', example: 'coeffs darea o=4 | tex' },
	{ name: 'validity', help: 'largest l where the order-n series is within tol of exact', example: 'validity darea o=2 tol=1e-3' },
	{ name: 'mi', help: 'mutual information of a pair of strips and the critical gap', example: 'mi pair l=1 gap=0.3' },
	{ name: 'resum', help: 'Padé-resummed series at l, with the exact value beside it', example: 'resum l=1.5 o=6' },
	{ name: 'sweep', help: 'a verb over a range or list → table and plot', example: 'sweep darea l=0.05..1.2:80 o=1,2,3,exact' },
	{ name: 'compare', help: 'a dataset against the engine point by point', example: 'compare lattice_d4 darea' },
	{ name: 'units', help: 'how entropy is reported: geo, cft c=…, sym N=…', example: 'units cft c=24' },
	{ name: 'let', help: 'keep a result under a name', example: 'let a = darea l=0.4' },
	{ name: 'use', help: 'set the pad’s bulk', example: 'use boosted d=4 zh=1 v=0.6' }
];

export const FALLBACK_BULKS: Word[] = [
	{ name: 'vacuum', help: 'pure AdS_{d+1}', example: 'use vacuum d=4' },
	{ name: 'brane', help: 'planar AdS black brane', example: 'use brane d=4 zh=1' },
	{ name: 'boosted', help: 'black brane boosted along y', example: 'use boosted d=4 zh=1 v=0.6' },
	{ name: 'charged', help: 'planar Reissner–Nordström–AdS brane', example: 'use charged d=4 zh=1 q=0.5' },
	{ name: 'dp', help: 'near-horizon non-conformal black Dp-brane', example: 'use dp p=4 zh=1' },
	{ name: 'wave', help: 'AdS plane wave', example: 'use wave d=4 zp=1' },
	{ name: 'soliton', help: 'AdS soliton (a circle caps off)', example: 'use soliton d=4 z0=1' },
	{ name: 'metric', help: 'custom static slice with f(z), h(z)', example: 'use metric d=4 f="1 - (z/zh)^4" h="1" zh=1' }
];

export const FALLBACK_KEYS: Word[] = [
	{ name: 'l', help: 'strip width (a number, list a,b or range a..b:n)', example: 'l=0.4' },
	{ name: 'R', help: 'ball radius', example: 'R=0.5' },
	{ name: 'gap', help: 'gap between the two strips of a pair', example: 'gap=0.3' },
	{ name: 'o', help: 'order: integer ≥ 0, exact, or a list', example: 'o=1,2,3,exact' },
	{ name: 'zstar', help: 'turning point', example: 'zstar=0.5' },
	{ name: 'tol', help: 'tolerance for validity', example: 'tol=1e-3' },
	{ name: 'G', help: 'Newton’s constant (units geo)', example: 'G=1' },
	{ name: 'd', help: 'boundary dimension', example: 'd=4' },
	{ name: 'zh', help: 'horizon depth', example: 'zh=1' },
	{ name: 'v', help: 'boost velocity, |v| < 1', example: 'v=0.6' },
	{ name: 'rapidity', help: 'boost rapidity (instead of v)', example: 'rapidity=0.7' },
	{ name: 'q', help: 'charge', example: 'q=0.5' },
	{ name: 'p', help: 'Dp-brane p', example: 'p=4' },
	{ name: 'zp', help: 'plane-wave scale', example: 'zp=1' },
	{ name: 'z0', help: 'soliton tip', example: 'z0=1' }
];

export const FALLBACK_SINKS: Word[] = [
	{ name: 'table', help: 'show as a table', example: '| table' },
	{ name: 'plot', help: 'show as a plot', example: '| plot' },
	{ name: 'tex', help: 'LaTeX of the result', example: '| tex' },
	{ name: 'csv', help: 'download as CSV', example: '| csv' }
];

export const BULK_KEYS: Record<string, string[]> = {
	vacuum: ['d'],
	brane: ['d', 'zh'],
	boosted: ['d', 'zh', 'v', 'rapidity'],
	charged: ['d', 'zh', 'q'],
	dp: ['p', 'zh'],
	wave: ['d', 'zp'],
	soliton: ['d', 'z0'],
	metric: ['d', 'f', 'h']
};

export const VALUE_HINTS: Record<string, string[]> = {
	o: ['exact', '1', '2', '3', '4', '1,2,3,exact'],
	order: ['exact', '1', '2', '3', '4', '1,2,3,exact'],
	d: ['2', '3', '4', '5'],
	zh: ['1'],
	l: ['0.4', '0.05..1.2:80'],
	tol: ['1e-3', '1e-4']
};
