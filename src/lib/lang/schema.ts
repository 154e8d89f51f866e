/**
 * zod schemas for what a line may say: one per bulk (its keys, defaults and physical ranges) and one per
 * quantity key of the verbs, plus each verb's forms (strip, ball, pair, or the quantity a series verb works on)
 * and the keys each form takes. Values reach these schemas already evaluated (numbers, 'exact', strings), one
 * point at a time, so a range is checked at every point it visits.
 */
import { z } from 'zod';
import type { Order } from './result';
import { BULK_KEYS, WORD_KEYS, type BulkName } from './vocab';
import { shortNumber } from './format';

const dim = (min: number, why = '') =>
	z.number('d must be a number').int('d must be a whole number').min(min, `d must be ≥ ${min}${why}`).max(10, 'd must be ≤ 10');
const positive = (key: string) => z.number(`${key} must be a number`).positive(`${key} must be > 0`);
const formula = (key: string) => z.string(`${key} must be a string, e.g. ${key}="1 - (z/zh)^4"`).min(1, `${key} must not be empty`);

/** PHYSICS.md: 2 ≤ d ≤ 10; a boosted, wave or soliton bulk needs a transverse direction, so d ≥ 3. */
export const BULK_SCHEMAS = {
	vacuum: z.object({ d: dim(2).default(4) }).strict(),
	brane: z.object({ d: dim(2).default(4), zh: positive('zh').default(1) }).strict(),
	boosted: z
		.object({
			d: dim(3, ' for a boost along a transverse direction').default(4),
			zh: positive('zh').default(1),
			v: z
				.number('v must be a number')
				.refine((v) => Math.abs(v) < 1, 'v must satisfy |v| < 1')
				.optional(),
			rapidity: z.number('rapidity must be a number').optional()
		})
		.strict(),
	charged: z
		.object({ d: dim(2).default(4), zh: positive('zh').default(1), q: z.number('q must be a number').default(0) })
		.strict()
		.superRefine((b, ctx) => {
			// PHYSICS.md: extremal at q² = d/(d−2); beyond it T < 0 and there is no horizon at zh
			// at d = 2 the charge drops out of f (plain BTZ) but would change e and p: refused
			if (b.d === 2 && b.q !== 0) {
				ctx.addIssue({
					code: 'custom',
					path: ['q'],
					message: 'charged needs d ≥ 3 for q ≠ 0: at d = 2 the charge drops out of the metric (plain BTZ)'
				});
			}
			if (b.d > 2 && b.q * b.q > b.d / (b.d - 2)) {
				ctx.addIssue({
					code: 'custom',
					path: ['q'],
					message: `q must satisfy q² ≤ d/(d−2) = ${fmt(b.d / (b.d - 2))} (the extremal brane)`
				});
			}
		}),
	dp: z
		.object({
			p: z.number('p must be a number').int('p must be a whole number').min(0, 'p must be ≥ 0').max(6, 'p must be ≤ 6').default(4),
			zh: positive('zh').default(1)
		})
		.strict()
		.refine((b) => b.p !== 5, { path: ['p'], message: 'p = 5 has no decoupled near-horizon limit of this kind: pick p ≠ 5' }),
	wave: z.object({ d: dim(3, ' for a wave along a transverse direction').default(4), zp: positive('zp').default(1) }).strict(),
	soliton: z.object({ d: dim(3, ' for a circle to cap off').default(4), z0: positive('z0').default(1) }).strict(),
	metric: z
		.object({
			d: dim(2).default(4),
			f: formula('f'),
			h: formula('h').default('1'),
			g: formula('g').optional(),
			params: z.string('params must be a string of names, e.g. params="m,q"').optional()
		})
		.catchall(z.number('extra metric keys must be numbers')),
	// the quench solver covers d = 2…6 (PHYSICS.md, "Quench")
	vaidya: z
		.object({
			d: z.number('d must be a number').int('d must be a whole number').min(2, 'd must be ≥ 2').max(6, 'vaidya takes d ≤ 6').default(4),
			zh: positive('zh').default(1)
		})
		.strict()
} satisfies Record<BulkName, z.ZodType>;

const fmt = shortNumber;

export type Checked<T> = { ok: true; value: T } | { ok: false; key?: string; message: string; hint?: string };

