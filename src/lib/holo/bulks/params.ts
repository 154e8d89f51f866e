import { HoloError } from '../errors';

/** Keys a verb line may carry beside the bulk's own; makeBulk ignores them instead of rejecting them. */
const VERB_KEYS = new Set(['l', 'o', 'order', 'tol', 'G', 'R', 'gap', 'zstar', 'n', 'c', 'N', 'units', 'system']);

/** Rejects keys that belong to no parameter of this bulk (a typo or another bulk's key). */
export function rejectUnknownKeys(name: string, params: Record<string, unknown>, allowed: string[]): void {
	for (const k of Object.keys(params)) {
		if (!allowed.includes(k) && !VERB_KEYS.has(k)) {
			throw new HoloError(`'${k}' is not a parameter of ${name}`, k, `${name} takes ${allowed.join(', ')}`);
		}
	}
}

/** A numeric parameter: finite number (not a string), default when absent. */
export function readNumber(params: Record<string, number | string>, key: string, fallback?: number): number {
	const v = params[key];
	if (v === undefined) {
		if (fallback === undefined) throw new HoloError(`${key} is required`, key);
		return fallback;
	}
	if (typeof v !== 'number' || !Number.isFinite(v)) throw new HoloError(`${key} must be a finite number`, key);
	return v;
}

/** Boundary dimension d: an integer in [lo, 10]. */
export function readDimension(params: Record<string, number | string>, lo = 2, fallback = 4): number {
	const d = readNumber(params, 'd', fallback);
	if (!Number.isInteger(d) || d < lo || d > 10) {
		throw new HoloError(`d must be an integer with ${lo} ≤ d ≤ 10`, 'd', `got d=${d}`);
	}
	return d;
}

/** A strictly positive length (zh, zp, …). */
export function readLength(params: Record<string, number | string>, key: string, fallback = 1): number {
	const x = readNumber(params, key, fallback);
	if (!(x > 0)) throw new HoloError(`${key} must be positive`, key, `got ${key}=${x}`);
	if (x > 1e150 || x < 1e-150) throw new HoloError(`${key} is out of range`, key);
	return x;
}
