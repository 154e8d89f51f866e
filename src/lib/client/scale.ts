/**
 * Small linear and logarithmic scales with "nice" ticks for the SVG plots. Written here instead of pulling
 * in a charting library: the pad page's JavaScript budget is small and a sweep plot needs only this.
 */
export interface Scale {
	(x: number): number;
	invert(px: number): number;
	domain: [number, number];
	range: [number, number];
	ticks(count?: number): number[];
	log: boolean;
}

/** A step of 1, 2 or 5 × 10^k that splits `span` into about `count` parts. */
export function niceStep(span: number, count: number): number {
	const raw = span / Math.max(1, count);
	const p = 10 ** Math.floor(Math.log10(raw));
	const f = raw / p;
	return (f >= 7.5 ? 10 : f >= 3.5 ? 5 : f >= 1.5 ? 2 : 1) * p;
}

/** Widens [a, b] outward to multiples of the nice step, so the axis starts and ends on a tick. */
export function niceDomain(a: number, b: number, count = 5): [number, number] {
	if (!Number.isFinite(a) || !Number.isFinite(b)) return [0, 1];
	if (a === b) {
		const d = a === 0 ? 1 : Math.abs(a) * 0.1;
		return [a - d, b + d];
	}
	if (a > b) [a, b] = [b, a];
	const s = niceStep(b - a, count);
	const tidy = (v: number) => Number(v.toPrecision(12));
	return [tidy(Math.floor(a / s + 1e-9) * s), tidy(Math.ceil(b / s - 1e-9) * s)];
}

export function linearScale(domain: [number, number], range: [number, number]): Scale {
	const [d0, d1] = domain;
	const [r0, r1] = range;
	const k = d1 === d0 ? 0 : (r1 - r0) / (d1 - d0);
	const s = ((x: number) => r0 + (x - d0) * k) as Scale;
	s.invert = (px) => (k === 0 ? d0 : d0 + (px - r0) / k);
	s.domain = domain;
	s.range = range;
	s.log = false;
	s.ticks = (count = 5) => {
		const step = niceStep(Math.abs(d1 - d0) || 1, count);
		const lo = Math.min(d0, d1);
		const hi = Math.max(d0, d1);
		const out: number[] = [];
		for (let t = Math.ceil(lo / step - 1e-9) * step; t <= hi + step * 1e-9; t += step)
			out.push(Math.abs(t) < step * 1e-9 ? 0 : Number(t.toPrecision(12)));
		return out;
	};
	return s;
}

/** Log domain widened to the nearest 1, 2 or 5 × 10^k around the data; non-positive data fall back to [1e-3, 1]. */
export function logDomain(a: number, b: number): [number, number] {
	const lo = Math.min(a, b);
	const hi = Math.max(a, b);
	if (!(lo > 0) || !Number.isFinite(hi)) return [1e-3, 1];
	const down = (v: number) => {
		const p = 10 ** Math.floor(Math.log10(v) + 1e-9);
		const m = [5, 2, 1].find((k) => k * p <= v * (1 + 1e-9))!;
		return Number((m * p).toPrecision(12));
	};
	const up = (v: number) => {
		const p = 10 ** Math.floor(Math.log10(v) - 1e-9);
		const m = [1, 2, 5, 10].find((k) => k * p >= v * (1 - 1e-9))!;
		return Number((m * p).toPrecision(12));
	};
	const d0 = down(lo);
	const d1 = up(hi);
	return d1 > d0 ? [d0, d1] : [d0, d0 * 10];
}

export function logScale(domain: [number, number], range: [number, number]): Scale {
	const [d0, d1] = domain.map((v) => Math.log10(v)) as [number, number];
	const inner = linearScale([d0, d1], range);
	const s = ((x: number) => inner(Math.log10(x))) as Scale;
	s.invert = (px) => 10 ** inner.invert(px);
	s.domain = domain;
	s.range = range;
	s.log = true;
	s.ticks = () => {
		const out: number[] = [];
		const lo = Math.floor(Math.min(d0, d1));
		const hi = Math.ceil(Math.max(d0, d1));
		const decades = Math.abs(d1 - d0);
		// many decades: every decade (or every other); few: 1, 2, 5 within each
		const mult = decades <= 2 ? [1, 2, 5] : [1];
		const every = decades > 8 ? 2 : 1;
		for (let e = lo; e <= hi; e += every)
			for (const m of mult) {
				const v = m * 10 ** e;
				if (v >= Math.min(...domain) * (1 - 1e-9) && v <= Math.max(...domain) * (1 + 1e-9)) out.push(Number(v.toPrecision(12)));
			}
		return out;
	};
	return s;
}

/** An SVG path through points, breaking the line where a value is missing (NaN, null, ≤ 0 on log axes). */
export function linePath(points: [number, number][], x: Scale, y: Scale): string {
	let d = '';
	let pen = false;
	for (const [px, py] of points) {
		const ok = Number.isFinite(px) && Number.isFinite(py) && (!x.log || px > 0) && (!y.log || py > 0);
		if (!ok) {
			pen = false;
			continue;
		}
		d += `${pen ? 'L' : 'M'}${x(px).toFixed(2)},${y(py).toFixed(2)}`;
		pen = true;
	}
	return d;
}

/** Index of the x value nearest to `x` in an ascending or descending array (for the hover readout). */
export function nearestIndex(xs: number[], x: number): number {
	let best = -1;
	let bestD = Infinity;
	for (let i = 0; i < xs.length; i++) {
		const d = Math.abs(xs[i]! - x);
		if (d < bestD) {
			bestD = d;
			best = i;
		}
	}
	return best;
}
