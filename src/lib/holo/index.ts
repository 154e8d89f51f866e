/**
 * Public surface of the holographic engine (pure: no svelte, $app, node:, DOM or I/O).
 * Units L = 1; areas and entropies per unit transverse volume. Conventions: PHYSICS.md.
 */
export { HoloError } from './errors';
export type { Bulk, BulkName, Slice, PowerTerm, SeriesCoeff, SeriesShape, SeriesCapability, FirstLawFamily, Stress, Thermo } from './types';
export { MAX_ASKED_ORDER } from './limits';
export { makeBulk, registerBulk, BULK_NAMES } from './bulks/index';
export { zstarOf, widthOf, areaFinite, deltaArea, vacuumAreaFinite, stripIntegrals } from './area';
export { solveStrip, integrateStrip, turningPoint, vacuumWidthFactor, widthSlope } from './strip';
export { dAreaDParam } from './dparam';
export type { TurningPoint, StripIntegrals } from './strip';
export {
	seriesCoeffs,
	deltaAreaSeries,
	validity,
	seriesWarning,
	boostedCoeffPolys,
	seriesValues,
	seriesRadius,
	seriesRadiusEstimate,
	seriesPowers,
	MAX_ORDER
} from './series/index';
export { stressTensor, thermo, energy } from './physics';
export { cd, newtonG, entropy } from './units';
export type { Units } from './units';
export { gamma, lgamma, rgamma } from './special/gamma';
export { beta, betaHalfShift } from './special/beta';
export * from './analysis';