function fromZod<T>(r: z.ZodSafeParseResult<T>, unknownKey: (k: string) => { message: string; hint?: string }): Checked<T> {
	if (r.success) return { ok: true, value: r.data };
	const issue = r.error.issues[0]!;
	if (issue.code === 'unrecognized_keys') {
		const k = issue.keys[0]!;
		return { ok: false, key: k, ...unknownKey(k) };
	}
	const key = typeof issue.path[0] === 'string' ? issue.path[0] : undefined;
	return key === undefined ? { ok: false, message: issue.message } : { ok: false, key, message: issue.message };
}

/** Check a bulk's parameters; the value has defaults filled in. */
export function checkBulk(name: BulkName, params: Record<string, unknown>): Checked<Record<string, number | string>> {
	const r = BULK_SCHEMAS[name].safeParse(params) as z.ZodSafeParseResult<Record<string, number | string>>;
	return fromZod(r, (k) => ({
		message: `key '${k}' does not apply to bulk '${name}'`,
		hint: `${name} takes ${BULK_KEYS[name].join(', ')}`
	}));
}

/** The order, or why the value is none. The ≤ maxOrder check is a limit, made by the evaluator. */
export function checkOrder(v: unknown): Checked<Order> {
	if (v === 'exact') return { ok: true, value: 'exact' };
	if (typeof v !== 'number' || !Number.isInteger(v)) return { ok: false, key: 'o', message: 'order must be a whole number ≥ 0 or exact' };
	if (v < 0) return { ok: false, key: 'o', message: 'order must be ≥ 0' };
	return { ok: true, value: v };
}

/** The same check as a zod schema, for callers that validate whole objects. */
export const ORDER = z.unknown().transform((v, ctx): Order => {
	const c = checkOrder(v);
	if (c.ok) return c.value;
	ctx.addIssue({ code: 'custom', message: c.message });
	return z.NEVER;
});

/** Every quantity key of every verb. */
export const KEY_SCHEMAS: Record<string, z.ZodType> = {
	l: positive('l'),
	R: positive('R'),
	gap: positive('gap'),
	zstar: positive('zstar'),
	G: positive('G'),
	tol: z.number('tol must be a number').positive('tol must be > 0').max(1, 'tol must be ≤ 1'),
	o: ORDER,
	of: word('of'),
	phase: word('phase'),
	// a metric's named parameters for the first law (`along=m,q`): one string of names, read by keys.ts
	along: z
		.string('along takes parameter names, e.g. along=m,q')
		.regex(/^[A-Za-z_][A-Za-z0-9_]*(,[A-Za-z_][A-Za-z0-9_]*)*$/, 'along takes parameter names, e.g. along=m,q'),
	// boundary time since the quench (time-dependent bulks); t < 0 is before it
	t: z.number('t must be a number').refine((t) => Number.isFinite(t), 't must be finite')
};

function word(key: string): z.ZodType {
	const allowed = WORD_KEYS[key]!;
	return z.enum(allowed as [string, ...string[]], `${key} must be one of ${allowed.join(', ')}`);
}

/** Check one quantity key's value. */
export function checkKey(key: string, value: unknown): Checked<unknown> {
	const s = Object.prototype.hasOwnProperty.call(KEY_SCHEMAS, key) ? KEY_SCHEMAS[key] : undefined;
	if (!s) return { ok: false, key, message: `unknown key '${key}'` };
	const r = s.safeParse(value);
	if (r.success) return { ok: true, value: r.data };
	return { ok: false, key, message: r.error.issues[0]!.message };
}

/** `units geo G=…`, `units cft c=…`, `units sym N=…` */
export const UNITS_SCHEMAS = {
	geo: z.object({ G: positive('G').default(1) }).strict(),
	cft: z.object({ c: positive('c') }).strict(),
	sym: z.object({ N: positive('N') }).strict()
};

export function checkUnits(system: keyof typeof UNITS_SCHEMAS, params: Record<string, unknown>): Checked<Record<string, number>> {
	const r = UNITS_SCHEMAS[system].safeParse(params) as z.ZodSafeParseResult<Record<string, number>>;
	const takes = { geo: 'G', cft: 'c', sym: 'N' }[system];
	const res = fromZod(r, (k) => ({ message: `units ${system} takes ${takes}=…, not '${k}'` }));
	if (!res.ok && res.key === takes && params[takes] === undefined) {
		return { ok: false, message: `units ${system} needs ${takes}=…` };
	}
	return res;
}
