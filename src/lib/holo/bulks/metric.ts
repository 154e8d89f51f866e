import { HoloError } from '../errors';
import type { Bulk } from '../types';
import { readDimension } from './params';
import { compileMetricFunction } from './sandbox';

/**
 * A custom static slice: g_zz = 1/(z² f), g_yy = h/z², other spatial components 1/z², f and h given as
 * strings in z and any extra numeric keys (e.g. zh, q). Checks: both finite and f(0) = h(0) = 1 (read at
 * z = 1e−9·scale to 1e−6); the admissible turning points end at the first z where f ≤ 0, h ≤ 0, a value is
 * not finite, or H = h/z^{2(d−1)} stops decreasing (found by a log-spaced scan and bisection).
 * No series (the form of f and h is unknown); no stress tensor beyond what `zh` implies is claimed.
 */
export function makeMetric(params: Record<string, number | string>): Bulk {
	const d = readDimension(params);
	const nums: Record<string, number> = {};
	for (const [k, v] of Object.entries(params)) {
		if (k === 'f' || k === 'h') continue;
		if (typeof v !== 'number' || !Number.isFinite(v)) throw new HoloError(`${k} must be a finite number`, k);
		nums[k] = v;
	}
	if (params.f === undefined) throw new HoloError('metric needs f="…" (a formula in z)', 'f');
	const ftext = String(params.f);
	const htext = params.h === undefined ? '1' : String(params.h);
	const f = compileMetricFunction(ftext, 'f', nums);
	const h = compileMetricFunction(htext, 'h', nums);
	const scale = typeof nums.zh === 'number' && nums.zh > 0 ? nums.zh : 1;
	for (const [fn, key] of [
		[f, 'f'],
		[h, 'h']
	] as const) {
		const v0 = fn(1e-9 * scale);
		if (!Number.isFinite(v0) || Math.abs(v0 - 1) > 1e-6) {
			throw new HoloError(`${key}(0) must be 1 (got ${v0})`, key, 'the slice must approach AdS at the boundary');
		}
	}
	const m = 2 * (d - 1);
	const ok = (z: number) => {
		const fz = f(z);
		const hz = h(z);
		return Number.isFinite(fz) && Number.isFinite(hz) && fz > 0 && hz > 0;
	};
	const H = (z: number) => h(z) / Math.pow(z, m);
	let zmax = Infinity;
	let prev = 1e-6 * scale;
	for (let i = 1; i <= 480; i++) {
		const z = 1e-6 * scale * Math.pow(10, i / 40);
		if (!ok(z) || !(H(z) < H(prev))) {
			let lo = prev;
			let hi = z;
			for (let k = 0; k < 60; k++) {
				const mid = Math.sqrt(lo * hi);
				if (ok(mid) && H(mid) < H(lo)) lo = mid;
				else hi = mid;
			}
			zmax = lo;
			break;
		}
		prev = z;
	}
	const out: Record<string, number | string> = { d, f: ftext, h: htext, ...nums };
	return {
		name: 'metric',
		d,
		params: out,
		horizon: typeof nums.zh === 'number' ? nums.zh : undefined,
		scale: typeof nums.zh === 'number' ? nums.zh : undefined,
		slice: { d, f, h, zmax: Number.isFinite(zmax) ? zmax : undefined }
	};
}
