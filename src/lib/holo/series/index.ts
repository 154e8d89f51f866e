import { HoloError } from '../errors';
import type { Bulk, SeriesCoeff } from '../types';

/** Placeholder until the closed-form series lands (same signatures). */
export function seriesCoeffs(bulk: Bulk, n: number): SeriesCoeff[] {
	throw new HoloError(`series not yet available for ${bulk.name} (n=${n})`, 'o');
}
export function deltaAreaSeries(bulk: Bulk, l: number, n: number): number {
	if (n === 0) return 0;
	return seriesCoeffs(bulk, n).reduce((s, c) => s + c.value * l, 0);
}
export function boostedCoeffPolys(d: number, n: number): number[][] {
	throw new HoloError(`series not yet available (d=${d}, n=${n})`, 'o');
}
export function validity(bulk: Bulk, n: number, tol: number): { l_max: number; radius: number } {
	throw new HoloError(`validity not yet available for ${bulk.name} (n=${n}, tol=${tol})`, 'o');
}
export function seriesWarning(bulk: Bulk, l: number, n: number): string | undefined {
	void bulk;
	void l;
	void n;
	return undefined;
}
