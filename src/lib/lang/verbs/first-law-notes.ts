/** The conventions of tent, mu and firstlaw, per bulk (holo/firstlaw.ts; PHYSICS.md, "First law of entanglement"). */
import type { Point } from './types';

export function firstLawNote(p: Point, verb: 'tent' | 'mu'): string | undefined {
	const n = p.bulk.name;
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
