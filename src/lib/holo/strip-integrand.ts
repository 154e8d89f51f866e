/**
 * The two ways the strip quadrature reads a slice (strip.ts): from its sparse power terms, where every difference
 * (f − f*, h − h*, N − N₀) is formed from the terms without cancellation and d ln l/d ln z* comes from the same
 * pass, or as a black box f(z), h(z) for a user's metric, with the differences formed directly.
 *
 * An integrand fills the values at all nodes at once (term by term for the power terms: tight loops over typed
 * arrays), and strip.ts runs one loop over the nodes for both kinds.
 */
import type { Nodes, Prepared, TurningPoint } from './strip-nodes';

/** The values at every node q (arrays at least X.n long; only the first X.n entries are meaningful). */
export interface NodeValues {
	/** f(u z*) */
	F: Float64Array;
	/** f(u z*) − 1 */
	Fm1: Float64Array;
	/** h(u z*) − 1 */
	hm1: Float64Array;
	/** h(u z*) − h* */
	dh: Float64Array;
	/** N − N₀, with N = h(u z*) u^{−m} − h* and N₀ = u^{−m} − 1 */
	dN: Float64Array;
	/** ∂F/∂ ln z* (with the slope) */
	dF: Float64Array;
	/** ∂N/∂ ln z* (with the slope) */
	dNl: Float64Array;
}

export interface StripIntegrand {
	/** f(z*) */
	fstar: number;
	/** h(z*) */
	hstar: number;
	/** h* − 1, formed from the terms where there are terms (1 + B − 1 would lose B ≪ 1) */
	hstarM1: number;
	/** −z* f'(z*): with f* it sets the width of the peak near a horizon */
	cslope: number;
	/** d h* / d ln z* (0 for a black box, which has no slope) */
	dhstar: number;
	/** whether `fill` can give the derivatives in ln z* (dF, dNl) */
	readonly hasSlope: boolean;
	/** Sets the turning point: the values above, and what `fill` needs. */
	moveTo(tp: TurningPoint): void;
	/** Fills v at every node of X; dF and dNl too when `slope` (only if `hasSlope`). */
	fill(X: Nodes, v: NodeValues, slope: boolean): void;
}

/**
 * The node-value arrays of X, kept with X and reused from pass to pass: the quadrature runs synchronously and never
 * re-enters itself, so one set per node set serves every pass without allocating. A node set belongs to one
 * slice, so the entries a slice has no terms for stay zero and are never written.
 */
export function nodeValuesFor(X: Nodes): NodeValues {
	if (!X.values) {
		const arr = () => new Float64Array(X.n);
		X.values = { F: arr(), Fm1: arr(), hm1: arr(), dh: arr(), dN: arr(), dF: arr(), dNl: arr() };
	}
	return X.values;
}

/** The integrand of a slice with power terms. */
export class PowerTermIntegrand implements StripIntegrand {
	fstar = NaN;
	hstar = NaN;
	hstarM1 = NaN;
	cslope = NaN;
	dhstar = NaN;
	readonly hasSlope = true;
	private readonly P: Prepared;
	/** c_j (z* / s)^p_j for the f terms and the h terms at the current turning point */
	private readonly A: Float64Array;
	private readonly B: Float64Array;

	constructor(P: Prepared) {
		this.P = P;
		this.A = new Float64Array(P.fp.length);
		this.B = new Float64Array(P.hp.length);
	}

	moveTo(tp: TurningPoint): void {
		const { P, A, B } = this;
		const { fp, fc, hp, hc } = P;
		// at a horizon ln(z* / zh) = ln(1 − η) keeps η exact, and f* = Σ c (ζ^p − 1) avoids 1 − 1 + tiny
		const lz = P.horizon ? Math.log1p(-tp.eta) : Math.log(tp.z / P.scale);
		let fstar = P.horizon ? 0 : 1;
		let cslope = 0;
		for (let j = 0; j < A.length; j++) {
			A[j] = fc[j] * Math.exp(fp[j] * lz);
			fstar += P.horizon ? fc[j] * Math.expm1(fp[j] * lz) : A[j];
			cslope -= fp[j] * A[j];
		}
		let hstarM1 = 0;
		let dhstar = 0;
		for (let j = 0; j < B.length; j++) {
			B[j] = hc[j] * Math.exp(hp[j] * lz);
			hstarM1 += B[j];
			dhstar += hp[j] * B[j];
		}
		this.fstar = fstar;
		this.hstarM1 = hstarM1;
		this.hstar = 1 + hstarM1;
		this.cslope = cslope;
		this.dhstar = dhstar;
	}

