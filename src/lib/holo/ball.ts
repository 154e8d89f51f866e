/**
 * Balls: the RT surface of a ball of radius R on a constant-t slice (whole ball, not per unit volume).
 *
 * Slice: (1/z²)(dz²/f + dr² + r² dΩ²_{d−2}) with f = 1 − w z^d, w = zh^{−d} (the brane, PHYSICS.md).
 * Area: A = Ω_{d−2} ∫ r^{d−2} z^{1−d} √(dr² + dz²/f), Ω_{d−2} = 2π^{(d−1)/2}/Γ((d−1)/2).
 *
 * Vacuum (f = 1): the hemisphere r² + z² = R² (Ryu & Takayanagi, JHEP 08 (2006) 045). With x = z/R,
 *   A = Ω_{d−2} ∫_{ε/R}^{1} (1−x²)^{(d−3)/2} x^{1−d} dx.
 * Finite part (our scheme, stated because a ball has several divergences): drop every negative power of ε
 * and, for even d, the term proportional to ln(R/ε); what remains as ε → 0 is R-independent:
 *   odd d:  A_fin = (Ω_{d−2}/2) Γ(1−d/2) Γ((d−1)/2) / Γ(1/2)                (analytic continuation of B/2)
 *   even d: A_fin = (Ω_{d−2}/2) (−1)^m Γ((d−1)/2) [ψ(m+1) − ψ(1/2)] / (m! Γ(1/2)),  m = d/2 − 1
 * (the constant of the Laurent expansion of B(s,(d−1)/2)/2 at s = 1 − d/2; derived, checked against a
 * direct mpmath integration in tests/fixtures/holo/analysis/ball_vacuum.py).
 *
 * First order in the brane: ΔA = Ω_{d−2} R^d/(2(d+1) zh^d), and with ΔE = (volume)·ε the first law holds
 * with T_ent = (d+1)/(2πR) (Blanco, Casini, Hung & Myers, JHEP 08 (2013) 060).
 *
 * Exact ΔA in the brane: ball-shot.ts (one shooting pass per Newton step on the tip, ΔA integrated cutoff-free
 * along it; ≤ 1e-10 relative against the mpmath fixtures of tests/fixtures/holo/ball_runner.py). The earlier
 * method — ∂_w A integrated over w with a Brent search per node — lives on in ball-w.ts as the tests' independent
 * check.
 */
import { HoloError } from './errors';
import { gamma } from './special/gamma';
import { solveBall } from './ball-shot';

/** Area of the unit sphere S^{n}: 2π^{(n+1)/2}/Γ((n+1)/2). */
export function sphereArea(n: number): number {
	return (2 * Math.pow(Math.PI, (n + 1) / 2)) / gamma((n + 1) / 2);
}

function digamma(x: number): number {
	// ψ at the integer and half-integer points needed here, exactly from the recurrences.
	const EULER = 0.5772156649015329;
	if (x === Math.floor(x) && x > 0) {
		let s = -EULER;
		for (let k = 1; k < x; k++) s += 1 / k;
		return s;
	}
	if (x - 0.5 === Math.floor(x - 0.5) && x > 0) {
		let s = -EULER - 2 * Math.LN2;
		for (let k = 0; k < x - 0.5; k++) s += 1 / (k + 0.5);
		return s;
	}
	throw new RangeError('digamma: only integers and half-integers are needed here');
}

function checkD(d: number): void {
	if (!Number.isInteger(d) || d < 3 || d > 10)
		throw new HoloError('a ball needs an integer d with 3 ≤ d ≤ 10', 'd', 'for d = 2 a ball is an interval: use strip');
}

/** Finite part of the ball's RT area in AdS_{d+1} (scheme in the module comment); independent of R. */
export function ballVacuumAreaFinite(d: number): number {
	checkD(d);
	const om = sphereArea(d - 2);
	const b = (d - 1) / 2;
	if (d % 2 === 1) return ((om / 2) * (gamma(1 - d / 2) * gamma(b))) / Math.sqrt(Math.PI);
	const m = d / 2 - 1;
	return ((om / 2) * Math.pow(-1, m) * gamma(b) * (digamma(m + 1) - digamma(0.5))) / (gamma(m + 1) * Math.sqrt(Math.PI));
}

/** Coefficient of ln(R/ε) in the vacuum ball area (0 for odd d): Ω_{d−2}·(−1)^m·binom((d−3)/2, m). */
export function ballLogCoefficient(d: number): number {
	checkD(d);
	if (d % 2 === 1) return 0;
	const m = d / 2 - 1;
	let binom = 1;
	for (let k = 0; k < m; k++) binom *= ((d - 3) / 2 - k) / (k + 1);
	return sphereArea(d - 2) * Math.pow(-1, m) * binom;
}

/** First-order change of the ball area in the brane, whole ball (Blanco–Casini–Hung–Myers 2013). */
export function ballDeltaAreaFirstOrder(d: number, R: number, zh: number): number {
	checkD(d);
	return (sphereArea(d - 2) * Math.pow(R, d)) / (2 * (d + 1) * Math.pow(zh, d));
}

