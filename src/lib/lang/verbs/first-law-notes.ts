/** The conventions of tent, mu and firstlaw, per bulk (holo/firstlaw.ts; PHYSICS.md, "First law of entanglement"). */
import type { Point } from './types';

export function firstLawNote(p: Point, verb: 'tent' | 'mu'): string | undefined {
	const n = p.bulk.name;
	if (p.words.along !== undefined) {
		const [first, ...rest] = p.words.along.split(',');
		return (
			`from δΔS = α δΔE${rest.map((x) => ` + β_${x} δΔ${x}`).join('')} over ${p.words.along} at fixed l (ΔE = l T_tt from the metric's z^d terms` +
			`${rest.length ? `, each Δp = l p/16πG held as a charge` : ''}): T_ent = 1/α is δΔS/δΔE at fixed ${rest.length ? rest.join(', ') : 'nothing else'}, ` +
			`moved along ${first}${rest.length ? `; μ_${rest[0]} = −β_${rest[0]}/α (a convention of these labels: only μ Δp is convention-free)` : ''}`
		);
	}
	if (n === 'boosted' || n === 'wave') {
		return (
			'from δΔS = α δΔE + ζ δΔP_y over (zh, v) at fixed l, ΔP_y = l T^{ty} (> 0 for v > 0): T_ent = 1/α, μ = −ζ/α. ' +
			'At small l the sign and size of μ are a convention of this split (μ < 0 and |μ| > 1 occur); the large-l limit is the thermodynamic one: ' +
			'μ → v, T_ent → T/γ'
		);
	}
	if (n === 'charged' && p.bulk.d > 2) {
		return (
			'from δΔS = α δΔE + β δΔQ over (zh, q) at fixed l: T_ent = 1/α, μ_Q = −β/α; ΔQ = l ρ with the action (R + d(d−1) − F²)/16πG, ' +
			'μ = √((d−1)/(2(d−2))) q/zh (only μ_Q ΔQ is convention-free). Large l: T_ent → T_H, μ_Q → μ'
		);
	}
	return verb === 'tent' ? 'T_ent = 1/α of δΔS = α δΔE at fixed l; large l: T_ent → T_H' : undefined;
}

/** The first law's default tolerance: |residual| ≤ 1e-3 · |δΔS|, relative, as for validity. */
export const FIRSTLAW_TOL = 1e-3;
