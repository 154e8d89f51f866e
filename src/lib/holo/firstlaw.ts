/**
 * First law of entanglement for the strip at order n and exactly: T_ent, μ and the check δΔS = α δΔE + ζ δΔP_y.
 *
 * Definition (PHYSICS.md, "First law of entanglement"): with ΔE = l T_tt and ΔP_y = l T^{ty}, α and ζ solve
 * δΔS = α δΔE + ζ δΔP_y for the variations of the bulk's two parameters at fixed l; T_ent = 1/α, μ = −ζ/α.
 * Static bulks (brane, boosted at v = 0, charged at d = 2 with q = 0) use the one-parameter form: α = δΔS/δΔE,
 * μ = 0. The charged brane (d ≥ 3) has the same two-parameter form with the charge ΔQ in place of ΔP_y.
 *
 * Parameters. The brane, the boosted brane and the wave are one family of slices
 *   f = 1 − w z^d,  h = 1 + q z^d,  w = zh^{−d},  q = γ²v² zh^{−d}   (wave: w = 0, q = zp^{−d}),
 * linear in (w, q); with ê = 16πG ΔE, p̂ = 16πG ΔP_y (v ≥ 0):
 *   ê = l[(d−1)w + d q],  p̂ = l d √(q(q+w))      (T_tt = (dγ²−1)/(16πG zh^d), T^{ty} = dγ²v/(16πG zh^d)).
 * The linear relation does not depend on the coordinates used on parameter space, so it is solved in (w, q):
 *   4π ∂ΔA = α ∂ê + ζ ∂p̂ for ∂ = ∂_w, ∂_q (G cancels). For the wave this is the v → 1 limit of the boosted
 * answer at fixed zp (derived here; the w-direction is "switch on a temperature"). v < 0: ΔS is even and
 * ΔP_y odd in v, so ζ flips sign.
 *
 * Order n: ΔA⁽ⁿ⁾ = l^{2−d} Σ_{k≤n} Σ_{j≤k} c_kj w^{k−j} q^j l^{kd}, where c_kj are the coefficients of κ^j
 * in core's boosted a_k(κ) (boostedCoeffPolys); its w- and q-derivatives are differentiated term by term.
 * In x = (l/zh)^d (wave: x = (l/zp)^d) α and ζ are then l·(polynomials of degree n−1 in x).
 *
 * Exact: by extremality, at fixed l the derivative of the area is the explicit parameter derivative of the
 * area functional on the solution (boundary data held fixed). For the functional √(h/z^m)√(x'² + 1/f),
 * m = 2(d−1), with u = z/z*, N(u) = h(uz*)u^{−m} − h(z*):
 *   ∂_λ A = z*^{2−d} ∫₀¹ [ ∂_λh(uz*) u^{−m} / √(f N) − ∂_λf(uz*) √N / f^{3/2} ] du
 * (derived; checked in the tests against finite differences of core's exact ΔA). Both integrands are finite
 * at u = 0; the quadrature uses core's substitutions (u = 1 − s², then s = a sinh σ with a = √(f_* / (z_* |f'_*|))
 * near a horizon) with 24-point Gauss–Legendre panels, and differences are formed from the power terms with
 * expm1/log1p. Accuracy (measured in the tests): exact α, ζ agree with 25-digit mpmath central differences
 * of the exact ΔA in (zh, v) to 3e-11 relative (that comparison's own limit), and ∂_wΔA, ∂_qΔA with
 * Richardson differences of core's ΔA to 1e-9; expect degradation only within ~1% of the horizon.
 * Caveat: the wave's order-1 α is 4π a₁ l (d−3)/((d−1)(d−2)) — zero at d = 3, where T_ent⁽¹⁾ is infinite.
 *
 * Charged brane (two parameters, zh and q): the charge moves along any variation of zh or q, so the relation is
 *   δΔS = α δΔE + β δΔQ,  T_ent = 1/α,  μ_Q = −β/α   (T_ent ΔS = ΔE − μ_Q ΔQ at first order in the variation),
 * with ΔE = l e, ΔQ = l ρ and the normalisation of chargedThermo (bulks/charged.ts): action
 * (1/16πG)∫√−g (R + d(d−1) − F²), A_t = μ(1 − (z/zh)^{d−2}), μ = g_d q/zh, g_d = √((d−1)/(2(d−2))),
 * ρ̂ = 16πG ρ = 2(d−1) q/(g_d zh^{d−1}). Only μ_Q ΔQ is convention-free (a different Maxwell normalisation
 * rescales μ and ρ inversely). In (w, q), w = zh^{−d}: ê = l(d−1)(1+q²) w, ρ̂ l = l 2(d−1) q w^{(d−1)/d}/g_d,
 * and 4π ∂ΔA = α ∂ê + β ∂(ρ̂ l) for ∂ = ∂_w, ∂_q — the same linear algebra as the boost, with ΔP_y → ΔQ.
 * Order n: ΔA⁽ⁿ⁾ = l^{2−d} Σ_{K≤nd} c_K(q²) (l/zh)^K (series/charged.ts) gives, with x = l/zh,
 *   ∂_wΔA = l² Σ_K (K/d) c_K x^{K−d},   ∂_qΔA = l² w Σ_K ∂_q c_K x^{K−d},
 * so for charged the arrays of FirstLawSeries run over every power of x = l/zh (not (l/zh)^d) up to nd − d.
 * At first order only the z^d term of f enters, ΔA⁽¹⁾ ∝ ê: α = l/c_d (BNTU) and β = 0 for every q.
 * Large l: ΔA → l s_A + const (s_A = zh^{1−d}), so α → 1/T_H and μ_Q → μ by the thermodynamic first law
 * de = T ds + μ dρ, with 1/l corrections (tested at l = 20 zh). Exact: ∂_wΔA = −(zh^{d+1}/d) ∂_zhΔA and ∂_qΔA
 * by the extremality formula above. No bulk here is both boosted and charged, so there is no three-term law.
 */
