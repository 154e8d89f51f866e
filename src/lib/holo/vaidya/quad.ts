import { gaussLegendre } from '../numeric/gauss';

/**
 * Adaptive Gauss–Legendre for a few integrals at once over [a, b] (common practice): a panel's 16-point value is
 * compared with the sum over its two halves; a panel is accepted when they agree to `tol` relative to the running
 * scale of each component (`scale`, or the panel value), otherwise both halves recurse. The integrands the
 * quench calls this with are analytic on the interval once the endpoint singularities are mapped away, so most
 * calls settle after one or two levels; the recursion is what resolves the narrow peak of 1/√P near the critical
 * surface (the linear-growth regime). `out` receives the sums; false = a NaN met or the depth was exhausted.
 */
const N = 16;
/** The integrals' relative tolerance for every answer (the quench's surfaces are accurate to about this). */
export const QUAD_TOL = 1e-14;
const MAX_DEPTH = 40;
/** Integrand calls per integral before the remaining panels are accepted as they are (rounding, not truncation,
 * then limits the agreement; reached only on the narrowest peaks of near-critical surfaces). */
const MAX_CALLS = 6000;

export type VecIntegrand = (x: number, out: Float64Array) => boolean;

/**
 * Scratch arrays of one call (the integrand's output, the whole panel, the scale and a pair of halves per depth),
 * reused across calls: a cold quench point makes ~250 calls and fresh arrays for each were a tenth of its time in
 * garbage collection. A call takes a set from the free list and gives it back, so an integrand that itself
 * integrates (none does today) would simply get another set.
 */
interface Scratch {
	k: number;
	tmp: Float64Array;
	whole: Float64Array;
	sc: Float64Array;
	halves: Float64Array[][];
}
const FREE: Scratch[] = [];

function takeScratch(k: number): Scratch {
	const i = FREE.findIndex((s) => s.k === k);
	if (i >= 0) return FREE.splice(i, 1)[0];
	return { k, tmp: new Float64Array(k), whole: new Float64Array(k), sc: new Float64Array(k), halves: [] };
}

export function integrateAdaptive(
	g: VecIntegrand,
	a: number,
	b: number,
	k: number,
	out: Float64Array,
	tol = QUAD_TOL,
	scale?: Float64Array
): boolean {
	const scratch = takeScratch(k);
	try {
		return integrateWith(scratch, g, a, b, k, out, tol, scale);
	} finally {
		if (FREE.length < 8) FREE.push(scratch);
	}
}

function integrateWith(
	scratch: Scratch,
	g: VecIntegrand,
	a: number,
	b: number,
	k: number,
	out: Float64Array,
	tol: number,
	scale?: Float64Array
): boolean {
	const rule = gaussLegendre(N);
	const tmp = scratch.tmp;
	// the halves of each level: the recursion is depth-first and a level's halves are only read before its
	// children run (left) or by the right child itself, so one pair per depth serves every panel (no garbage)
	const halves = scratch.halves;
	const pairAt = (depth: number): Float64Array[] => (halves[depth] ??= [new Float64Array(k), new Float64Array(k)]);
	let calls = 0;
	const sc = scale ?? scratch.sc;
	function panel(lo: number, hi: number, into: Float64Array): boolean {
		into.fill(0);
		const c = 0.5 * (lo + hi);
		const h = 0.5 * (hi - lo);
		calls += N;
		for (let i = 0; i < N; i++) {
			if (!g(c + h * rule.x[i], tmp)) return false;
			const w = h * rule.w[i];
			for (let j = 0; j < k; j++) into[j] += w * tmp[j];
		}
		for (let j = 0; j < k; j++) if (!Number.isFinite(into[j])) return false;
		return true;
	}
	function recurse(lo: number, hi: number, whole: Float64Array, depth: number): boolean {
		const mid = 0.5 * (lo + hi);
		const [left, right] = pairAt(depth);
		if (!panel(lo, mid, left) || !panel(mid, hi, right)) return false;
		let ok = true;
		for (let j = 0; j < k; j++) {
			const two = left[j] + right[j];
			const ref = Math.max(Math.abs(two), sc[j]);
			if (Math.abs(two - whole[j]) > tol * ref) ok = false;
		}
		if (ok || calls > MAX_CALLS || hi - lo < 1e-15 * Math.max(Math.abs(lo), Math.abs(hi))) {
			for (let j = 0; j < k; j++) out[j] += left[j] + right[j];
			return true;
		}
		if (depth >= MAX_DEPTH) return false;
		return recurse(lo, mid, left, depth + 1) && recurse(mid, hi, right, depth + 1);
	}
	out.fill(0);
	const whole = scratch.whole;
	if (!panel(a, b, whole)) return false;
	if (!scale) for (let j = 0; j < k; j++) sc[j] = Math.abs(whole[j]);
	return recurse(a, b, whole, 0);
}
