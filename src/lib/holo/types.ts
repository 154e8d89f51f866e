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
	hasSeries: boolean;
	/** Present when the closed-form series applies (see series/). */
	series?: SeriesShape;
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
