import { vacuumWidthFactor } from '../strip';
import { criticalBranch, criticalForWidth } from './climb';
import { surfaceAt, surfaceExists, type Surface } from './family';
import { QUAD_TOL, integrateAdaptive } from './quad';

/** ln(l(z*)/l) past the edge of the family (no surface): l grows without bound towards that edge (the surface
 * then hugs a critical surface z_m and its width diverges like −ln of the distance), so "too wide" is the
 * right side to put it on. */
const PAST_EDGE = 40;

/**
 * The surface of width l (units zh = 1) that crosses the shell at fraction ζ: a safeguarded secant in x = ln z*
 * on ln(l(x)/l), from `guess` (the previous ζ's tip in a scan, else the vacuum tip l/W₀). At fixed ζ the width
 * grows monotonically with the tip up to the family's edge (seen in every scan of the tests).
 *
 * Near that edge (the surfaces of the linear-growth regime, and every climbing surface of a wide strip) the width
 * diverges like −C ln(x_e − x), so the tip sits within 1e−10 or less of x_e and a secant in x crawls there by
 * bisection, and a double x cannot get closer than rounding (that bounded the width: 10–17 zh at d = 3). So a probe
 * that is a critical surface (climb.ts criticalBranch: every a > 1, and a < 1 with P(u_m) small), or a critical
 * guess, hands the solve to climb.ts (λ, in which the width is linear and unbounded); once a step lands past the
 * edge, x_e is located to rounding by bisection on the integral-free existence test (surfaceExists) and the
 * critical solve starts there, with the older search in y = ln(x_e − x) as the fallback.
 */
export function surfaceForWidth(d: number, l: number, zeta: number, guess?: number | Surface, loose?: number): Surface | null {
	const s = solveTip(d, l, zeta, guess, loose);
	// a width the search could not reach (rounding of the tip at the edge, no λ on the branch) is no surface of
	// this strip: curves skip it rather than carry a point of another width
	return s && Math.abs(s.l / l - 1) <= Math.max(1e-9, 10 * (loose ?? 0)) ? s : null;
}

/** `loose`: stop at |ln(l(x)/l)| < loose with the integrals to the same (a curve's bracketing point, curve.ts). */
function solveTip(d: number, l: number, zeta: number, guess?: number | Surface, loose?: number): Surface | null {
	const stop = loose ?? 1e-15;
	const quadTol = loose ?? QUAD_TOL;
	// a critical neighbour (climb.ts) as the guess: its branch and λ lead straight to this ζ's surface
	const hint = typeof guess === 'object' ? guess : undefined;
	if (hint?.critical) {
		const s = criticalForWidth(d, l, zeta, Math.log(hint.zstar), hint.critical.branch, hint.critical.lam, loose);
		if (s) return s;
	}
	const lnl = Math.log(l);
	let tried = false;
	const g = (x: number): { v: number; s: Surface | null } => {
		// once a probe is a critical surface (climb.ts), the rest of the solve is in its λ (tried once)
		const branch = tried ? null : criticalBranch(d, Math.exp(x), zeta);
		if (branch) {
			tried = true;
			const c = criticalForWidth(d, l, zeta, x, branch, undefined, loose);
			if (c) return { v: 0, s: c };
		}
		const s = surfaceAt(d, Math.exp(x), zeta, quadTol);
		return s ? { v: Math.log(s.l) - lnl, s } : { v: PAST_EDGE, s: null };
	};
	// a valid start: from the guess, smaller tips until a surface exists (the family's edge is on the wide side)
	let xa = Math.log(typeof guess === 'object' ? guess.zstar : (guess ?? l / vacuumWidthFactor(d)));
	let a = g(xa);
	for (let k = 0; !a.s; k++) {
		if (k > 60) return null;
		xa -= 0.05 * Math.pow(1.5, k);
		a = g(xa);
	}
	// safeguarded secant on ln(l(x)/l), x = ln z* (ln l is close to linear in x, slope ≈ 1 far from the edge): the
	// bracket [lo, hi] (hi = wider than l, or past the edge) takes a bisection whenever the secant leaves it
	let lo = a.v < 0 ? xa : -Infinity;
	let hi = a.v > 0 ? xa : Infinity;
	let xb = xa - Math.min(Math.max(a.v, -0.5), 0.5);
	for (let k = 0; k < 200; k++) {
		if (Math.abs(a.v) < stop) return a.s;
		const b = g(xb);
		if (!b.s) {
			hi = Math.min(hi, xb);
			if (!surfaceExists(d, Math.exp(xb), zeta)) return nearEdge(d, l, zeta, g, a, xa, lo, xb, loose);
			xb = 0.5 * (xa + xb);
			continue;
		}
		if (b.v < 0) lo = Math.max(lo, xb);
		else hi = Math.min(hi, xb);
		if (Math.abs(b.v) < stop) return b.s;
		let xn = b.v === a.v ? NaN : xb - (b.v * (xb - xa)) / (b.v - a.v);
		if (!(xn > lo && xn < hi)) {
			if (Number.isFinite(lo) && Number.isFinite(hi)) xn = 0.5 * (lo + hi);
			else xn = xb + (b.v < 0 ? 0.5 : -0.5);
		}
		const done = Math.abs(xn - xb) < 1e-14 * Math.max(1, Math.abs(xb));
		xa = xb;
		a = b;
		xb = xn;
		if (done) {
			const last = g(xb);
			return last.s && Math.abs(last.v) <= Math.abs(b.v) ? last.s : b.s;
		}
	}
	return a.s;
}

