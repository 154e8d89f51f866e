import type { FormulaTree } from '../formula';
import { taylorNumeric } from './taylor-numeric';

/**
 * f(z) − 1 for a black-box f without the cancellation of forming it from f(z) ≈ 1: near z = 0 the strip's area
 * integrand weighs f − 1 by u^{1−d} (strip.ts), so the rounding of f(z) to a double near 1 (absolute 1e−16,
 * relative 1e−16/|f − 1| in the difference) grew into errors of 6e−7 in ΔA at l = 0.05 for f = 1 − z⁴e^{−z}.
 * Below zT the difference comes from the Taylor polynomial Σ_{k=1}^{N} f_k z^k (Taylor-mode numbers,
 * taylor-numeric.ts, each exact to rounding), whose first term carries full relative accuracy; zT is a quarter of
 * the root-test radius |f_k|^{−1/k} over the upper half of the coefficients, so the dropped tail is ≲ 4^{−N} of the
 * kept terms. Above zT the function's own f(z) − 1 is used (there |f − 1| is no longer small).
 */
const N = 32;

export function differenceFromOne(
	tree: FormulaTree,
	values: Readonly<Record<string, number>>,
	fn: (z: number) => number
): ((z: number) => number) | undefined {
	let c: Float64Array;
	try {
		c = taylorNumeric(tree, values, N);
	} catch {
		return undefined; // not analytic at 0: the error is reported elsewhere (model.ts)
	}
	if (!c.every(Number.isFinite)) return undefined;
	let r = Infinity;
	for (let k = N >> 1; k <= N; k++) if (c[k] !== 0) r = Math.min(r, Math.pow(Math.abs(c[k]!), -1 / k));
	const zT = 0.25 * r;
	let top = N;
	while (top > 0 && c[top] === 0) top--;
	if (top === 0) return () => 0;
	return (z: number) => {
		if (!(z < zT)) return fn(z) - 1;
		let s = 0;
		for (let k = top; k >= 1; k--) s = (s + c[k]!) * z;
		return s;
	};
}