	fill(X: Nodes, v: NodeValues, slope: boolean): void {
		// term by term, each node summing its terms in the same order as a per-node loop would; the first term
		// writes (0 + x, as a sum from 0 would) and the others add, so nothing is cleared first
		const { A, B } = this;
		const { fp, hp } = this.P;
		const n = X.n;
		const { F, Fm1, hm1, dh, dN, dF, dNl } = v;
		const f0 = this.fstar;
		if (A.length === 0) F.fill(f0, 0, n);
		for (let j = 0; j < A.length; j++) {
			const a = A[j];
			const e = X.fE[j];
			const u = X.fU[j];
			if (j === 0) {
				for (let q = 0; q < n; q++) {
					F[q] = f0 + a * e[q];
					Fm1[q] = 0 + a * u[q];
				}
			} else {
				for (let q = 0; q < n; q++) {
					F[q] += a * e[q];
					Fm1[q] += a * u[q];
				}
			}
		}
		for (let j = 0; j < B.length; j++) {
			const b = B[j];
			const hu = X.hU[j];
			const he = X.hE[j];
			const hn = X.hN[j];
			if (j === 0) {
				for (let q = 0; q < n; q++) {
					hm1[q] = 0 + b * hu[q];
					dh[q] = 0 + b * he[q];
					dN[q] = 0 + b * hn[q];
				}
			} else {
				for (let q = 0; q < n; q++) {
					hm1[q] += b * hu[q];
					dh[q] += b * he[q];
					dN[q] += b * hn[q];
				}
			}
		}
		if (!slope) return;
		// every term c (u z* / s)^p contributes p times itself to the derivative in ln z*
		for (let j = 0; j < A.length; j++) {
			const c = fp[j] * A[j];
			const u = X.fU[j];
			if (j === 0) for (let q = 0; q < n; q++) dF[q] = 0 + c * u[q];
			else for (let q = 0; q < n; q++) dF[q] += c * u[q];
		}
		for (let j = 0; j < B.length; j++) {
			const c = hp[j] * B[j];
			const hn = X.hN[j];
			if (j === 0) for (let q = 0; q < n; q++) dNl[q] = 0 + c * hn[q];
			else for (let q = 0; q < n; q++) dNl[q] += c * hn[q];
		}
	}
}

/** The integrand of a black-box slice (f and h as functions). */
export class BlackBoxIntegrand implements StripIntegrand {
	fstar = NaN;
	hstar = NaN;
	hstarM1 = NaN;
	cslope = NaN;
	dhstar = 0;
	readonly hasSlope = false;
	private readonly P: Prepared;
	private zs = NaN;

	constructor(P: Prepared) {
		this.P = P;
	}

	moveTo(tp: TurningPoint): void {
		const { slice } = this.P;
		const zs = tp.z;
		this.zs = zs;
		this.fstar = slice.f(zs);
		this.hstar = slice.h(zs);
		this.hstarM1 = slice.hm1 ? slice.hm1(zs) : this.hstar - 1;
		// a one-sided difference from inside, where f is known to be defined (past z* may lie a horizon)
		const dz = 1e-6 * zs;
		this.cslope = (zs * (this.fstar - slice.f(zs - dz))) / dz;
	}

	fill(X: Nodes, v: NodeValues): void {
		const { slice } = this.P;
		for (let q = 0; q < X.n; q++) {
			const z = X.u[q] * this.zs;
			// f − 1, h − 1 from the slice when it can form them without cancellation (near z = 0); f itself stays
			// the function's value (near a horizon 1 + (f − 1) would lose f's relative accuracy)
			const F = slice.f(z);
			const hu = slice.h(z);
			const Fm1 = slice.fm1 ? slice.fm1(z) : F - 1;
			const hm1 = slice.hm1 ? slice.hm1(z) : hu - 1;
			v.F[q] = F;
			v.Fm1[q] = Fm1;
			v.hm1[q] = hm1;
			v.dh[q] = hm1 - this.hstarM1;
			// N − N₀ = (h − 1)/u^m − (h* − 1): the same number without forming u^{−m} − 1 twice (which cancels near u = 1)
			v.dN[q] = hm1 / X.um[q] - this.hstarM1;
			// strip.ts rejects the first node where f or N is not positive; the user's formula is not asked
			// about the nodes after it (it may not evaluate there), just as before the split
			if (!(F > 0) || !(X.N0[q] + v.dN[q] > 0) || !(hu - 1 > -1)) break;
		}
	}
}

/**
 * The integrand of slice P moved to the turning point tp: from the power terms when the slice has them. One
 * integrand per slice, kept with it and moved from point to point (the quadrature never re-enters itself), so a
 * pass allocates nothing.
 */
export function integrandAt(P: Prepared, tp: TurningPoint): StripIntegrand {
	const I = (P.integrand ??= P.exact ? new PowerTermIntegrand(P) : new BlackBoxIntegrand(P));
	I.moveTo(tp);
	return I;
}
