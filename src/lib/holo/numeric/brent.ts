/**
 * Brent's method (inverse quadratic interpolation safeguarded by bisection) for a root of g on a bracket
 * [a, b] with g(a)·g(b) ≤ 0. Converges superlinearly on smooth g, never slower than bisection.
 * Source: R. P. Brent, Algorithms for Minimization without Derivatives (1973), ch. 4 (zeroin).
 * Stops when the bracket is below 2·eps·|x| + tol/2 or g = 0. Returns the best point and the count of
 * evaluations; throws nothing — the caller checks the bracket.
 */
export interface RootResult {
	x: number;
	fx: number;
	evals: number;
}

export function findRootBrent(
	g: (x: number) => number,
	a: number,
	b: number,
	tol = 1e-15,
	maxEvals = 200,
	fa0?: number,
	fb0?: number
): RootResult {
	let fa = fa0 ?? g(a);
	let fb = fb0 ?? g(b);
	let evals = (fa0 === undefined ? 1 : 0) + (fb0 === undefined ? 1 : 0);
	if (fa === 0) return { x: a, fx: 0, evals };
	if (fb === 0) return { x: b, fx: 0, evals };
	let c = a;
	let fc = fa;
	let d = b - a;
	let e = d;
	while (evals < maxEvals) {
		if (fb * fc > 0) {
			c = a;
			fc = fa;
			d = e = b - a;
		}
		if (Math.abs(fc) < Math.abs(fb)) {
			a = b;
			b = c;
			c = a;
			fa = fb;
			fb = fc;
			fc = fa;
		}
		const tol1 = 2 * Number.EPSILON * Math.abs(b) + 0.5 * tol;
		const xm = 0.5 * (c - b);
		if (Math.abs(xm) <= tol1 || fb === 0) return { x: b, fx: fb, evals };
		if (Math.abs(e) >= tol1 && Math.abs(fa) > Math.abs(fb)) {
			const s = fb / fa;
			let p: number;
			let q: number;
			if (a === c) {
				p = 2 * xm * s;
				q = 1 - s;
			} else {
				const qq = fa / fc;
				const r = fb / fc;
				p = s * (2 * xm * qq * (qq - r) - (b - a) * (r - 1));
				q = (qq - 1) * (r - 1) * (s - 1);
			}
			if (p > 0) q = -q;
			p = Math.abs(p);
			if (2 * p < Math.min(3 * xm * q - Math.abs(tol1 * q), Math.abs(e * q))) {
				e = d;
				d = p / q;
			} else {
				d = xm;
				e = d;
			}
		} else {
			d = xm;
			e = d;
		}
		a = b;
		fa = fb;
		b += Math.abs(d) > tol1 ? d : xm > 0 ? tol1 : -tol1;
		fb = g(b);
		evals++;
	}
	return { x: b, fx: fb, evals };
}
