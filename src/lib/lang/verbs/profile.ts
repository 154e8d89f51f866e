import type { ProfilePoint } from '../../holo/index';
import { defineVerb } from './types';

/** Points along one half of a surface, tip first: both halves as rows from x = −l/2 to l/2 (the tip once). */
function mirrored(points: ProfilePoint[], withV: boolean): number[][] {
	const row = (p: ProfilePoint, sign: number): number[] => (withV ? [sign * p.x, p.z, p.v ?? 0] : [sign * p.x, p.z]);
	const left = points
		.slice(1)
		.reverse()
		.map((p) => row(p, -1));
	return [...left, ...points.map((p) => row(p, 1))];
}

export const profile = defineVerb({
	name: 'profile',
	kind: 'table',
	forms: { strip: { keys: ['l', 't'], required: ['l'] } },
	symbol: { text: 'profile', tex: '' },
	help: {
		summary: 'the extremal surface of a strip itself: x(z) of the RT surface, or (x, z, v) of the HRT surface in vaidya',
		method:
			'static bulks: the strip solver’s z*, then x(z) integrated from the tip in u = z/z* = 1 − s² (no endpoint singularity); vaidya with t: the winning HRT surface (vacuum inside the shell on v + z = z_c, refracted outside, the climb behind the horizon when there is one), with v integrated alongside from dv/dz written without 1/f',
		accuracy:
			'the traced half-width reaches l/2 and the boundary time t to ≤ 1e-8 relative; the tip is the solver’s z* (tests/unit/holo/vaidya-profile.test.ts, tests/unit/lang/profile.test.ts)',
		source:
			'Ryu & Takayanagi 2006 (strip surfaces); Hubeny, Rangamani & Takayanagi 2007 and Liu & Suh, PRD 89 (2014) 066012 (HRT surfaces after a thin-shell quench)',
		examples: ['profile l=1', 'use vaidya d=3 zh=1; profile l=2 t=1 | csv']
	},
	at: (p) => {
		const l = p.q.l!;
		const t = p.q.t;
		if (p.bulk.name === 'vaidya') {
			if (t === undefined) throw new p.holo.HoloError('vaidya needs t= (the boundary time since the quench)', 't', 'e.g. profile l=2 t=1');
			const r = p.holo.hrtProfile(p.bulk.d, p.bulk.horizon!, l, t);
			const w = r.answer.winner;
			const which =
				w.kind === 'vacuum'
					? 'before the quench: the vacuum surface on v = t − z'
					: w.kind === 'static'
						? 'saturated: the static brane surface, v = t − ∫dz/f'
						: `the HRT surface crossing the shell (v = 0) at z_c${w.behindHorizon ? ', partly behind the horizon' : ''}`;
			const fields: Record<string, number> = { l, t, zstar: w.zstar, dA: r.answer.dA, surfaces: r.answer.surfaces.length };
			if (Number.isFinite(w.zc)) fields.zc = w.zc;
			if (w.kind === 'shell') fields.zturn = w.zturn;
			return { columns: ['x', 'z', 'v'], rows: mirrored(r.points, true), x: 'x', note: `${which}; v is the ingoing time`, fields };
		}
		if (t !== undefined) {
			throw new p.holo.HoloError(`t is the time since a quench: the ${p.bulk.name} bulk is static`, 't', 'use vaidya d=… zh=… first');
		}
		const st = p.holo.staticProfile(p.bulk.slice, l);
		return {
			columns: ['x', 'z'],
			rows: mirrored(st.points, false),
			x: 'x',
			note: 'the RT surface x(z), tip at x = 0',
			fields: { l, zstar: st.zstar }
		};
	}
});
