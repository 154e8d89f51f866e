/**
 * Safeguarded Newton's method for a root of an increasing g on the real line, with the bracket it builds as it
 * goes: every evaluation moves lo (g < 0) or hi (g > 0). A Newton step is taken when g' > 0 and it lands inside
 * the bracket; otherwise the bracket is bisected, or, while one side is still open, x steps outwards. The
 * classic combination (Press et al., Numerical Recipes, 3rd ed. (2007), §9.4 "rtsafe"), with an open bracket.
 *
 * Stops when a Newton step is below `xtol`·max(1, |x|) and returns x after that step: with quadratic
 * convergence the error is then ~xtol², so the step is applied without another evaluation. Also stops when the
 * bracket has shrunk to a few ulps of x. Throws nothing: the caller turns a failure `reason` into its own error.
 */
export interface NewtonPoint {
	/** g(x) */
	g: number;
	/** g'(x); a step is only trusted where it is positive */
	dg: number;
}

export interface NewtonOptions {
	/** relative step that ends the iteration (see above) */
	xtol: number;
	/** evaluations before giving up */
	maxIter: number;
	/**
	 * A soft ceiling on x: a step past it goes back into the bracket (or to the ceiling while the bracket is open
	 * above); once the bracket itself lies above it, the root is out of reach (reason 'ceiling').
	 */
	ceiling: number;
	/** |x| past which the iteration has diverged (reason 'diverged') */
	limit: number;
}

export type NewtonResult = { x: number; reason?: undefined } | { x: number; reason: 'ceiling' | 'diverged' | 'iterations' };

/**
 * Bracket width below which x is as good as it gets, relative to max(1, |x|): two ulps (2 · 2.2e−16), so
 * bisecting further cannot change x.
 */
const BRACKET_ULPS = 4e-16;

/** Root of the increasing g from x0; `evaluate` gives g and g' at x. */
export function findRootNewton(evaluate: (x: number) => NewtonPoint, x0: number, opts: NewtonOptions): NewtonResult {
	const { xtol, maxIter, ceiling, limit } = opts;
	let x = x0;
	let lo = -Infinity; // g(lo) < 0 < g(hi)
	let hi = Infinity;
	for (let it = 0; it < maxIter; it++) {
		const { g, dg } = evaluate(x);
		if (g === 0) return { x };
		if (g < 0) lo = x;
		else hi = x;
		let next = x - g / dg;
		const ok = dg > 0 && Number.isFinite(next) && next > lo && next < hi;
		if (ok && Math.abs(next - x) <= xtol * Math.max(1, Math.abs(x))) return { x: next };
		if (!ok) next = fallbackStep(lo, hi, g);
		if (Number.isFinite(lo) && Number.isFinite(hi) && hi - lo <= BRACKET_ULPS * Math.max(1, Math.abs(x))) return { x: next };
		if (next > ceiling && lo < ceiling) next = Number.isFinite(hi) ? 0.5 * (lo + hi) : ceiling;
		else if (next > ceiling) return { x, reason: 'ceiling' };
		if (Math.abs(next) > limit) return { x, reason: 'diverged' };
		x = next;
	}
	return { x, reason: 'iterations' };
}

/**
 * Where to go when the Newton step is not trusted: the middle of a finite bracket; otherwise outwards from the
 * known side by at least 1, upwards by 2|g| and downwards by |g|. Tuned for g ≈ ln(width) in a log or logit
 * variable (strip.ts): towards the boundary g ≈ x + const, so |g| is the distance to the root; towards a
 * horizon g grows more slowly than x, so the step upwards is longer.
 */
function fallbackStep(lo: number, hi: number, g: number): number {
	if (Number.isFinite(lo) && Number.isFinite(hi)) return 0.5 * (lo + hi);
	return Number.isFinite(lo) ? lo + Math.max(1, Math.abs(g) / 0.5) : hi - Math.max(1, Math.abs(g));
}