/** Entanglement temperature of a ball, T = (d+1)/(2πR) (Blanco, Casini, Hung & Myers, JHEP 08 (2013) 060). */
export function ballTent(d: number, R: number): number {
	if (!(R > 0)) throw new HoloError('R must be > 0', 'R');
	return (d + 1) / (2 * Math.PI * R);
}

/** ΔE of a ball in the brane: energy density (d−1)/(16πG zh^d) times the ball's volume Ω_{d−2}R^{d−1}/(d−1). */
export function ballEnergy(d: number, R: number, zh: number, G = 1): number {
	checkD(d);
	return (sphereArea(d - 2) * Math.pow(R, d - 1)) / (16 * Math.PI * G * Math.pow(zh, d));
}

/** Tip depth z0 of the brane's ball surface of radius R (Newton on the shooting map, ball-shot.ts). */
export function ballTip(d: number, R: number, zh: number, rtol = 1e-12): number {
	checkD(d);
	if (!(R > 0)) throw new HoloError('R must be > 0', 'R');
	if (!(zh > 0)) throw new HoloError('zh must be > 0', 'zh');
	if (!Number.isFinite(zh)) return R;
	return solveBall(d, R, zh, rtol).z0;
}

export interface BallDeltaArea {
	value: number;
	/** size of the corrections applied after the last shot (Newton's last step, the tail below the landing) */
	error: number;
	firstOrder: number;
	/** where the tip sits, logit (z0/zh)^d: pass it back as `from` for the next ball of a sweep */
	from?: number;
}

/**
 * Exact ΔA = A_fin(brane) − A_fin(vacuum) of a ball of radius R, cutoff-free (ball-shot.ts). `from` (the previous
 * answer's `from`) starts Newton next to a neighbouring ball, as a sweep in R does.
 */
export function ballDeltaArea(d: number, R: number, zh: number, rtol = 1e-12, from?: number): BallDeltaArea {
	checkD(d);
	if (!(R > 0)) throw new HoloError('R must be > 0', 'R');
	if (!(zh > 0)) throw new HoloError('zh must be > 0', 'zh');
	const om = sphereArea(d - 2);
	const firstOrder = ballDeltaAreaFirstOrder(d, R, zh);
	if (!Number.isFinite(zh)) return { value: 0, error: 0, firstOrder };
	const s = solveBall(d, R, zh, rtol, from, false);
	return { value: om * s.K, error: om * s.correction, firstOrder, from: Number.isNaN(s.v) ? undefined : s.v };
}

/**
 * The tips a sweep has found so far, newest last, for the next ball's Newton start: v = logit (z0/zh)^d as a
 * function of ln(R/zh) is smooth (≈ d ln x for small balls, ≈ κx for large ones), so a quadratic through the last
 * three tips lands ~1e-6 from the next one on a 200-point sweep, and Newton needs 2 shots instead of 4–5.
 */
export interface BallTrail {
	d: number;
	lx: number[];
	v: number[];
}

/** Where the next ball of a sweep starts Newton (undefined: cold). Deterministic for the same trail. */
export function ballStartFrom(trail: BallTrail | undefined, d: number, R: number, zh: number): number | undefined {
	if (!trail || trail.d !== d || trail.v.length === 0) return undefined;
	const x = Math.log(R / zh);
	const { lx, v } = trail;
	const n = v.length;
	const last = v[n - 1]!;
	if (n < 3) return last;
	const [x0, x1, x2] = [lx[n - 3]!, lx[n - 2]!, lx[n - 1]!];
	const h = x2 - x1;
	// extrapolate only a step or two onwards in the sweep's own direction; any other jump starts from the last tip
	if (!(h !== 0 && (x - x2) / h > 0 && (x - x2) / h <= 2.5 && (x1 - x0) * h > 0)) return last;
	const [v0, v1, v2] = [v[n - 3]!, v[n - 2]!, v[n - 1]!];
	const l0 = ((x - x1) * (x - x2)) / ((x0 - x1) * (x0 - x2));
	const l1 = ((x - x0) * (x - x2)) / ((x1 - x0) * (x1 - x2));
	const l2 = ((x - x0) * (x - x1)) / ((x2 - x0) * (x2 - x1));
	const guess = l0 * v0 + l1 * v1 + l2 * v2;
	return Number.isFinite(guess) ? guess : last;
}

/** Adds a solved ball to a sweep's trail (a new trail when d changes); keeps the last three. */
export function extendBallTrail(
	trail: BallTrail | undefined,
	d: number,
	R: number,
	zh: number,
	v: number | undefined
): BallTrail | undefined {
	if (v === undefined || !Number.isFinite(v)) return trail;
	const t = trail && trail.d === d ? trail : { d, lx: [], v: [] };
	t.lx.push(Math.log(R / zh));
	t.v.push(v);
	if (t.v.length > 3) {
		t.lx.shift();
		t.v.shift();
	}
	return t;
}

/** Exact ΔA along a list of radii, each ball started from the ones before it. */
export function ballDeltaAreaSweep(d: number, Rs: readonly number[], zh: number, rtol = 1e-12): number[] {
	let trail: BallTrail | undefined;
	return Rs.map((R) => {
		const r = ballDeltaArea(d, R, zh, rtol, ballStartFrom(trail, d, R, zh));
		trail = extendBallTrail(trail, d, R, zh, r.from);
		return r.value;
	});
}