import { metricModelOf } from './bulks/metric';
import { HoloError } from './errors';
import { metricAlongLaw, type AlongLaw } from './metric/along';
import { metricFirstLaw } from './metric/firstlaw';
import { MAX_ASKED_ORDER } from './limits';
import { solveStrip } from './strip';
import { areaParameterDerivative } from './dparam';
import { boostedCoeffPolys, seriesCoeffs } from './series/index';
import type { Bulk, FirstLawFamily, SeriesCoeff, SliceVariation } from './types';

export type Order = number | 'exact';
type Family = FirstLawFamily;

/** The bulk's first-law family (its parameters, slopes and slice variations live on the bulk). */
function familyOf(bulk: Bulk): Family {
	if (!bulk.firstLaw) {
		throw new HoloError(`the first law is defined here for brane, boosted, wave and charged, not ${bulk.name}`, 'bulk');
	}
	return bulk.firstLaw;
}

function checkOrder(order: Order): void {
	if (order === 'exact') return;
	if (!Number.isInteger(order) || order < 1 || order > MAX_ASKED_ORDER) {
		throw new HoloError(
			`order must be an integer 1…${MAX_ASKED_ORDER} or exact`,
			'o',
			order === 0 ? 'order 0 is the vacuum: ΔS = 0' : undefined
		);
	}
}

// the extremality integral ∂_λ A at fixed l lives in dparam.ts, shared with dAreaDParam
export { areaParameterDerivative };

/** Exact ∂ΔA/∂w and ∂ΔA/∂q by extremality, from the family's slice variations (the vacuum part does not move). */
function exactGradient(bulk: Bulk, F: Family, l: number): { Aw: number; Aq: number } {
	const sol = solveStrip(bulk.slice, l);
	const along = (v: SliceVariation) => (v.df.length || v.dh.length ? areaParameterDerivative(bulk.slice, sol.point, v.df, v.dh) : 0);
	return { Aw: along(F.variations.w), Aq: along(F.variations.q) };
}

/** c_kj = coefficient of κ^j in a_k(κ), rows k = 1…n (core's closed-form boosted coefficients). */
export function coefficientTable(d: number, n: number): number[][] {
	const rows = boostedCoeffPolys(d, n);
	if (rows.length < n) throw new HoloError(`series coefficients missing beyond order ${rows.length}`, 'o');
	return rows.slice(0, n);
}

