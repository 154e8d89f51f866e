/** Shared shapes of the engine (no logic). */

export type BulkName = 'vacuum' | 'brane' | 'boosted' | 'wave' | 'charged' | 'soliton' | 'dp' | 'metric' | 'vaidya';

/** One term c·(z/scale)^p of a metric function written as a sparse sum of powers. */
export interface PowerTerm {
	c: number;
	p: number;
}

/**
 * A constant-time slice seen by a strip of width along x (L = 1):
 *   f(z) = g_xx / g_zz                      (= f for the diagonal slices of PHYSICS.md, where g_xx = 1/z²)
 *   h(z) = z^{2(d−1)} ∏_{i ≠ z} g_ii       (= z² g_yy for the boosted brane and the wave)
 * so that H(z) = h/z^{2(d−1)}, x'² = H* / (f (H − H*)) and A/2 = ∫ H/√(f (H − H*)) dz.
 * f(0) = h(0) = 1. When `fTerms`/`hTerms` are given (sums of c·(z/scale)^p) the strip integrals form every
 * difference analytically (no cancellation near the turning point or near the horizon); without them f and h
 * are evaluated as black boxes.
 */
export interface Slice {
	d: number;
	f(z: number): number;
	h(z: number): number;
	/** Length that the terms' powers are measured in (zh, zp). */
	scale?: number;
	fTerms?: PowerTerm[];
	hTerms?: PowerTerm[];
	/** Simple zero of f: turning points lie in (0, zh), and 1 − z* / zh is kept exact. */
	zh?: number;
	/** Largest admissible turning point when there is no horizon (e.g. a cap); undefined = unbounded. */
	zmax?: number;
	/**
	 * f − 1 and h − 1 without the cancellation of forming f(z) − 1 near z = 0 (a black-box slice: the strip's
	 * area integrand weighs f − 1 by u^{1−d} there). Optional; the custom metric gives them from its Taylor series.
	 */
	fm1?(z: number): number;
	hm1?(z: number): number;
}

export interface Stress {
	tt: number;
	ty: number;
	xx: number;
	yy: number;
}

export interface Thermo {
	T: number;
	s: number;
	e: number;
	p: number;
	py?: number;
	/** charged brane: chemical potential and charge density (normalisation in bulks/charged.ts) */
	mu?: number;
	rho?: number;
}

/** Homogeneous series data: f = 1 − α (z/scale)^d, h = 1 + β (z/scale)^d (brane α=1,β=0; boosted α=1,β=κ; wave α=0,β=1). */
export interface SeriesShape {
	alpha: number;
	beta: number;
}

/**
 * The small-width series of ΔA a bulk has: ΔA = l^{2−d} Σ_i values[i] (l/scale)^{powers[i]} at order n
 * (series/capability.ts builds the named bulks' ones). Orders are checked by the caller (series/index.ts).
 */
export interface SeriesCapability {
	/** exponents of l/scale of the order-n terms, ascending (k d for one power per order) */
	powers(n: number): number[];
	values(n: number): number[];
	/** the same terms with their LaTeX (exact where known) */
	coeffs(n: number): SeriesCoeff[];
	/** the powers are not the multiples of d: the radius comes from the coefficients' growth, no Padé in τ */
	mixedPowers?: boolean;
}

/**
 * Where a state sits among its neighbours, for the first law (firstlaw.ts): the bulk's parameters as (w, q),
 * w = scale^{−d}, with ê = 16πG ΔE/l and p̂ = 16πG ΔX/l linear in their variations, X = P_y or Q.
 */
export interface FirstLawFamily {
	/** static: one parameter (ΔS = α ΔE); boosted and wave: X = P_y; charged: X = Q */
	kind: 'static' | 'boosted' | 'wave' | 'charged';
	w: number;
	q: number;
	/** sign of v (ζ flips with it) */
	sign: number;
	/** the series variable's length: zh, or zp for the wave */
	scale: number;
	/** charged: the charge parameter of f (its sign is μ_Q's) */
	charge?: number;
	/** ê = E1 δw + E2 δq, p̂ = P1 δw + P2 δq at this state */
	slopes: { E1: number; E2: number; P1: number; P2: number };
	/** how the slice's f and h move per unit δw and δq (power terms in z/scale), for the exact gradient */
	variations: { w: SliceVariation; q: SliceVariation };
}

export interface SliceVariation {
	df: PowerTerm[];
	dh: PowerTerm[];
}

export interface Bulk {
	name: BulkName;
	d: number;
	/** Normalised parameters (e.g. boosted has zh, v, kappa = γ²v², gamma). */
	params: Record<string, number | string>;
	/** zh where there is one (the scale for l/zh and the series). */
	horizon?: number;
	/** Length scale of the series variable τ = (l/scale)^d: zh, or zp for the wave. */
	scale?: number;
	slice: Slice;
	/** the small-width series, where the bulk has one */
	series?: SeriesCapability;
	/** the first law's parameter family, where the bulk has one */
	firstLaw?: FirstLawFamily;
	/** ⟨T_μν⟩ (lower indices) from the Fefferman–Graham expansion, for Newton constant G. */
	stress?: (G: number) => Stress;
	/** Temperature, entropy density, energy density, pressure(s). */
	thermo?: (G: number) => Thermo;
}

export interface SeriesCoeff {
	k: number;
	value: number;
	latex: string;
	/** true when `latex` is the exact closed form (rational × powers of π and B(s/m, ½)), false for a decimal. */
	exact?: boolean;
	/** boosted: a_k as the coefficients of κ^0..κ^k; charged: c_K as the coefficients of (q²)^0, (q²)^1, … */
	poly?: number[];
	/**
	 * Exponent of l/scale of this term: ΔA = l^{2−d} Σ value·(l/scale)^power. k·d for brane, boosted and wave;
	 * the charged brane's powers are da + 2(d−1)b (k is then just the index).
	 */
	power?: number;
}
