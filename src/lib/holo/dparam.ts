import { HoloError } from './errors';
import { gaussLegendre } from './numeric/gauss';
import { solveStrip, type TurningPoint } from './strip';
import type { Bulk, PowerTerm, Slice } from './types';

/**
 * d A_fin / d param at fixed width l, param ∈ {zh, v, q} (zp for the wave), per unit transverse volume.
 *
 * Method (extremality): A = 2∫₀^{z*} dz L, L = √h z^{1−d} √(1/f + x'²). The RT surface extremises A with its
 * ends fixed at x = ±l/2, so varying a parameter of the metric changes A only through the explicit
 * dependence of L: dA/dp = 2∫ ∂_p L on the fixed solution (the cutoff term 2/((d−2)ε^{d−2}) does not depend
 * on p). With x'² = H* / (f(H − H*)), H = h z^{−2(d−1)}, N = h(u z*) u^{−m} − h* and u = z/z*, this is
 *   dA_fin/dp = z*^{2−d} ∫₀¹ [ ∂_p h / (u^m √(f N)) − ∂_p f · √N / f^{3/2} ] du,   m = 2(d − 1)
 * (derived here; checked against Richardson differences of the exact ΔA in tests/unit/holo/dparam.test.ts).
 * Both terms vanish like u at the boundary; at u = 1 the first has the 1/√(1−u) of the width integral.
 *
 * Quadrature: as in strip.ts, u = 1 − s² and, near a horizon, s = a sinh σ with a = √(f* / c) (here the f^{−3/2}
 * peak becomes a smooth bump), panels of 24-point Gauss–Legendre; differences formed from the power terms with
 * expm1/log1p. Accuracy ≲ 1e−11 relative away from the horizon, ≲ 1e−9 within 1% of it.
 */

/** ∂_p of the slice's f and h as sums c·(z/scale)^p. */
function termDerivatives(bulk: Bulk, param: string): { df: PowerTerm[]; dh: PowerTerm[] } {
	const { fTerms = [], hTerms = [], scale } = bulk.slice;
	const nz = (t: PowerTerm[]) => t.filter((x) => x.p !== 0 && x.c !== 0);
	const scaleKey = bulk.name === 'wave' ? 'zp' : 'zh';
	if (param === scaleKey && scale) {
		// c (z/scale)^p: ∂_scale = −(p/scale) c (z/scale)^p
		const d = (t: PowerTerm[]) => nz(t).map((x) => ({ c: (-x.p * x.c) / scale, p: x.p }));
		return { df: d(fTerms), dh: d(hTerms) };
	}
	if (param === 'v' && bulk.name === 'boosted') {
		const v = bulk.params.v as number;
		const om = (1 - v) * (1 + v);
		return { df: [], dh: [{ c: (2 * v) / (om * om), p: bulk.d }] }; // κ = v²/(1−v²)
	}
	if (param === 'q' && bulk.name === 'charged') {
		const q = bulk.params.q as number;
		return {
			df: [
				{ c: -2 * q, p: bulk.d },
				{ c: 2 * q, p: 2 * (bulk.d - 1) }
			],
			dh: []
		};
	}
	const allowed = bulk.name === 'wave' ? 'zp' : bulk.name === 'boosted' ? 'zh, v' : bulk.name === 'charged' ? 'zh, q' : 'zh';
	throw new HoloError(`no derivative in '${param}' for ${bulk.name}`, 'param', `parameters: ${allowed}`);
}

const GL = 24;

/**
 * ∂_λ A_fin at fixed l on the solution with turning point `tp`, for ∂_λ f and ∂_λ h given as power terms in
 * z/scale (the integral of the module comment). The first-law code uses it with its own variations.
 */
export function areaParameterDerivative(s: Slice, tp: TurningPoint, df: PowerTerm[], dh: PowerTerm[]): number {
	const d = s.d;
	const m = 2 * (d - 1);
	const scale = s.scale ?? 1;
	const zs = tp.z;
	const horizon = s.zh !== undefined && s.scale === s.zh;
	const lz = horizon ? Math.log1p(-tp.eta) : Math.log(zs / scale);
	const fT = (s.fTerms ?? []).filter((x) => x.p !== 0);
	const hT = (s.hTerms ?? []).filter((x) => x.p !== 0);
	const A = fT.map((x) => x.c * Math.exp(x.p * lz));
	const B = hT.map((x) => x.c * Math.exp(x.p * lz));
	const dA = df.map((x) => x.c * Math.exp(x.p * lz));
	const dB = dh.map((x) => x.c * Math.exp(x.p * lz));
	// f* kept exact near a horizon: f(zh) = 0, so f* = Σ c (e^{p ln(1−η)} − 1)
	let fstar = horizon ? 0 : 1;
	let cslope = 0;
	fT.forEach((x, j) => {
		fstar += horizon ? x.c * Math.expm1(x.p * lz) : A[j];
		cslope -= x.p * A[j];
	});
	const a = cslope > fstar ? Math.sqrt(fstar / cslope) : 1;
	const smax = Math.asinh(1 / a);
	const panels = Math.max(1, Math.ceil(smax / 1.4)) + (B.some((b) => b > 10) ? Math.ceil(2 * Math.log10(1 + Math.max(...B))) : 0);
	const hw = smax / panels / 2;
	const rule = gaussLegendre(GL);
	let sum = 0;
	for (let k = 0; k < panels; k++) {
		for (let i = 0; i < GL; i++) {
			const sig = (2 * k + 1) * hw + hw * rule.x[i];
			const t = a * Math.sinh(sig);
			const jac = 2 * t * a * Math.cosh(sig) * hw * rule.w[i];
			const lu = Math.log1p(-t * t);
			let F = fstar;
			fT.forEach((x, j) => (F += A[j] * Math.expm1(x.p * lu)));
			let N = Math.expm1(-m * lu);
			hT.forEach((x, j) => (N += B[j] * Math.expm1((x.p - m) * lu)));
			let dF = 0;
			df.forEach((x, j) => (dF += dA[j] * Math.exp(x.p * lu)));
			let dH = 0;
			dh.forEach((x, j) => (dH += dB[j] * Math.exp(x.p * lu)));
			const um = Math.exp(m * lu);
			let v = 0;
			if (dH !== 0) v += dH / (um * Math.sqrt(F * N));
			if (dF !== 0) v -= (dF * Math.sqrt(N)) / (F * Math.sqrt(F));
			sum += jac * v;
		}
	}
	return Math.pow(zs, 2 - d) * sum;
}

/** d A_fin/d param (= d ΔA/d param) at fixed l. */
export function dAreaDParam(bulk: Bulk, l: number, param: string): number {
	if (!['brane', 'boosted', 'charged', 'wave'].includes(bulk.name)) {
		throw new HoloError(`dAreaDParam is for brane, boosted, charged and wave (got ${bulk.name})`, 'bulk');
	}
	const { df, dh } = termDerivatives(bulk, param);
	return areaParameterDerivative(bulk.slice, solveStrip(bulk.slice, l).point, df, dh);
}
