import { HoloError } from './errors';
import type { Bulk, Stress, Thermo } from './types';

function checkG(G: number): void {
	if (!(G > 0) || !Number.isFinite(G)) throw new HoloError('G must be positive', 'G');
}

/** ⟨T_μν⟩ with lower indices (Fefferman–Graham; de Haro, Skenderis & Solodukhin 2001), per bulk. */
export function stressTensor(bulk: Bulk, G: number): Stress {
	checkG(G);
	if (!bulk.stress) throw new HoloError(`no stress tensor for ${bulk.name}`, 'bulk');
	return bulk.stress(G);
}

/** Temperature, entropy density, energy density and pressure(s); conventions in each bulks/ file. */
export function thermo(bulk: Bulk, G: number): Thermo {
	checkG(G);
	if (!bulk.thermo) throw new HoloError(`no thermodynamics for ${bulk.name}`, 'bulk');
	return bulk.thermo(G);
}

/**
 * Energy and momentum in the strip (per unit transverse volume): ΔE = T_tt l and ΔP_y = T^{ty} l = −T_ty l
 * (upper index: positive for v > 0), as in PHYSICS.md.
 */
export function energy(bulk: Bulk, l: number, G: number): { E: number; P: number } {
	if (!(l > 0) || !Number.isFinite(l)) throw new HoloError('l must be a positive number', 'l');
	const t = stressTensor(bulk, G);
	return { E: t.tt * l, P: -t.ty * l };
}
