/**
 * `firstlaw/tent/mu … along=m,q` for a metric through POST /api/eval: the charged brane written as
 * f = 1 − m z⁴ + q² z⁶ (m = (1+q_c²)/zh⁴, q = q_c/zh³) reproduces the charged bulk's first law at orders 1–3 to
 * 1e−10. The charged bulk's own first law is checked against 25-digit mpmath differences in the unit tests
 * (order 1: Bhattacharya, Nozaki, Takayanagi & Ugajin 2013). The translation (derived in holo/metric/along.ts):
 * T_ent is the same; μ_q = μ_Q·2(d−1)/g_d with g_d = √((d−1)/(2(d−2))); the charged δzh direction (δ ln zh = −1/d
 * at fixed q_c) is δm = m, δq = q(d−1)/d, and its δq_c direction is δm = 2q_c/zh⁴, δq = 1/zh³.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, type Client } from '../helpers/client';

let c: Client;
beforeAll(async () => {
	c = await signedIn('tomas@sable.test');
});

type R = { kind: string; value?: number; fields?: Record<string, number>; lhs?: number; rhs?: number; residual?: number; message?: string };

async function results(input: string): Promise<R[]> {
	const r = await c.post('/api/eval', { input });
	expect(r.status, JSON.stringify(r.body).slice(0, 300)).toBe(200);
	return r.body.results as R[];
}

/** Named fields of a check line, read back as `#n.<field>` in a pad, as a user would. */
async function checkFields(line: string, names: string[]): Promise<Record<string, number>> {
	const pad = (await c.post('/api/pads', { title: 'along' })).body.pad.id as string;
	const run = async (input: string) => {
		const r = await c.post('/api/eval', { input, pad });
		expect(r.status, JSON.stringify(r.body).slice(0, 300)).toBe(200);
		return r.body as { step: { n: number }; results: R[] };
	};
	const [use, verb] = line.split('; ');
	await run(use!);
	const n = (await run(verb!)).step.n;
	const out: Record<string, number> = {};
	for (const name of names) {
		const v = (await run(`#${n}.${name}`)).results[0]!;
		expect(v.kind, JSON.stringify(v).slice(0, 300)).toBe('scalar');
		out[name] = v.value!;
	}
	return out;
}

const close = (what: string, a: number, b: number, tol = 1e-10) =>
	expect(Math.abs(b - a) / Math.abs(a), `${what}: ${a} vs ${b}`).toBeLessThanOrEqual(tol);

const d = 4;
const zh = 1.1;
const qc = 0.7;
const m = (1 + qc * qc) / Math.pow(zh, d);
const q = qc / Math.pow(zh, d - 1);
const charged = `use charged d=4 zh=${zh} q=${qc}`;
const metric = `use metric d=4 f="1 - m*z^4 + q^2*z^6" m=${m} q=${q}`;

describe('metric first law along named parameters, through the API', () => {
	it('the charged brane as a metric, along=m,q: firstlaw, tent and mu at o=1..3 equal the charged bulk’s (1e−10)', async () => {
		const gd = Math.sqrt((d - 1) / (2 * (d - 2)));
		for (const o of [1, 2, 3]) {
			const l = 0.5;
			const A = await checkFields(`${charged}; firstlaw l=${l} o=${o}`, ['tent', 'lhs', 'rhs', 'residual', 'lhs_q']);
			const F = await checkFields(`${metric}; firstlaw l=${l} o=${o} along=m,q`, [
				'tent',
				...['lhs', 'rhs', 'residual'].flatMap((x) => [`${x}_m`, `${x}_q`])
			]);
			close(`tent o=${o}`, A.tent!, F.tent!);
			const at = (x: 'lhs' | 'rhs' | 'residual', wm: number, wq: number) => wm * F[`${x}_m`]! + wq * F[`${x}_q`]!;
			close(`scale lhs o=${o}`, A.lhs!, at('lhs', m, (q * (d - 1)) / d));
			close(`scale rhs o=${o}`, A.rhs!, at('rhs', m, (q * (d - 1)) / d));
			close(`scale residual o=${o}`, A.residual!, at('residual', m, (q * (d - 1)) / d), 1e-9);
			close(`δq lhs o=${o}`, A.lhs_q!, at('lhs', (2 * qc) / Math.pow(zh, d), 1 / Math.pow(zh, d - 1)));
			const [t] = (await results(`${metric}; tent l=${l} o=${o} along=m,q`)).slice(1);
			close(`tent verb o=${o}`, (await results(`${charged}; tent l=${l} o=${o}`))[1]!.value!, t!.value!);
			if (o > 1) {
				const [u] = (await results(`${metric}; mu l=${l} o=${o} along=m,q`)).slice(1);
				close(`μ o=${o}`, (await results(`${charged}; mu l=${l} o=${o}`))[1]!.value! * ((2 * (d - 1)) / gd), u!.value!);
			}
		}
	});

	it('an unknown parameter in along= is an error naming it', async () => {
		const r = await c.post('/api/eval', { input: `${metric}; tent l=0.5 o=2 along=m,r` });
		expect(JSON.stringify(r.body)).toContain("along: 'r' is not a parameter of this metric");
	});
});
