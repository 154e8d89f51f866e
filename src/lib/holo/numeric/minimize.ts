/**
 * Brent's minimiser of a function of one variable on a bracket [a, b] (R. P. Brent, Algorithms for
 * Minimization without Derivatives, 1973, ch. 5): golden-section steps, parabolic steps where the function is
 * smooth enough to trust them. Written here rather than taken from an npm optimiser: a one-parameter fit
 * needs only this, the engine already keeps Brent's root finder beside it, and a package would bring a
 * general multi-parameter API (and a dependency) for one call.
 * Finds a local minimum to |Δx| ≤ tol·|x| + 1e-12 in at most `maxIter` evaluations; a function value that is
 * not finite counts as +∞ (the engine refused that parameter value).
 */
export interface Minimum {
	x: number;
	fx: number;
	evaluations: number;
}

const GOLD = 0.3819660112501051; // (3 − √5)/2

export function minimizeBrent(f: (x: number) => number, a: number, b: number, tol = 1e-8, maxIter = 100): Minimum {
	const F = (x: number) => {
		const v = f(x);
		return Number.isFinite(v) ? v : Infinity;
	};
	let x = a + GOLD * (b - a);
	let w = x;
	let v = x;
	let fx = F(x);
	let fw = fx;
	let fv = fx;
	let d = 0;
	let e = 0;
	let n = 1;
	for (; n < maxIter; n++) {
		const m = (a + b) / 2;
		const t1 = tol * Math.abs(x) + 1e-12;
		const t2 = 2 * t1;
		if (Math.abs(x - m) <= t2 - (b - a) / 2) break;
		let useGolden = true;
		if (Math.abs(e) > t1 && Number.isFinite(fx) && Number.isFinite(fw) && Number.isFinite(fv)) {
			let r = (x - w) * (fx - fv);
			let q = (x - v) * (fx - fw);
			let p = (x - v) * q - (x - w) * r;
			q = 2 * (q - r);
			if (q > 0) p = -p;
			q = Math.abs(q);
			r = e;
			e = d;
			if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (a - x) && p < q * (b - x)) {
				d = p / q;
				const u = x + d;
				if (u - a < t2 || b - u < t2) d = x < m ? t1 : -t1;
				useGolden = false;
			}
		}
		if (useGolden) {
			e = (x < m ? b : a) - x;
			d = GOLD * e;
		}
		const u = Math.abs(d) >= t1 ? x + d : x + (d > 0 ? t1 : -t1);
		const fu = F(u);
		if (fu <= fx) {
			if (u < x) b = x;
			else a = x;
			[v, fv, w, fw, x, fx] = [w, fw, x, fx, u, fu];
		} else {
			if (u < x) a = u;
			else b = u;
			if (fu <= fw || w === x) [v, fv, w, fw] = [w, fw, u, fu];
			else if (fu <= fv || v === x || v === w) [v, fv] = [u, fu];
		}
	}
	return { x, fx, evaluations: n };
}
