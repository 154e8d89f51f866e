/**
 * Public surface of the engine's second half: first law at any order, balls, mutual information, Padé
 * resummation, the AdS soliton and the black Dp-brane. Re-exported by index.ts (`export * from './analysis'`).
 */
import { areaFinite } from './area';
import { mutualInformation as mutualFromArea, criticalGap, type MutualInformation } from './mutual';
import { solitonArea, readSolitonParams } from './bulks/soliton';
import type { Bulk } from './types';

export { tent, mu, firstLaw, firstLawCoefficients, firstLawSeries, areaParameterDerivative } from './firstlaw';
export type { MuOf } from './firstlaw';
export type { Order, FirstLawCheck, FirstLawCoefficients, FirstLawDirection, FirstLawSeries, TentResult } from './firstlaw';

export {
	ballVacuumAreaFinite,
	ballLogCoefficient,
	ballDeltaAreaFirstOrder,
	ballDeltaArea,
	ballDeltaAreaSweep,
	ballStartFrom,
	extendBallTrail,
	ballTent,
	ballEnergy,
	ballTip,
	sphereArea
} from './ball';
export type { BallDeltaArea, BallTrail } from './ball';

export { mutualInformationArea, criticalGap } from './mutual';
export type { MutualInformation, StripArea } from './mutual';

export { resum, resumTent, choosePade, padeError, RESUM_WARN_REL } from './resum';
export type { ResumResult } from './resum';

export { padeApproximant, evalPade, nearestPole, polyRoots } from './numeric/pade';
export type { PadeApproximant, PadePole } from './numeric/pade';
export { integrateOde } from './numeric/ode';
export type { OdeOptions, OdeResult } from './numeric/ode';

export {
	makeSolitonBulk,
	solitonWidth,
	solitonConnectedArea,
	solitonDisconnectedArea,
	solitonMaxWidth,
	solitonZstar,
	solitonArea,
	solitonCriticalWidth,
	solitonPhases,
	solitonSurface
} from './bulks/soliton';
export type { SolitonParams, SolitonArea, SolitonPhase, SolitonPhaseChoice, SolitonPhases, SolitonSurface } from './bulks/soliton';
export { makeDpBulk, dpExponents, dpVacuumAreaFinite, dpStrip } from './bulks/dp';
export type { DpParams, DpStrip } from './bulks/dp';

/** The strip's RT finite area in any bulk: the soliton takes the minimum over its two surfaces. */
export function stripAreaOf(bulk: Bulk): (l: number) => number {
	if (bulk.name === 'soliton') {
		const P = readSolitonParams({ d: bulk.d, z0: bulk.params.z0 as number });
		return (l) => solitonArea(P, l).areaFinite;
	}
	return (l) => areaFinite(bulk, l);
}

/**
 * Mutual information I·4G (area units) of two strips of width l and gap `gap` in `bulk`, the winning phase,
 * and the critical gap over width (Headrick, Phys. Rev. D 82 (2010) 126010). Divide I by 4G for entropy.
 */
export function mutualInformation(bulk: Bulk, l: number, gap: number): MutualInformation {
	return mutualFromArea(stripAreaOf(bulk), l, gap);
}

/** Critical gap s_c/l of two strips of width l in `bulk`. */
export function criticalGapRatio(bulk: Bulk, l: number): number {
	return criticalGap(stripAreaOf(bulk), l) / l;
}
