import { ballArea, stripArea, valueAt, withSolitonPhase } from './point';
import { defineVerb, type Point } from './types';

/** Which terms the finite part drops, in which scheme (PHYSICS.md, "Strip"; holo/ball.ts for balls). */
function finitePartNote(p: Point): string {
	if (p.shape === 'ball') {
		return 'S_fin = A_fin/(4G): every negative power of ε and, for even d, the ln(R/ε) term are dropped (cutoff z ≥ ε; holo/ball.ts)';
	}
	const d = p.bulk.d;
	const term = d === 2 ? '2 ln(1/ε)' : `2/(${d - 2} ε^${d - 2})`;
	return `S_fin = A_fin/(4G): the area-law term ${term} per unit transverse volume is subtracted from A (cutoff z ≥ ε, minimal subtraction: no finite term removed); ΔS needs no scheme`;
}

export const entropy = defineVerb({
	name: 'entropy',
	kind: 'scalar',
	series: true,
	usesG: true,
	forms: { strip: { keys: ['l', 'o', 'G', 'phase'], required: ['l'] }, ball: { keys: ['R', 'o', 'G'], required: ['R'] } },
	// the finite part: the area-law term is subtracted (finitePartNote)
	symbol: { text: 'S_fin', tex: 'S_{\\mathrm{fin}}' },
	help: {
		summary:
			"finite part S_fin = A_fin/(4G) in the pad's units: the area-law term 2/((d−2)ε^{d−2}) (d = 2: 2 ln(1/ε)) per unit transverse volume is subtracted, cutoff z ≥ ε, minimal subtraction (no finite term removed)",
		method: "area's A_fin divided by 4G, G from the line's G= or the pad's units (geo G, cft c = 3/(2G) at d = 2, sym N at d = 4)",
		accuracy: 'as area; the units conversion is exact',
		source: 'Ryu & Takayanagi 2006; c = 3/(2G): Brown & Henneaux, CMP 104 (1986) 207; L³/G₅ = 2N²/π: Gubser, Klebanov & Peet 1996',
		examples: ['entropy l=0.4', 'units sym N=3; entropy l=0.4 o=2']
	},
	at: (p) => {
		const value = p.holo.entropy(p.shape === 'ball' ? ballArea(p, 'entropy') : stripArea(p), p.G);
		const note = finitePartNote(p);
		return p.shape === 'ball' ? { value, note } : withSolitonPhase(p, valueAt(p, value, { note }));
	}
});
