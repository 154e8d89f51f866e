/**
 * Near-horizon black Dp-brane, p = 1…4 (non-conformal for p ≠ 3).
 *
 * Background (Itzhaki, Maldacena, Sonnenschein & Yankielowicz, Phys. Rev. D 58 (1998) 046004; string
 * frame, written from memory): ds² = H^{−1/2}(−f dt² + dx_p²) + H^{1/2}(dr²/f + r² dΩ²_{8−p}),
 * H = (R/r)^{7−p}, f = 1 − (r0/r)^{7−p}, e^φ ∝ H^{(3−p)/4}. Entanglement functional for a non-conformal
 * background: ∫ d⁸σ e^{−2φ} √(det g_ind) (Ryu–Takayanagi in the Einstein frame; Klebanov, Kutasov &
 * Murugan, Nucl. Phys. B 796 (2008) 274). For a strip along x₁ it reduces (derived here) to
 *   𝒩_p ∫ dr r^{(9−p)/2} √(x'² + H/f).
 * With the radial coordinate z = (2/(5−p)) R^{(7−p)/2} r^{−(5−p)/2} (so the T = 0 metric is H^{−1/2}(dx² + dz²)
 * up to the sphere; R = 1 here) this is, up to a constant that we drop,
 *   A = ∫ dz z^{−a} √(x'² + 1/f),   a = (9−p)/(5−p),   f = 1 − (z/zh)^{ν},  ν = 2(7−p)/(5−p),
 * and T = ν/(4π zh) (equivalently T = (7−p)/(4πR)(r0/R)^{(5−p)/2}, IMSY). This is core's Slice with an
 * effective (non-integer for p = 2) dimension d_eff = a + 1 and h = 1, so core's strip integrals apply
 * unchanged: `Bulk.d` is d_eff (p = 1, 2, 3, 4 → 3, 10/3, 4, 6); the boundary has p + 1 dimensions.
 *
 * Reported areas are the reduced A above (multiply by 𝒩_p, which collects Ω_{8−p}, g_s and R, for the
 * physical one; S = A/(4G) with G absorbing 𝒩_p). Cutoff scheme: z ≥ ε, A_fin = A − 2ε^{1−a}/(a − 1), the
 * only divergence for p ≤ 4 (the thermal corrections to the integrand are O(z^{ν−a}) = O(z), integrable).
 * ΔA = A_fin(zh) − A_fin(zh = ∞) is cutoff-free; the T = 0 area has the power-law closed form of
 * Ryu–Takayanagi's with d → d_eff (derived: the Beta-function integrals hold for real d > 2).
 * p = 5 (log divergence depending on r0) and p = 6 (linear one) leave ΔA cutoff-dependent: refused.
 * Thermodynamics in the same reduced normalisation: s = zh^{−a}/(4G) (the horizon's area density), so
 * s ∝ T^{(9−p)/(5−p)} (IMSY), e = a T s/(a+1), p = T s/(a+1) from de = T ds (derived).
 */
import { HoloError } from '../errors';
import { gamma } from '../special/gamma';
import { solveStrip } from '../strip';
import type { Bulk, Stress } from '../types';

export interface DpParams {
	p: number;
	zh: number;
}

/** Exponents of the reduced functional: a (z^{−a}), ν (f = 1 − (z/zh)^ν) and d_eff = a + 1. */
export function dpExponents(p: number): { a: number; nu: number; deff: number } {
	if (!Number.isInteger(p) || p < 1 || p > 4) {
		throw new HoloError(
			'dp needs p = 1, 2, 3 or 4',
			'p',
			p === 5 || p === 6 ? 'for p = 5, 6 the thermal part of the area diverges with the cutoff' : undefined
		);
	}
	const a = (9 - p) / (5 - p);
	return { a, nu: (2 * (7 - p)) / (5 - p), deff: a + 1 };
}

function readParams(params: Record<string, number | string>): DpParams {
	for (const k of Object.keys(params)) if (k !== 'p' && k !== 'zh') throw new HoloError(`dp has no key '${k}'`, k, 'dp keys: p, zh');
	const p = params.p === undefined ? 4 : Number(params.p);
	const zh = params.zh === undefined ? 1 : Number(params.zh);
	dpExponents(p);
	if (!(zh > 0) || !Number.isFinite(zh)) throw new HoloError('zh must be a positive number', 'zh');
	return { p, zh };
}

/** The black Dp-brane as a Bulk (d = d_eff; see the module comment). */
export function makeDpBulk(params: Record<string, number | string>): Bulk {
	const { p, zh } = readParams(params);
	const { a, nu, deff } = dpExponents(p);
	const T = nu / (4 * Math.PI * zh);
	const s = (G: number) => Math.pow(zh, -a) / (4 * G);
	const e = (G: number) => (a * T * s(G)) / (a + 1);
	const pr = (G: number) => (T * s(G)) / (a + 1);
	return {
		name: 'dp',
		d: deff,
		params: { p, zh, a, nu, deff },
		horizon: zh,
		scale: zh,
		slice: {
			d: deff,
			f: (z) => 1 - Math.pow(z / zh, nu),
			h: () => 1,
			scale: zh,
			zh,
			fTerms: [
				{ c: 1, p: 0 },
				{ c: -1, p: nu }
			],
			hTerms: []
		},
		stress: (G): Stress => ({ tt: e(G), ty: 0, xx: pr(G), yy: pr(G) }),
		thermo: (G) => ({ T, s: s(G), e: e(G), p: pr(G) })
	};
}

/**
 * T = 0 reduced area finite part for exponent a (d_eff = a + 1):
 * A_fin = −(2^{d−1} π^{(d−1)/2}/(d−2)) (Γ(d/(2(d−1)))/Γ(1/(2(d−1))))^{d−1} l^{2−d} with d = d_eff.
 */
export function dpVacuumAreaFinite(p: number, l: number): number {
	const { deff: d } = dpExponents(p);
	if (!(l > 0)) throw new HoloError('l must be > 0', 'l');
	const m = 2 * (d - 1);
	const r = gamma(d / m) / gamma(1 / m);
	return (-(Math.pow(2, d - 1) * Math.pow(Math.PI, (d - 1) / 2)) / (d - 2)) * Math.pow(r, d - 1) * Math.pow(l, 2 - d);
}

export interface DpStrip {
	zstar: number;
	areaFinite: number;
	/** A_fin − A_fin(T = 0): cutoff-free */
	deltaArea: number;
	vacuumArea: number;
}

/** Exact strip in the black Dp-brane: z*, A_fin and ΔA against the T = 0 Dp-brane. */
export function dpStrip(params: Record<string, number | string>, l: number): DpStrip {
	const b = makeDpBulk(params);
	const sol = solveStrip(b.slice, l);
	const vac = dpVacuumAreaFinite(b.params.p as number, l);
	return { zstar: sol.zstar, areaFinite: sol.areaFinite, deltaArea: sol.areaFinite - vac, vacuumArea: vac };
}

export { readParams as readDpParams };
