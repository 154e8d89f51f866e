/**
 * Adaptive explicit Runge–Kutta integration with the Dormand–Prince 5(4) pair (Dormand & Prince,
 * J. Comput. Appl. Math. 6 (1980) 19; tableau as in Hairer, Nørsett & Wanner, "Solving ODEs I", §II.5).
 *
 * Definition: integrates y' = F(t, y) from t0 towards t1, propagating the 5th-order solution (local
 * extrapolation) and controlling the embedded 4th-order error estimate per component against
 * atol + rtol·max(|y_old|, |y_new|) in the max norm.
 *
 * Step control: h_new = h · clamp(0.9 · err^{−1/5}, 0.2, 5) (standard; Hairer et al. II.4). Steps below
 * `hmin` fail with a thrown RangeError rather than silently degrading.
 *
 * Events: an optional scalar g(t, y) whose sign change ends the integration. The crossing is located by
 * solving g(step(h)) = 0 for the step size h inside the last accepted step with the Illinois variant of
 * regula falsi, each trial being a fresh single DP step from the previous state, so the event state has
 * the method's own local accuracy (O(h^5)) rather than an interpolant's.
 *
 * Accuracy: global error is typically a small multiple of rtol for smooth problems; callers should
 * verify by halving rtol (the ball tests do).
 */

export type OdeRhs = (t: number, y: Float64Array) => Float64Array;

export interface OdeOptions {
	rtol?: number;
	atol?: number;
	/** initial step (default |t1 − t0|·1e-3) */
	h0?: number;
	hmax?: number;
	hmin?: number;
	maxSteps?: number;
	/** stop where this changes sign (from its value at t0) */
	event?: (t: number, y: Float64Array) => number;
}

export interface OdeResult {
	t: number;
	y: Float64Array;
	steps: number;
	rejected: number;
	/** true when the event ended the integration */
	event: boolean;
}

const C = [0, 1 / 5, 3 / 10, 4 / 5, 8 / 9, 1, 1];
const A = [
	[],
	[1 / 5],
	[3 / 40, 9 / 40],
	[44 / 45, -56 / 15, 32 / 9],
	[19372 / 6561, -25360 / 2187, 64448 / 6561, -212 / 729],
	[9017 / 3168, -355 / 33, 46732 / 5247, 49 / 176, -5103 / 18656],
	[35 / 384, 0, 500 / 1113, 125 / 192, -2187 / 6784, 11 / 84]
];
const B5 = [35 / 384, 0, 500 / 1113, 125 / 192, -2187 / 6784, 11 / 84, 0];
const B4 = [5179 / 57600, 0, 7571 / 16695, 393 / 640, -92097 / 339200, 187 / 2100, 1 / 40];

/** One Dormand–Prince step: the 5th-order state and the componentwise error estimate. */
export function dopriStep(f: OdeRhs, t: number, y: Float64Array, h: number): { y: Float64Array; err: Float64Array } {
	const n = y.length;
	const k: Float64Array[] = [];
	const tmp = new Float64Array(n);
	for (let s = 0; s < 7; s++) {
		for (let i = 0; i < n; i++) {
			let acc = y[i];
			for (let j = 0; j < s; j++) acc += h * A[s][j] * k[j][i];
			tmp[i] = acc;
		}
		k.push(f(t + C[s] * h, tmp.slice()));
	}
	const yn = new Float64Array(n);
	const err = new Float64Array(n);
	for (let i = 0; i < n; i++) {
		let s5 = 0;
		let s4 = 0;
		for (let s = 0; s < 7; s++) {
			s5 += B5[s] * k[s][i];
			s4 += B4[s] * k[s][i];
		}
		yn[i] = y[i] + h * s5;
		err[i] = h * (s5 - s4);
	}
	return { y: yn, err };
}

/** Integrate y' = f(t, y) from (t0, y0) to t1 or to the first sign change of `event`. */
export function integrateOde(f: OdeRhs, t0: number, y0: ArrayLike<number>, t1: number, opts: OdeOptions = {}): OdeResult {
	const rtol = opts.rtol ?? 1e-10;
	const atol = opts.atol ?? 1e-12;
	const dir = Math.sign(t1 - t0) || 1;
	const span = Math.abs(t1 - t0);
	const hmax = opts.hmax ?? span;
	const hmin = opts.hmin ?? span * 1e-14;
	const maxSteps = opts.maxSteps ?? 200000;
	let h = Math.min(opts.h0 ?? span * 1e-3, hmax);
	let t = t0;
	let y: Float64Array = Float64Array.from(y0);
	const g0 = opts.event ? opts.event(t, y) : 0;
	let steps = 0;
	let rejected = 0;
	while (dir * (t1 - t) > 0) {
		if (steps + rejected > maxSteps) throw new RangeError(`ODE: more than ${maxSteps} steps at t=${t}`);
		const hs = Math.min(h, Math.abs(t1 - t));
		const { y: yn, err } = dopriStep(f, t, y, dir * hs);
		let e = 0;
		for (let i = 0; i < y.length; i++) {
			const sc = atol + rtol * Math.max(Math.abs(y[i]), Math.abs(yn[i]));
			e = Math.max(e, Math.abs(err[i]) / sc);
		}
		if (!Number.isFinite(e)) {
			h = hs / 4;
			rejected++;
			if (h < hmin) throw new RangeError(`ODE: step underflow (non-finite) at t=${t}`);
			continue;
		}
		if (e <= 1) {
			if (opts.event) {
				const g1 = opts.event(t + dir * hs, yn);
				if (Math.sign(g1) !== Math.sign(g0) && g1 !== 0) {
					return { ...locateEvent(f, t, y, dir * hs, opts.event, g0), steps: steps + 1, rejected, event: true };
				}
				if (g1 === 0) return { t: t + dir * hs, y: yn, steps: steps + 1, rejected, event: true };
			}
			t += dir * hs;
			y = yn;
			steps++;
		} else {
			rejected++;
		}
		const fac = e === 0 ? 5 : Math.min(5, Math.max(0.2, 0.9 * Math.pow(e, -0.2)));
		h = Math.min(hmax, hs * fac);
		if (h < hmin) throw new RangeError(`ODE: step size underflow at t=${t}`);
	}
	return { t, y, steps, rejected, event: false };
}

/** Illinois regula falsi on the step length: the event state is a fresh DP step of the found length. */
function locateEvent(
	f: OdeRhs,
	t: number,
	y: Float64Array,
	h: number,
	g: (t: number, y: Float64Array) => number,
	g0: number
): { t: number; y: Float64Array } {
	let a = 0;
	let ga = g(t, y);
	if (Math.sign(ga) !== Math.sign(g0)) ga = g0;
	let b = h;
	let yb = dopriStep(f, t, y, b).y;
	let gb = g(t + b, yb);
	let side = 0;
	for (let it = 0; it < 100; it++) {
		const c = (a * gb - b * ga) / (gb - ga);
		const yc = dopriStep(f, t, y, c).y;
		const gc = g(t + c, yc);
		if (gc === 0 || Math.abs(b - a) < 1e-15 * Math.max(Math.abs(t), Math.abs(h))) return { t: t + c, y: yc };
		if (Math.sign(gc) === Math.sign(gb)) {
			b = c;
			gb = gc;
			yb = yc;
			if (side === -1) ga /= 2;
			side = -1;
		} else {
			a = c;
			ga = gc;
			if (side === 1) gb /= 2;
			side = 1;
		}
		if (Math.abs(gc) < 1e-15 * (Math.abs(g0) + 1e-300)) return { t: t + c, y: yc };
	}
	return { t: t + b, y: yb };
}
