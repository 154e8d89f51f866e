/**
 * The relative tolerance the engine's validity bands are computed with: `validity` finds the largest l at which
 * the order-n series stays within this of the exact result (DEFAULT_VALIDITY_TOL in lang/verbs/validity.ts; a
 * unit test holds the two equal). The client cannot import the verb modules (they pull the engine): a copy.
 */
export const VALIDITY_TOLERANCE = 1e-3;
