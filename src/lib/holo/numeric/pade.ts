/**
 * Padé approximants of a truncated power series.
 *
 * Definition: for f(x) = Σ_{k≥0} c_k x^k, the [L/M] approximant is P_L(x)/Q_M(x) with Q_M(0) = 1 and
 * f Q_M − P_L = O(x^{L+M+1}) (Baker & Graves-Morris, "Padé Approximants", 2nd ed., CUP 1996, ch. 1).
 *
 * Method: the denominator solves the M×M Toeplitz system Σ_{j=0..M} q_j c_{L+i−j} = 0 (i = 1…M, c_{<0} = 0)
 * by Gaussian elimination with partial pivoting; the numerator is the Cauchy product truncated at x^L.
 * Poles and zeros are the roots of Q and P found by the Aberth–Ehrlich iteration (simultaneous, cubically
 * convergent for simple roots; Bini, Numer. Algorithms 13 (1996) 179).
 *
 * Accuracy: the linear solve is backward stable; the conditioning of the Padé problem itself grows with M
 * (near-degenerate tables). A system whose pivot falls below 1e-13 of the largest coefficient is reported
 * as `degenerate` instead of being returned with noisy digits. Roots are polished to ~1e-13 relative.
 * A pole whose residue is tiny or that has a zero of P on it (a pole–zero "Froissart doublet"; Froissart 1969,
 * Gilewicz & Kryakin, J. Comput. Appl. Math. 153 (2003) 235; common practice to discard) is marked `spurious`.
 */

export interface Complex {
	re: number;
	im: number;
}

export interface PadeApproximant {
	L: number;
	M: number;
	/** numerator coefficients p_0…p_L */
	p: number[];
	/** denominator coefficients q_0 = 1, q_1…q_M */
	q: number[];
	poles: PadePole[];
	zeros: Complex[];
}

export interface PadePole extends Complex {
	abs: number;
	/** true for a Froissart doublet: a zero of P within 1e-4 (relative) of the pole, or a negligible residue */
	spurious: boolean;
}

/** Evaluate a real polynomial Σ a_k x^k (Horner). */
export function evalPoly(a: readonly number[], x: number): number {
	let s = 0;
	for (let k = a.length - 1; k >= 0; k--) s = s * x + a[k];
	return s;
}

function cmul(a: Complex, b: Complex): Complex {
	return { re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re };
}
function cdiv(a: Complex, b: Complex): Complex {
	const n = b.re * b.re + b.im * b.im;
	return { re: (a.re * b.re + a.im * b.im) / n, im: (a.im * b.re - a.re * b.im) / n };
}
function cevalPoly(a: readonly number[], z: Complex): { v: Complex; dv: Complex } {
	let v: Complex = { re: 0, im: 0 };
	let dv: Complex = { re: 0, im: 0 };
	for (let k = a.length - 1; k >= 0; k--) {
		dv = cmul(dv, z);
		dv = { re: dv.re + v.re, im: dv.im + v.im };
		v = cmul(v, z);
		v = { re: v.re + a[k], im: v.im };
	}
	return { v, dv };
}

/** All complex roots of Σ a_k x^k (trailing zero leading coefficients dropped) by Aberth–Ehrlich. */
export function polyRoots(coeffs: readonly number[]): Complex[] {
	const a = coeffs.slice();
	while (a.length > 1 && Math.abs(a[a.length - 1]) <= 1e-300) a.pop();
	const n = a.length - 1;
	if (n < 1) return [];
	// Initial guesses on a circle of the Cauchy-bound radius, rotated to avoid symmetric stalls.
	const lead = a[n];
	let radius = 0;
	for (let k = 0; k < n; k++) radius = Math.max(radius, Math.pow(Math.abs(a[k] / lead), 1 / (n - k)));
	radius = radius > 0 ? radius : 1;
	const z: Complex[] = [];
	for (let k = 0; k < n; k++) {
		const th = (2 * Math.PI * k) / n + 0.4;
		z.push({ re: radius * Math.cos(th), im: radius * Math.sin(th) });
	}
	for (let iter = 0; iter < 500; iter++) {
		let maxStep = 0;
		for (let i = 0; i < n; i++) {
			const { v, dv } = cevalPoly(a, z[i]);
			if (v.re === 0 && v.im === 0) continue;
			const ratio = cdiv(v, dv);
			let sum: Complex = { re: 0, im: 0 };
			for (let j = 0; j < n; j++) {
				if (j === i) continue;
				const diff = { re: z[i].re - z[j].re, im: z[i].im - z[j].im };
				const inv = cdiv({ re: 1, im: 0 }, diff);
				sum = { re: sum.re + inv.re, im: sum.im + inv.im };
			}
			const denom = { re: 1 - (ratio.re * sum.re - ratio.im * sum.im), im: -(ratio.re * sum.im + ratio.im * sum.re) };
			const w = cdiv(ratio, denom);
			z[i] = { re: z[i].re - w.re, im: z[i].im - w.im };
			maxStep = Math.max(maxStep, Math.hypot(w.re, w.im) / Math.max(1e-300, Math.hypot(z[i].re, z[i].im)));
		}
		if (maxStep < 1e-15) break;
	}
	return z.map((r) => (Math.abs(r.im) < 1e-13 * Math.max(1, Math.abs(r.re)) ? { re: r.re, im: 0 } : r));
}

