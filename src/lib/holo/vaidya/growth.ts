import { HoloError } from '../errors';
import { findRootBrent } from '../numeric/brent';
import { minimizeBrent } from '../numeric/minimize';
import { surfacesAt } from './curve';
import { MIN_WIDTH, curveFor, hrtDeltaArea } from './hrt';
import { surfaceForWidth } from './solve';

/**
 * The growth of ΔA(t) for one strip after the quench, each number with how it was found (PHYSICS.md, "Quench";
 * Liu & Suh, Phys. Rev. D 89 (2014) 066012 for the early law, the tsunami velocity and the saturation pattern).
 */
export interface Growth {
	d: number;
	zh: number;
	l: number;
	/** ΔA/t² as t → 0, against m/2 = 1/(2 zh^d) */
	early: { coefficient: number; predicted: number; how: string };
	/** largest dΔA/dt before saturation, against 2 v_E/zh^{d−1}; `regime` false when the strip is too narrow for a
	 * linear regime (zh ≪ t ≪ l needs l ≫ zh: below LINEAR_WIDTH zh the slope is only the largest one) */
	linear: { slope: number; predicted: number; vE: number; atTime: number; regime: boolean; how: string };
	/** the static surface's first time ∫₀^{z*} dz/f: its tip leaves the shell region */
	tc: { value: number; how: string };
	/** the time the static surface becomes the smallest */
	saturation: { time: number; dA: number; how: string };
	/** continuous (d = 2) or a kink (d ≥ 3): the slope just before saturation */
	kind: { continuous: boolean; slopeBefore: number; how: string };
}

/**
 * The width (in zh) from which `growth` calls its largest slope the linear regime's: the regime needs
 * zh ≪ t ≪ l. Measured (tests/unit/holo/vaidya-wide.test.ts): at l = 2 zh, d = 3 the largest slope is 33 % below
 * 2 v_E; at 20 zh it is within 5e−5 for d = 3 and 2e−8 for d = 4, while d = 2 is still 12 % low there (PHYSICS.md).
 */
export const LINEAR_WIDTH = 10;

/** Tsunami velocity v_E = (η−1)^{(η−1)/2}/η^{η/2}, η = 2(d−1)/d (Liu & Suh 2014); 1 in d = 2. */
export function tsunamiVelocity(d: number): number {
	const eta = (2 * (d - 1)) / d;
	return Math.pow(eta - 1, (eta - 1) / 2) / Math.pow(eta, eta / 2);
}

/** dΔA/dt from the slope identity 2|E|/z*^{d−1} (units zh = 1). */
function slopeOf(s: { E: number; zstar: number }, d: number): number {
	return (2 * Math.abs(s.E)) / Math.pow(s.zstar, d - 1);
}