export interface FirstLawSeries {
	/** the expansion variable x = (l/zh)^d, or (l/zp)^d for the wave; charged: x = l/zh (every power up to nd − d) */
	x: number;
	variable: string;
	/** α = l Σ alpha[i] x^i, ζ = l Σ zeta[i] x^i (i = 0…n−1) */
	alpha: number[];
	zeta: number[];
	/** T_ent = (1/l) Σ tent[i] x^i and μ = Σ mu[i] x^i: the reciprocal and quotient series to the same order */
	tent: number[];
	mu: number[];
	/** ∂ΔA/∂w = l² Σ W[i] x^i and ∂ΔA/∂q = l² Σ Q[i] x^i */
	W: number[];
	Q: number[];
	/** the truncated ΔA series used: core's a_k with their exact LaTeX (ΔA = l^{2−d} Σ a_k x^k) */
	terms: SeriesCoeff[];
}

export interface FirstLawCoefficients {
	order: Order;
	l: number;
	alpha: number;
	zeta: number;
	tent: number;
	mu: number;
	twoParameter: boolean;
	/** what μ is conjugate to: ΔP_y (boosted, wave), ΔQ (charged), nothing (static: μ = 0) */
	conjugate: 'momentum' | 'charge' | null;
	/** ∂ΔA/∂w, ∂ΔA/∂q at this order (or exact) */
	Aw: number;
	Aq: number;
	series?: FirstLawSeries;
	/** a metric along its named parameters: every direction's numbers (metric/along.ts) */
	along?: AlongLaw;
}

/** The order-n series of ∂_wΔA, ∂_qΔA, α, ζ, T_ent and μ in x (module comment). */
export function firstLawSeries(bulk: Bulk, l: number, n: number): FirstLawSeries {
	checkOrder(n);
	const F = familyOf(bulk);
	if (F.kind === 'charged') return chargedSeries(bulk, F, l, n);
	// static bulks need only a_k(0) = c_k0, which core also serves at d = 2 (BTZ closed form)
	const c = F.kind === 'static' ? seriesCoeffs(bulk, n).map((t) => [t.value]) : coefficientTable(bulk.d, n);
	const kappa = F.kind === 'wave' ? Infinity : F.w > 0 ? F.q / F.w : 0;
	const W: number[] = [];
	const Q: number[] = [];
	for (let k = 1; k <= n; k++) {
		const row = c[k - 1];
		if (F.kind === 'wave') {
			W.push(row[k - 1] ?? 0);
			Q.push(k * (row[k] ?? 0));
		} else {
			let sw = 0;
			let sq = 0;
			for (let j = 0; j < row.length; j++) {
				sw += row[j] * (k - j) * Math.pow(kappa, j);
				if (j > 0) sq += row[j] * j * Math.pow(kappa, j - 1);
			}
			W.push(sw);
			Q.push(sq);
		}
	}
	const { E1, E2, P1, P2 } = F.slopes;
	let alpha: number[];
	let zeta: number[];
	if (F.kind === 'static') {
		alpha = W.map((x) => (4 * Math.PI * x) / E1);
		zeta = W.map(() => 0);
	} else {
		const D = E1 * P2 - E2 * P1;
		alpha = W.map((x, i) => ((4 * Math.PI) / D) * (x * P2 - Q[i] * P1));
		zeta = W.map((x, i) => ((4 * Math.PI) / D) * F.sign * (E1 * Q[i] - E2 * x));
	}
	const tent = reciprocalSeries(alpha);
	const mu = multiplySeries(zeta, tent).map((v) => -v);
	const x = Math.pow(l / F.scale, bulk.d);
	const terms = seriesCoeffs(bulk, n);
	return { x, variable: F.kind === 'wave' ? '(l/z_p)^d' : '(l/z_h)^d', alpha, zeta, tent, mu, W, Q, terms };
}

/**
 * Charged brane, order n, in x = l/zh (module comment): W[K−d] = (K/d) c_K, Q[K−d] = w ∂_q c_K with
 * ∂_q c_K = 2q Σ_j j p_j (q²)^{j−1} from the q²-polynomial of c_K; α, β (here `zeta`) solved as for the boost.
 */
