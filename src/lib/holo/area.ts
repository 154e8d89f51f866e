import { HoloError } from './errors';
import { gamma } from './special/gamma';
import { integrateStrip, solveStrip, turningPoint, vacuumWidthFactor, widthAt } from './strip';
import type { Bulk } from './types';
import { solitonArea, solitonZstar } from './bulks/soliton';

function checkL(l: number): void {
	if (typeof l !== 'number' || !(l > 0) || !Number.isFinite(l)) {
		throw new HoloError('l must be a positive number', 'l', `got l=${l}`);
	}
}

/** Turning point z* of the strip of width l (Brent on the exact width integral). */
export function zstarOf(bulk: Bulk, l: number): number {
	checkL(l);
	if (bulk.name === 'vacuum') return l / vacuumWidthFactor(bulk.d);
	// on the soliton l(z*) is not monotone: the connected surface is the branch of smaller z*
	if (bulk.name === 'soliton') return solitonZstar({ d: bulk.d, z0: Number(bulk.params.z0) }, l);
	return solveStrip(bulk.slice, l).zstar;
}

/** Width l of the strip whose turning point is z*. */
export function widthOf(bulk: Bulk, zstar: number): number {
	return widthAt(bulk.slice, turningPoint(bulk.slice, zstar));
}

/** Width and finite area at a given turning point (one quadrature pass, no root finding). */
export function stripIntegrals(bulk: Bulk, zstar: number): { width: number; areaFinite: number } {
	const r = integrateStrip(bulk.slice, turningPoint(bulk.slice, zstar));
	return { width: r.width, areaFinite: r.areaFinite };
}

/**
 * Vacuum finite area (Ryu & Takayanagi, PRL 96 (2006) 181602; JHEP 08 (2006) 045):
 * A_fin = −(2^{d−1} π^{(d−1)/2}/(d−2)) (Γ(d/(2(d−1)))/Γ(1/(2(d−1))))^{d−1} l^{2−d}; d = 2: 2 ln l.
 */
export function vacuumAreaFinite(d: number, l: number): number {
	checkL(l);
	if (!Number.isInteger(d) || d < 2 || d > 10) throw new HoloError('d must be an integer in 2..10', 'd');
	if (d === 2) return 2 * Math.log(l);
	const m = 2 * (d - 1);
	const r = gamma(d / m) / gamma(1 / m);
	return (-(Math.pow(2, d - 1) * Math.pow(Math.PI, (d - 1) / 2)) / (d - 2)) * Math.pow(r, d - 1) * Math.pow(l, 2 - d);
}

/** Finite part A_fin of the strip's RT area, per unit transverse volume. */
export function areaFinite(bulk: Bulk, l: number): number {
	checkL(l);
	if (bulk.name === 'vacuum') return vacuumAreaFinite(bulk.d, l);
	// the soliton's RT surface is the smaller of the connected and disconnected ones
	if (bulk.name === 'soliton') return solitonArea({ d: bulk.d, z0: Number(bulk.params.z0) }, l).areaFinite;
	return solveStrip(bulk.slice, l).areaFinite;
}

/** ΔA = A_fin(bulk; l) − A_fin(vacuum, same d; l): cutoff independent. */
export function deltaArea(bulk: Bulk, l: number): number {
	checkL(l);
	if (bulk.name === 'vacuum') return 0;
	if (bulk.name === 'soliton') return areaFinite(bulk, l) - vacuumAreaFinite(bulk.d, l);
	return solveStrip(bulk.slice, l).deltaArea;
}
