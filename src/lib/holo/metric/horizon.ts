import { findRootBrent } from '../numeric/brent';

/**
 * The horizon of a static metric ds² = (1/z²)(−g dt² + dz²/f + h dy² + dx⃗²): the first zero of f on z > 0, found
 * by a log-spaced scan (1e−6 … 1e6 in units of `scale`, 40 points a decade) and Brent's root. A simple zero with
 * g vanishing there too (also simply) is a regular horizon with surface gravity κ = ½√(f'(zh) g'(zh)), so
 * T = √(f' g')/(4π) (common practice: Euclidean regularity at z = zh; the brane's d/(4π zh) is the check) and
 * entropy density s = √h(zh)/(4G zh^{d−1}) (the horizon's area density, Bekenstein–Hawking).
 * A zero of f with f' = 0 there is extremal (T = 0); f touching zero without changing sign too; no zero is
 * horizonless. A zero of g before f's, g not vanishing with f, or a zero where f' or g' is not finite is
 * 'irregular': no temperature, but the zero still ends the strip's turning points.
 */
export type HorizonKind = 'simple' | 'extremal' | 'none' | 'irregular';

export interface Horizon {
	kind: HorizonKind;
	zh?: number;
	/** temperature (0 when extremal or horizonless) */
	T: number;
	/** entropy density for Newton constant G (0 horizonless) */
	s: (G: number) => number;
	/** where the scan stopped: a value stopped being finite (a cap) before any zero */
	zmax?: number;
	/** 'irregular': why there is no temperature (the strip still ends at zh), and the function at fault */
	problem?: { message: string; key: 'f' | 'g' };
}

export interface HorizonInput {
	d: number;
	f: (z: number) => number;
	g: (z: number) => number;
	h: (z: number) => number;
	/** exact derivatives where known (polynomials); central differences otherwise */
	fPrime?: (z: number) => number;
	gPrime?: (z: number) => number;
	scale?: number;
}

function slope(fn: (z: number) => number, z: number): number {
	// five-point central difference, step 1e−4 z: truncation ~1e−16 z^4 f⁽⁵⁾, rounding ~1e−12 relative
	const e = 1e-4 * z;
	return (8 * (fn(z + e) - fn(z - e)) - (fn(z + 2 * e) - fn(z - 2 * e))) / (12 * e);
}

export function findHorizon(input: HorizonInput): Horizon {
	const { d, f, g, h } = input;
	const scale = input.scale ?? 1;
	let prev = 1e-6 * scale;
	let fprev = f(prev);
	let zero: [number, number] | undefined;
	let touch: number | undefined;
	let cap: number | undefined;
	let lowest = Infinity;
	for (let i = 1; i <= 480; i++) {
		const z = 1e-6 * scale * Math.pow(10, i / 40);
		const fz = f(z);
		if (!Number.isFinite(fz)) {
			cap = prev;
			break;
		}
		if (fz <= 0) {
			zero = [prev, z];
			break;
		}
		if (fz < lowest) lowest = fz;
		else if (lowest < 1e-9 && touch === undefined) touch = prev;
		prev = z;
		fprev = fz;
	}
	void fprev;
	const horizonless: Horizon = { kind: 'none', T: 0, s: () => 0, zmax: cap };
	if (!zero) {
		if (touch !== undefined)
			return { kind: 'extremal', zh: touch, T: 0, s: (G) => Math.sqrt(h(touch!)) / (4 * G * Math.pow(touch!, d - 1)) };
		return horizonless;
	}
	const [a, b] = zero;
	const zh = f(b) === 0 ? b : findRootBrent(f, a, b, 0, 200).x;
	const gz = g(zh);
	const fp = input.fPrime ? input.fPrime(zh) : slope(f, zh);
	const gp = input.gPrime ? input.gPrime(zh) : slope(g, zh);
	const s = (G: number) => Math.sqrt(h(zh)) / (4 * G * Math.pow(zh, d - 1));
	const irregular = (message: string, key: 'f' | 'g'): Horizon => ({ kind: 'irregular', zh, T: NaN, s, problem: { message, key } });
	const at = zh.toPrecision(12);
	if (!Number.isFinite(fp)) return irregular(`f's zero at zh=${at} is not simple: f' is not finite there`, 'f');
	// g must not vanish first, and must vanish with f (a regular static horizon)
	for (let i = 1; i <= 200; i++) {
		const z = (zh * i) / 201;
		if (!(g(z) > 0)) return irregular(`g vanishes at z≈${z.toPrecision(6)}, before f's zero at zh=${at}`, 'g');
	}
	if (!(Math.abs(gz) <= 1e-9)) return irregular(`g does not vanish at f's zero zh=${at} (g=${gz}): no regular static horizon`, 'g');
	if (!Number.isFinite(gp)) return irregular(`g's zero at zh=${at} is not simple: g' is not finite there`, 'g');
	if (Math.abs(fp) * zh <= 1e-7 || Math.abs(gp) * zh <= 1e-7) return { kind: 'extremal', zh, T: 0, s };
	if (!(fp * gp > 0)) return irregular(`f and g cross zero with opposite slopes at zh=${at}`, 'g');
	return { kind: 'simple', zh, T: Math.sqrt(fp * gp) / (4 * Math.PI), s };
}
