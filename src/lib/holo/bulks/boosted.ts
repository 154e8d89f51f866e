import { HoloError } from '../errors';
import { boostedFamily } from '../firstlaw-family';
import { homogeneousSeries } from '../series/capability';
import type { Bulk, Stress } from '../types';
import { readDimension, readLength, readNumber, rejectUnknownKeys } from './params';

/**
 * The black brane boosted with velocity v along y (d ≥ 3); the strip's width is orthogonal to y.
 * Constant-t slice: g_zz = 1/(z² f), f = 1 − (z/zh)^d, g_yy = (1 + κ (z/zh)^d)/z², κ = γ²v².
 * Stress (de Haro, Skenderis & Solodukhin 2001): T_μν = (η_μν + d u_μ u_ν)/(16πG zh^d), u^μ = γ(1, v), lower
 * indices, so T_ty = −d γ² v/(16πG zh^d) and the momentum density T^{ty} = +d γ² v/(16πG zh^d).
 * Thermodynamics in the lab frame: T = T₀/γ with T₀ = d/(4π zh) the rest-frame temperature (surface gravity
 * of ∂_t + v∂_y), s = γ/(4G zh^{d−1}) (horizon area per unit lab volume = γ × rest-frame value), so that
 * e + p_x = T s + v T^{ty} holds. `rapidity` η gives v = tanh η, κ = sinh² η exactly.
 */
export function makeBoosted(params: Record<string, number | string>): Bulk {
	rejectUnknownKeys('boosted', params, ['d', 'zh', 'v', 'rapidity']);
	const d = readDimension(params, 3);
	const zh = readLength(params, 'zh');
	let v: number;
	let gamma: number;
	let kappa: number;
	if (params.rapidity !== undefined) {
		if (params.v !== undefined) throw new HoloError('give v or rapidity, not both', 'rapidity');
		const r = readNumber(params, 'rapidity');
		if (Math.abs(r) > 20) throw new HoloError('|rapidity| must be ≤ 20', 'rapidity');
		v = Math.tanh(r);
		gamma = Math.cosh(r);
		kappa = Math.sinh(r) ** 2;
	} else {
		v = readNumber(params, 'v', 0);
		if (!(Math.abs(v) < 1)) throw new HoloError('v must satisfy |v| < 1', 'v', `got v=${v}`);
		const om = (1 - v) * (1 + v);
		gamma = 1 / Math.sqrt(om);
		kappa = (v * v) / om;
	}
	const c = (G: number) => 1 / (16 * Math.PI * G * Math.pow(zh, d));
	return {
		name: 'boosted',
		d,
		params: { d, zh, v, gamma, kappa },
		horizon: zh,
		scale: zh,
		slice: {
			d,
			f: (z) => 1 - Math.pow(z / zh, d),
			h: (z) => 1 + kappa * Math.pow(z / zh, d),
			scale: zh,
			zh,
			fTerms: [
				{ c: 1, p: 0 },
				{ c: -1, p: d }
			],
			hTerms: [
				{ c: 1, p: 0 },
				{ c: kappa, p: d }
			]
		},
		series: homogeneousSeries(d, 'boosted', { alpha: 1, beta: kappa }),
		firstLaw: boostedFamily(d, zh, v, kappa),
		stress: (G): Stress => ({
			tt: c(G) * (d * gamma * gamma - 1),
			ty: -c(G) * d * gamma * gamma * v,
			xx: c(G),
			yy: c(G) * (1 + d * kappa)
		}),
		thermo: (G) => ({
			T: d / (4 * Math.PI * zh * gamma),
			s: gamma / (4 * G * Math.pow(zh, d - 1)),
			e: c(G) * (d * gamma * gamma - 1),
			p: c(G),
			py: c(G) * (1 + d * kappa)
		})
	};
}