/** Solve A x = b in place by Gaussian elimination with partial pivoting; null when (near-)singular. */
function solveLinear(A: number[][], b: number[], scale: number): number[] | null {
	const n = b.length;
	for (let c = 0; c < n; c++) {
		let piv = c;
		for (let r = c + 1; r < n; r++) if (Math.abs(A[r][c]) > Math.abs(A[piv][c])) piv = r;
		if (!(Math.abs(A[piv][c]) > 1e-13 * scale)) return null;
		[A[c], A[piv]] = [A[piv], A[c]];
		[b[c], b[piv]] = [b[piv], b[c]];
		for (let r = c + 1; r < n; r++) {
			const m = A[r][c] / A[c][c];
			if (m === 0) continue;
			for (let k = c; k < n; k++) A[r][k] -= m * A[c][k];
			b[r] -= m * b[c];
		}
	}
	const x = new Array<number>(n).fill(0);
	for (let r = n - 1; r >= 0; r--) {
		let s = b[r];
		for (let k = r + 1; k < n; k++) s -= A[r][k] * x[k];
		x[r] = s / A[r][r];
	}
	return x;
}

/**
 * The [L/M] Padé approximant of Σ c_k x^k; needs c_0…c_{L+M}. Returns null when the table is degenerate
 * at (L, M) (singular Toeplitz system), so a caller can move to a neighbouring entry.
 */
export function padeApproximant(c: readonly number[], L: number, M: number): PadeApproximant | null {
	if (!Number.isInteger(L) || !Number.isInteger(M) || L < 0 || M < 0) throw new RangeError('L, M must be integers ≥ 0');
	if (c.length < L + M + 1) throw new RangeError(`[${L}/${M}] needs ${L + M + 1} coefficients, got ${c.length}`);
	const at = (k: number) => (k < 0 ? 0 : c[k]);
	let q = [1];
	if (M > 0) {
		const A: number[][] = [];
		const b: number[] = [];
		let scale = 0;
		for (let k = 0; k <= L + M; k++) scale = Math.max(scale, Math.abs(c[k]));
		for (let i = 1; i <= M; i++) {
			A.push(Array.from({ length: M }, (_, j) => at(L + i - (j + 1))));
			b.push(-at(L + i));
		}
		const sol = solveLinear(A, b, scale || 1);
		if (!sol) return null;
		q = [1, ...sol];
	}
	const p: number[] = [];
	for (let i = 0; i <= L; i++) {
		let s = 0;
		for (let j = 0; j <= Math.min(i, M); j++) s += q[j] * at(i - j);
		p.push(s);
	}
	const zeros = polyRoots(p);
	const f0 = Math.abs(p[0]) || 1;
	const poles: PadePole[] = polyRoots(q).map((r) => {
		const abs = Math.hypot(r.re, r.im);
		// a zero within 1e-4 of the pole, or a residue P(r)/Q'(r) below 1e-10 |r| |f(0)|: a Froissart doublet
		const paired = zeros.some((z) => Math.hypot(z.re - r.re, z.im - r.im) < 1e-4 * Math.max(1, abs));
		const P = cevalPoly(p, r).v;
		const dQ = cevalPoly(q, r).dv;
		const residue = Math.hypot(P.re, P.im) / Math.max(1e-300, Math.hypot(dQ.re, dQ.im));
		return { ...r, abs, spurious: paired || residue < 1e-10 * abs * f0 };
	});
	poles.sort((x, y) => x.abs - y.abs);
	return { L, M, p, q, poles, zeros };
}

/** Value of an approximant at real x. */
export function evalPade(a: PadeApproximant, x: number): number {
	return evalPoly(a.p, x) / evalPoly(a.q, x);
}

/** Nearest genuine (non-spurious) pole, or null. */
export function nearestPole(a: PadeApproximant): PadePole | null {
	return a.poles.find((p) => !p.spurious) ?? null;
}