export function analyseGrowth(d: number, zh: number, l: number): Growth {
	hrtDeltaArea(d, zh, l, zh); // validates the inputs
	const L = l / zh;
	if (L < MIN_WIDTH) {
		throw new HoloError(
			`growth needs l ≥ ${MIN_WIDTH} zh (got l=${l})`,
			'l',
			'below that the family of surfaces is not resolved (darea l=… t=… still answers from saturation on)'
		);
	}
	const curve = curveFor(d, L);
	const scaleA = Math.pow(zh, 2 - d);
	const scaleS = Math.pow(zh, 1 - d);

	// early: c(t) = ΔA/t² at t = h, h/2, h/4, extrapolated assuming c(t) = c₀ + c₁ t + … (Richardson)
	const h = Math.min(0.01, L / 50);
	const c = [h, h / 2, h / 4].map((t) => hrtDeltaArea(d, 1, L, t).dA / (t * t));
	const r1 = 2 * c[1] - c[0];
	const r2 = 2 * c[2] - c[1];
	const early = (4 * r2 - r1) / 3;

	// the dominant branch before saturation: the rising part of t(ζ) from ζ = 0 to the first maximum of t
	const pts = curve.points;
	let iMax = pts.length - 1;
	for (let i = 1; i + 1 < pts.length; i++) {
		if (pts[i].t >= pts[i + 1].t && pts[i].t >= pts[i - 1].t) {
			iMax = i;
			break;
		}
	}
	const st = curve.static;
	// saturation: where the rising branch's ΔA meets the static one (Brent in ζ); d = 2 reaches it at ζ → 1
	let tSat = st.tsat;
	let zetaSat = 1;
	const gA = (zeta: number) => {
		if (zeta >= 1) return 0;
		const s = surfaceForWidth(d, L, zeta);
		return s ? s.dA - st.dA : NaN;
	};
	const crossing = pts.slice(0, iMax + 1).findIndex((p, i) => i > 0 && p.dA >= st.dA && p.t >= st.tsat);
	if (crossing > 0 && pts[crossing].zeta < 1) {
		const a = pts[crossing - 1];
		const b = pts[crossing];
		const r = findRootBrent(gA, a.zeta, b.zeta, 1e-16, 100, a.dA - st.dA, b.dA - st.dA);
		zetaSat = r.x;
		const s = surfaceForWidth(d, L, r.x);
		if (!s) throw new HoloError(`the saturation point of l=${l} was not resolved`, 'l');
		tSat = s.t;
	}
	// linear slope: the largest 2|E|/z*^{d−1} on the rising branch before saturation, refined by golden section
	let best = { slope: 0, t: 0, zeta: 0 };
	for (let i = 1; i <= iMax && pts[i].zeta < zetaSat; i++) {
		const s = pts[i].surface;
		if (s && slopeOf(s, d) > best.slope) best = { slope: slopeOf(s, d), t: s.t, zeta: s.zeta };
	}
	const idx = pts.findIndex((p) => p.zeta === best.zeta);
	if (idx > 0 && idx + 1 < pts.length && pts[idx + 1].zeta < zetaSat) {
		// Brent's minimiser of −slope on the grid bracket around the largest sampled slope (parabolic steps: ~10
		// tip solves where golden section to the same 1e−12 took ~60)
		let top = { v: 0, t: 0, zeta: 0 };
		let guess = pts[idx].surface ?? undefined;
		minimizeBrent(
			(z) => {
				const s = surfaceForWidth(d, L, z, guess);
				if (!s) return NaN;
				guess = s;
				const v = slopeOf(s, d);
				if (v > top.v) top = { v, t: s.t, zeta: z };
				return -v;
			},
			pts[idx - 1].zeta,
			pts[idx + 1].zeta,
			1e-12,
			80
		);
		if (top.v > best.slope) best = { slope: top.v, t: top.t, zeta: top.zeta };
	}
	// the slope just before saturation: 0 when the rising branch ends on the static surface (E → 0)
	let slopeBefore = 0;
	if (zetaSat < 1) {
		const before = surfacesAt(curve, tSat * (1 - 1e-9)).filter((s) => s.zeta <= zetaSat * (1 + 1e-6));
		const s = before.sort((a, b) => b.zeta - a.zeta)[0];
		if (s) slopeBefore = slopeOf(s, d);
	}
	const vE = tsunamiVelocity(d);
	const continuous = slopeBefore <= 1e-6 * Math.max(best.slope, 1e-300);
	return {
		d,
		zh,
		l,
		early: {
			coefficient: early * Math.pow(zh, -d),
			predicted: 0.5 * Math.pow(zh, -d),
			how: `ΔA/t² at t = ${h * zh}, ${(h * zh) / 2}, ${(h * zh) / 4}, Richardson-extrapolated to t → 0`
		},
		linear: {
			slope: best.slope * scaleS,
			predicted: 2 * vE * scaleS,
			vE,
			atTime: best.t * zh,
			regime: L >= LINEAR_WIDTH,
			how:
				L >= LINEAR_WIDTH
					? 'largest dΔA/dt = 2|E|/z*^{d−1} (slope identity) on the dominant surface before saturation'
					: `l = ${L} zh is too narrow for a linear regime (it needs zh ≪ t ≪ l; l ≥ ${LINEAR_WIDTH} zh here), so this is only the largest dΔA/dt = 2|E|/z*^{d−1} before saturation, not the tsunami slope`
		},
		tc: { value: st.tsat * zh, how: 't_c = ∫₀^{z*} dz/f on the static surface of this width (its tip reaches the shell)' },
		saturation: {
			time: tSat * zh,
			dA: st.dA * scaleA,
			how:
				zetaSat < 1
					? 'the rising surface’s ΔA equals the static one (Brent in z_c/z*), after t_c'
					: 'the rising surface reaches the static one as z_c → z* (at t_c)'
		},
		kind: {
			continuous,
			slopeBefore: slopeBefore * scaleS,
			how: continuous ? 'dΔA/dt → 0 at saturation: continuous' : 'dΔA/dt jumps from the value before saturation to 0: a kink'
		}
	};
}

/**
 * Reference curves for a plotted growth curve ΔA(t), each as points of a polyline at the curve's own times (so a
 * sweep cut into chunks has, chunk by chunk, exactly the whole sweep's points; each guide's window is fixed by the
 * physics, never by the plotted range).
 */
export interface GrowthGuides {
	/** the saturated value: the static brane's ΔA(l), at every time */
	thermal: [number, number][];
	/** the early-time law (m/2) t² over the early part only, 0 ≤ t ≤ min(zh/2, t_c/4) */
	early: [number, number][];
	/** slope 2 v_E/zh^{d−1} through the curve at its steepest point before saturation, between ΔA = 0 and the thermal value */
	linear: [number, number][];
	/** where the linear line touches the curve */
	touch: { t: number; dA: number; slope: number };
}

/**
 * The comparison lines of a growth curve (PHYSICS.md, "Quench"; Liu & Suh 2014): the thermal value, the early law
 * and the linear-growth line at the tsunami slope, drawn through the curve where its own slope is largest (the
 * linear regime, as `growth` finds it), each at those of the times `ts` inside its window.
 */
export function growthGuides(d: number, zh: number, l: number, ts: readonly number[]): GrowthGuides {
	const g = analyseGrowth(d, zh, l);
	const sat = g.saturation.dA;
	const thermal = ts.map((t): [number, number] => [t, sat]);
	const m2 = g.early.predicted;
	const eEnd = Math.min(0.5 * zh, 0.25 * g.tc.value);
	const early = ts.filter((t) => t >= 0 && t <= eEnd).map((t): [number, number] => [t, m2 * t * t]);
	const slope = g.linear.predicted;
	const tTouch = g.linear.atTime;
	const at = hrtDeltaArea(d, zh, l, tTouch).dA;
	const a = tTouch - at / slope; // the line meets ΔA = 0 …
	const b = tTouch + (sat - at) / slope; // … and the thermal value
	const linear = ts.filter((t) => t >= a && t <= b).map((t): [number, number] => [t, at + slope * (t - tTouch)]);
	return { thermal, early, linear, touch: { t: tTouch, dA: at, slope } };
}