type Probe = (x: number) => { v: number; s: Surface | null };

/**
 * The rest of surfaceForWidth once the family's edge x_e lies in (x_a, x_past): x_e by bisection on the existence
 * test, then a safeguarded secant on ln(l/l_target) in y = ln(x_e − x) (the width's −C ln(x_e − x) divergence is
 * linear there). `lo` is a tip known to be too narrow (or −∞). A width beyond the doubles' reach of the edge
 * (x_e − x at rounding) returns the widest surface found.
 */
function nearEdge(
	d: number,
	l: number,
	zeta: number,
	g: Probe,
	a: { v: number; s: Surface | null },
	xa: number,
	lo: number,
	xPast: number,
	loose?: number
): Surface | null {
	let ok = xa;
	let bad = xPast;
	for (let k = 0; k < 200 && bad - ok > 4e-16 * Math.max(1, Math.abs(ok)); k++) {
		const m = 0.5 * (ok + bad);
		if (surfaceExists(d, Math.exp(m), zeta)) ok = m;
		else bad = m;
	}
	const xe = bad;
	// a critical surface (climb.ts) reaches any width next to the edge with full accuracy; the secant in y below
	// stays for what it cannot label (then bounded by the rounding of the tip)
	const branch = 0.5 * Math.exp(d * (ok + Math.log(zeta))) > 1 ? 'climb' : 'pass';
	const crit = criticalForWidth(d, l, zeta, ok, branch, undefined, loose);
	if (crit) return crit;
	const yMin = Math.log(4e-16 * Math.max(1, Math.abs(xe)));
	const yOf = (x: number) => Math.log(xe - x);
	// bracket in y: yWide (width above the target: nearer the edge) < yNarrow
	let yNarrow = Number.isFinite(lo) ? yOf(lo) : Infinity;
	let yWide = -Infinity;
	let ya = yOf(xa);
	let pa = a;
	if (pa.v < 0) yNarrow = Math.min(yNarrow, ya);
	else yWide = Math.max(yWide, ya);
	let best = pa;
	let yb = Math.max(yMin, ya - (pa.v < 0 ? 2 : -2));
	for (let k = 0; k < 100; k++) {
		const pb = g(xe - Math.exp(yb));
		if (!pb.s) {
			// rounding put this tip past the edge: treat as wider than any target
			yWide = Math.max(yWide, yb);
			yb = Number.isFinite(yNarrow) ? 0.5 * (yb + yNarrow) : yb + 1;
			continue;
		}
		if (Math.abs(pb.v) < Math.abs(best.v)) best = pb;
		if (Math.abs(pb.v) < (loose ?? 1e-15)) return pb.s;
		if (pb.v < 0) yNarrow = Math.min(yNarrow, yb);
		else yWide = Math.max(yWide, yb);
		let yn = pb.v === pa.v ? NaN : yb - (pb.v * (yb - ya)) / (pb.v - pa.v);
		const lower = Math.max(yWide, yMin);
		if (!(yn > lower && yn < yNarrow)) {
			if (Number.isFinite(yNarrow) && yWide > -Infinity) yn = 0.5 * (yWide + yNarrow);
			else if (pb.v < 0) yn = Math.max(yMin, yb - 2);
			else yn = yb + 2;
		}
		if (pb.v < 0 && yb <= yMin && yn <= yMin) return best.s; // the width needs a tip closer to the edge than rounding
		// the tips of yn and yb are the same double (or next to it): rounding in z* is reached
		if (Math.abs(Math.exp(yn) - Math.exp(yb)) <= 4.5e-16 * Math.max(1, Math.abs(xe))) return best.s;
		ya = yb;
		pa = pb;
		yb = yn;
	}
	return best.s;
}

/** One point of the family at fixed width: ζ = 1 is the static brane surface (reached at t = t_sat). */
export interface CurvePoint {
	zeta: number;
	t: number;
	dA: number;
	surface: Surface | null;
}

/**
 * ∫₀^{z*} dz/f for the brane (units zh = 1): the boundary time at which the static surface of tip z* first lies
 * wholly after the shell (v ≥ 0 at its tip). With 1 − u^d = (1 − u) q(u), q = Σ_{j<d} u^j:
 *   ∫₀^x du/(1 − u^d) = −ln(1 − x)/d + ∫₀^x (d − q)/(d q (1 − u)) du,
 * and (d − q)/(1 − u) = Σ_{j=1}^{d−1} Σ_{i<j} u^i is a polynomial, so the rest is smooth; −ln(1 − x) comes from
 * η = 1 − x kept exact by the strip solver. d = 2: artanh(x) = l/2.
 */
export function saturationTime(d: number, zstar: number, eta: number): number {
	// −ln(1 − x) from η where it is exact (near the horizon), from x itself for small tips (η = 1 − x rounds to 1
	// for x < 1e−16, which made t_sat of a strip of width 1e−20 zh come out (d−1)/d of its value)
	const lead = -(zstar < 0.5 ? Math.log1p(-zstar) : Math.log(eta)) / d;
	const out = new Float64Array(1);
	integrateAdaptive(
		(u, o) => {
			let q = 0;
			let num = 0;
			let pw = 1;
			for (let j = 0; j < d; j++) {
				q += pw;
				num += (d - 1 - j) * pw; // coefficient of u^i in Σ_{j=1}^{d−1} Σ_{i<j} u^i is d − 1 − i
				pw *= u;
			}
			o[0] = num / (d * q);
			return true;
		},
		0,
		zstar,
		1,
		out
	);
	return lead + out[0];
}