function chargedSeries(bulk: Bulk, F: Family, l: number, n: number): FirstLawSeries {
	const d = bulk.d;
	const q = F.charge as number;
	const q2 = q * q;
	const terms = seriesCoeffs(bulk, n);
	const W = new Array<number>(n * d - d + 1).fill(0);
	const Q = W.slice();
	for (const t of terms) {
		const i = (t.power as number) - d;
		W[i] += ((t.power as number) / d) * t.value;
		const poly = t.poly ?? [t.value];
		let dq = 0;
		for (let j = poly.length - 1; j >= 1; j--) dq = dq * q2 + j * poly[j];
		Q[i] += F.w * 2 * q * dq;
	}
	const { E1, E2, P1, P2 } = F.slopes;
	const D = E1 * P2 - E2 * P1;
	const alpha = W.map((x, i) => ((4 * Math.PI) / D) * (x * P2 - Q[i] * P1));
	const zeta = W.map((x, i) => ((4 * Math.PI) / D) * (E1 * Q[i] - E2 * x));
	// the first term is ∝ ê exactly (c_d = a₁(1+q²)): β₀ = 0 analytically, not up to rounding
	zeta[0] = 0;
	const tent = reciprocalSeries(alpha);
	const mu = multiplySeries(zeta, tent).map((v) => -v);
	return { x: l / F.scale, variable: '(l/z_h)', alpha, zeta, tent, mu, W, Q, terms };
}

/** 1/Σ a_i x^i to the same length (a_0 ≠ 0). */
export function reciprocalSeries(a: number[]): number[] {
	const b = [1 / a[0]];
	for (let i = 1; i < a.length; i++) {
		let s = 0;
		for (let j = 1; j <= i; j++) s += a[j] * b[i - j];
		b.push(-s / a[0]);
	}
	return b;
}

function multiplySeries(a: number[], b: number[]): number[] {
	return a.map((_, i) => {
		let s = 0;
		for (let j = 0; j <= i; j++) s += a[j] * b[i - j];
		return s;
	});
}

const sumSeries = (a: number[], x: number) => a.reduce((s, v, i) => s + v * Math.pow(x, i), 0);

/** α, ζ, T_ent = 1/α and μ = −ζ/α at order n (1…MAX_ASKED_ORDER) or 'exact'. G cancels. */
export function firstLawCoefficients(bulk: Bulk, l: number, order: Order, along?: string[]): FirstLawCoefficients {
	checkOrder(order);
	if (!(l > 0) || !Number.isFinite(l)) throw new HoloError('l must be a positive number', 'l');
	const law = alongLaw(bulk, l, order, along);
	if (law) return alongCoefficients(law, l, order);
	const metric = metricLaw(bulk, l, order);
	if (metric) {
		const { alpha, dA } = metric;
		return { order, l, alpha, zeta: 0, tent: 1 / alpha, mu: 0, twoParameter: false, conjugate: null, Aw: dA, Aq: 0 };
	}
	const F = familyOf(bulk);
	const twoParameter = F.kind === 'boosted' || F.kind === 'wave' || F.kind === 'charged';
	let Aw: number;
	let Aq: number;
	let series: FirstLawSeries | undefined;
	if (order === 'exact') {
		({ Aw, Aq } = exactGradient(bulk, F, l));
	} else {
		series = firstLawSeries(bulk, l, order);
		Aw = l * l * sumSeries(series.W, series.x);
		Aq = l * l * sumSeries(series.Q, series.x);
	}
	const { E1, E2, P1, P2 } = F.slopes;
	let alpha: number;
	let zeta = 0;
	if (!twoParameter) alpha = (4 * Math.PI * Aw) / (l * E1);
	else if (series && F.kind === 'charged') {
		// summed from the per-power series so that order 1 keeps β = 0 exactly
		alpha = l * sumSeries(series.alpha, series.x);
		zeta = l * sumSeries(series.zeta, series.x);
	} else {
		const D = l * (E1 * P2 - E2 * P1);
		alpha = (4 * Math.PI * (Aw * P2 - Aq * P1)) / D;
		zeta = (F.sign * 4 * Math.PI * (E1 * Aq - E2 * Aw)) / D;
	}
	const conjugate = F.kind === 'charged' ? 'charge' : twoParameter ? 'momentum' : null;
	return { order, l, alpha, zeta, tent: 1 / alpha, mu: zeta === 0 ? 0 : -zeta / alpha, twoParameter, conjugate, Aw, Aq, series };
}

/**
 * A custom metric's first law along its scale direction (metric/firstlaw.ts): its family is not one of the
 * (w, q) families (a black-box f has no power terms to vary, and its series mixes every power), so it is
 * solved there; undefined for every other bulk.
 */
function metricLaw(bulk: Bulk, l: number, order: Order, G = 1) {
	const data = metricModelOf(bulk);
	return data && metricFirstLaw(bulk, data.model, l, order, G);
}

/**
 * A metric's first law along its named parameters (metric/along.ts), or undefined without along=; along= on
 * any other bulk is an error naming the key (their parameter directions are fixed by their family).
 */
