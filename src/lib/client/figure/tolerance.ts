/**
 * The relative tolerance the engine's validity bands are computed with: `validity` finds the largest l at
 * which the order-n series stays within this of the exact result (DEFAULT_TOL in src/lib/lang/verbs.ts; a
 * unit test holds the two equal). The client cannot import verbs.ts (it pulls the engine), hence the copy.
 */
export const VALIDITY_TOLERANCE = 1e-3;
