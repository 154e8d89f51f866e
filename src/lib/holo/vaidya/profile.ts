import { makeBrane } from '../bulks/brane';
import { staticProfile, traceProfile, type ProfilePoint } from '../profile';
import { criticalTail } from './climb';
import { surfaceAt } from './family';
import { hrtDeltaArea, type HrtAnswer } from './hrt';

/**
 * The profile (x, z, v) of the winning HRT surface at (l, t) (family.ts for the formulas), from the tip to the
 * boundary: inside the shell the vacuum surface (v + z = z_c), then the refracted part, climbing to z_t and back
 * when a > 1. Each part in a variable that removes its square-root endpoint: u = 1 − s² at the tip, u = u_t − s²
 * at the turning point. The static (saturated) surface uses the brane profile with v(z) = t − ∫₀^z dz/f.
 */
export function hrtProfile(d: number, zh: number, l: number, t: number, count = 60): { answer: HrtAnswer; points: ProfilePoint[] } {
	const answer = hrtDeltaArea(d, zh, l, t);
	const w = answer.winner;
	if (w.kind === 'vacuum') {
		// before the quench: the vacuum strip surface on the slice v + z = t
		const vac = staticProfile({ d, f: () => 1, h: () => 1, fTerms: [{ c: 1, p: 0 }], hTerms: [], scale: 1 }, l, count);
		return { answer, points: vac.points.map((p) => ({ ...p, v: t - p.z })) };
	}
	if (w.kind === 'static') {
		const br = makeBrane({ d, zh });
		const st = staticProfile(br.slice, l, count);
		// v = t − ∫₀^z dz/f along the surface (ingoing coordinates of the static brane)
		const pts = st.points.slice().reverse();
		let acc = 0;
		const out: ProfilePoint[] = [];
		for (let i = 0; i < pts.length; i++) {
			if (i > 0) {
				const a = pts[i - 1].z;
				const b = pts[i].z;
				const m = 0.5 * (a + b);
				const f = (z: number) => 1 / br.slice.f(z);
				acc += ((b - a) / 6) * (f(a) + 4 * f(m) + f(b));
			}
			out.push({ ...pts[i], v: t - acc });
		}
		return { answer, points: out.reverse() };
	}
	const Z = w.zstar / zh;
	const zeta = w.zc / w.zstar;
	// a critical winner (climb.ts) is not re-evaluated in (z*, ζ): that labelling cannot reach its tip
	const s = w.critical ? null : surfaceAt(d, Z, zeta);
	if (!s && !w.critical) throw new Error('the winning surface could not be re-evaluated');
	const n = 2 * (d - 1);
	const mu = Math.pow(Z, d);
	const E = s ? s.E : w.E;
	const P = (u: number) => E * E + (1 - mu * Math.pow(u, d)) * Math.expm1(-n * Math.log(u));
	const R1 = (u: number) => Math.expm1(-n * Math.log(u));
	const zc = zeta;
	// inside: u = 1 − s², s ∈ [0, √(1 − ζ)], dx/ds = 2s/√(R − 1) (units z*), and v = z_c − z exactly
	const sc = Math.sqrt(1 - zeta);
	const tip: ProfilePoint = { x: 0, z: 1, v: zc - 1 };
	const kIn = Math.max(8, Math.round(count * 0.3));
	const inside = traceProfile(
		0,
		sc,
		kIn,
		(q) => [(2 * q) / Math.sqrt(Math.expm1(-n * Math.log1p(-q * q))), 0],
		(q) => 1 - q * q,
		tip,
		true
	).map((p) => ({ ...p, v: zc - p.z }));
	let at: ProfilePoint = inside[inside.length - 1];
	at = { x: at.x, z: zeta, v: 0 };
	const parts: ProfilePoint[] = [tip, ...inside];
	if (w.critical) {
		// a wide strip's surface on the critical surface z_m: traced in climb.ts's variables
		const tail = criticalTail(d, Z, w.critical, at, count);
		if (!tail) throw new Error('the winning surface could not be re-evaluated');
		parts.push(...tail);
		return { answer, points: parts.map((p) => ({ x: p.x * Z * zh, z: p.z * Z * zh, v: (p.v ?? 0) * Z * zh })) };
	}
	const descent = (u: number): [number, number] => {
		const sp = Math.sqrt(P(u));
		return [1 / sp, R1(u) / (sp * (sp - E))];
	};
	if (s!.a > 1) {
		const ut = s!.zturn / Z;
		const S = Math.sqrt(ut - zeta);
		// the climb: u = u_t − q² with q = S − p running from S to 0 (dv/dz = (R − 1)/(√P(−E − √P)) > 0 there)
		const climb = traceProfile(
			0,
			S,
			Math.round(count * 0.2),
			(p) => {
				const q = S - p;
				const u = ut - q * q;
				const sp = Math.sqrt(Math.max(P(u), 0));
				return [(2 * q) / sp, (2 * q * R1(u)) / (sp * (-E - sp))];
			},
			(p) => ut - (S - p) * (S - p),
			at,
			true
		);
		at = climb[climb.length - 1];
		const back = traceProfile(
			0,
			S,
			Math.round(count * 0.2),
			(q) => {
				const u = ut - q * q;
				const sp = Math.sqrt(Math.max(P(u), 0));
				return [(2 * q) / sp, (2 * q * R1(u)) / (sp * (sp - E))];
			},
			(q) => ut - q * q,
			at,
			true
		);
		parts.push(...climb, ...back);
		at = back[back.length - 1];
	}
	const out = traceProfile(
		zeta,
		0,
		Math.max(10, Math.round(count * 0.5)),
		(u) => {
			const [dx, dv] = descent(u);
			return [-dx, -dv];
		},
		(u) => Math.max(0, u), // the last node can land an ulp below the boundary
		{ x: at.x, z: at.z, v: at.v },
		true
	);
	parts.push(...out);
	// units: x, z in z*, v in z*; then zh
	return {
		answer,
		points: parts.map((p) => ({ x: p.x * Z * zh, z: p.z * Z * zh, v: (p.v ?? 0) * Z * zh }))
	};
}