function alongLaw(bulk: Bulk, l: number, order: Order, along: string[] | undefined): AlongLaw | undefined {
	if (along === undefined) return undefined;
	const data = metricModelOf(bulk);
	if (!data)
		throw new HoloError(
			`along= names a metric's parameters; ${bulk.name} has its own fixed directions`,
			'along',
			'use metric d=… f="…" with named parameters'
		);
	if (data.model.symbols.length)
		throw new HoloError(`${data.model.symbols.join(', ')} need numbers for the first law`, data.model.symbols[0]!);
	return metricAlongLaw(bulk, data.model, along, l, order, MAX_ASKED_ORDER);
}

function alongCoefficients(law: AlongLaw, l: number, order: Order): FirstLawCoefficients {
	const two = law.params.length > 1;
	return {
		order,
		l,
		alpha: law.alpha,
		zeta: two ? law.beta[1]! : 0,
		tent: 1 / law.alpha,
		mu: two ? law.mu[1]! : 0,
		twoParameter: two,
		conjugate: two ? 'charge' : null,
		Aw: law.dA[0]!,
		Aq: two ? law.dA[1]! : 0,
		along: law
	};
}

export interface TentResult {
	value: number;
	order: Order;
	series?: FirstLawSeries;
}

/** Entanglement temperature T_ent = 1/α at order n or exact. */
export function tent(bulk: Bulk, l: number, order: Order, along?: string[]): TentResult {
	const r = firstLawCoefficients(bulk, l, order, along);
	return { value: r.tent, order, series: r.series };
}

export type MuOf = 'momentum' | 'charge';

/**
 * Chemical potential μ = −ζ/α at order n or exact, conjugate to ΔP_y (boosted, wave; 0 for the static brane)
 * or to ΔQ (charged: μ_Q). `of` names which; asking for the one a bulk does not carry is an error, not a 0.
 */
export function mu(bulk: Bulk, l: number, order: Order, of?: MuOf, along?: string[]): TentResult & { of: MuOf; param?: string } {
	if (along !== undefined) {
		// μ of the second listed parameter (metric/along.ts): along=m,q gives μ_q
		const r = firstLawCoefficients(bulk, l, order, along);
		const law = r.along!;
		if (law.params.length < 2)
			throw new HoloError(
				'mu along= needs two parameters: the first carries the energy, μ is the second’s',
				'along',
				'e.g. mu l=0.5 along=m,q'
			);
		if (of === 'momentum')
			throw new HoloError('a static metric carries no momentum: its μ is conjugate to a parameter', 'of', 'leave out of=');
		return { value: r.mu, order, of: 'charge', param: law.params[1] };
	}
	const charged = bulk.name === 'charged' && bulk.d > 2;
	const want: MuOf = of ?? (charged ? 'charge' : 'momentum');
	if (want === 'charge' && !charged) {
		throw new HoloError(
			`the ${bulk.name} bulk carries no charge: μ_Q is defined for charged (d ≥ 3)`,
			'of',
			'use of=momentum, or use charged …'
		);
	}
	if (want === 'momentum' && charged) {
		throw new HoloError('the charged brane carries no momentum along y: its μ is conjugate to the charge', 'of', 'use of=charge');
	}
	const r = firstLawCoefficients(bulk, l, order);
	return { value: r.mu, order, series: r.series, of: want };
}

export interface FirstLawDirection {
	/** δΔS of the reference: order n+1 (or exact when order = 'exact') */
	lhs: number;
	/** α δΔE + ζ δΔP_y with this order's α, ζ */
	rhs: number;
	residual: number;
	/** δΔS_exact − rhs: the order-n relation against the exact ΔS */
	residualExact: number;
}

export interface FirstLawCheck extends FirstLawCoefficients {
	/** variation (δw, δq) = (w, q): δ ln zh = −1/d at fixed v (wave: δ ln zp = −1/d) */
	scale: FirstLawDirection;
	/** second direction of a two-parameter bulk: boosted (0, q) (κ only), wave (q, 0) (switch on a temperature) */
	shape?: FirstLawDirection;
	/** a metric along its named parameters: one direction per listed parameter (δp_i = 1), `scale` = the first */
	directions?: FirstLawDirection[];
	G: number;
}

/**
 * The first law at order n checked against order n+1 and against the exact ΔS, per unit variation along
 * the directions named in FirstLawCheck. By construction the order-n relation holds exactly for ΔS⁽ⁿ⁾, so
 * `residual` is the variation of the (n+1)-th term: at fixed l it scales like (l/zh)^{(n+1)d}.
 */
export function firstLaw(bulk: Bulk, l: number, order: Order, G = 1, along?: string[]): FirstLawCheck {
	if (!(G > 0) || !Number.isFinite(G)) throw new HoloError('G must be positive', 'G');
	if (along !== undefined) {
		checkOrder(order);
		if (!(l > 0) || !Number.isFinite(l)) throw new HoloError('l must be a positive number', 'l');
		const law = alongLaw(bulk, l, order, along)!;
		const co = alongCoefficients(law, l, order);
		// direction i: δp_i = 1; δΔE = l e_i/(16πG), δΔX_j = l δ_ij/(16πG); the residual is the next order's part
		const dirs = law.params.map((_, i): FirstLawDirection => {
			const rhs = (law.alpha * l * law.e[i]! + (i > 0 ? law.beta[i]! * l : 0)) / (16 * Math.PI * G);
			const lhs = law.dARef[i]! / (4 * G);
			const residual = law.dANext ? law.dANext[i]! / (4 * G) : lhs - rhs;
			const residualExact = law.dAExact ? law.dAExact[i]! / (4 * G) - rhs : NaN;
			return { lhs, rhs, residual, residualExact };
		});
		return { ...co, G, scale: dirs[0]!, shape: dirs[1], directions: dirs };
	}
	const metric = metricLaw(bulk, l, order, G);
	if (metric) {
		// the scale direction δλ = 1/d (metric/firstlaw.ts): δΔE = l T_tt, δΔS = ∂_λΔA/(4G d)
		const { alpha, dA, dARef, dAExact, dANext, Ttt } = metric;
		const d = bulk.d;
		const rhs = alpha * l * Ttt;
		const lhs = dARef / (4 * G * d);
		const residual = dANext === undefined ? lhs - rhs : dANext / (4 * G * d);
		const scale = { lhs, rhs, residual, residualExact: dAExact / (4 * G * d) - rhs };
		return { order, l, alpha, zeta: 0, tent: 1 / alpha, mu: 0, twoParameter: false, conjugate: null, Aw: dA, Aq: 0, G, scale };
	}
	const F = familyOf(bulk);
	const co = firstLawCoefficients(bulk, l, order);
	const ex = order === 'exact' ? co : firstLawCoefficients(bulk, l, 'exact');
	const ref = order === 'exact' ? co : order < MAX_ASKED_ORDER ? firstLawCoefficients(bulk, l, order + 1) : ex;
	const { E1, E2, P1, P2 } = F.slopes;
	// the (n+1)-th term of ∂ΔA, formed directly so that the residual carries no cancellation error
	const next = typeof order === 'number' && order < MAX_ASKED_ORDER ? firstLawSeries(bulk, l, order + 1) : undefined;
	const dir = (dw: number, dq: number): FirstLawDirection => {
		const sgn = F.sign;
		const dE = (l * (E1 * dw + E2 * dq)) / (16 * Math.PI * G);
		const dP = co.twoParameter ? (sgn * l * (P1 * dw + P2 * dq)) / (16 * Math.PI * G) : 0;
		const rhs = co.alpha * dE + co.zeta * dP;
		const lhs = (ref.Aw * dw + ref.Aq * dq) / (4 * G);
		const exact = (ex.Aw * dw + ex.Aq * dq) / (4 * G);
		// the terms order n+1 adds: index n for the one-power bulks, every power of l/zh in (nd − d, nd] for charged
		let add = 0;
		if (next) for (let i = co.series!.W.length; i < next.W.length; i++) add += Math.pow(next.x, i) * (next.W[i] * dw + next.Q[i] * dq);
		const residual = next ? (l * l * add) / (4 * G) : lhs - rhs;
		return { lhs, rhs, residual, residualExact: exact - rhs };
	};
	// charged: scale δw = w (δ ln zh = −1/d at fixed q, F.q = 0), second direction δq = 1 at fixed zh
	const scale = dir(F.w, F.q);
	const shape = F.kind === 'boosted' ? dir(0, F.q) : F.kind === 'wave' ? dir(F.q, 0) : F.kind === 'charged' ? dir(0, 1) : undefined;
	return { ...co, G, scale, shape };
}
