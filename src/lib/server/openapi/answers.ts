/**
 * Answer shapes for the OpenAPI document. The routes build their answers from typed code, not from these
 * schemas, so the answers are described loosely (z.looseObject: more fields are fine, as API.md promises) and
 * only where a script needs the shape: the evaluation reply and its results, keys, errors. The eval shapes
 * follow src/lib/lang/result.ts; tests/api/openapi.test.ts checks real replies against them.
 */
import { z } from 'zod';

const order = z.union([z.number(), z.literal('exact')]);

export const resultSchema = z
	.discriminatedUnion('kind', [
		z.looseObject({
			kind: z.literal('scalar'),
			label: z.string(),
			value: z.number(),
			order,
			unit: z.string().optional(),
			latex: z.string().optional(),
			warning: z.string().optional()
		}),
		z.looseObject({ kind: z.literal('record'), label: z.string(), fields: z.record(z.string(), z.number()), latex: z.string().optional() }),
		z.looseObject({
			kind: z.literal('table'),
			label: z.string(),
			columns: z.array(z.string()),
			rows: z.array(z.array(z.union([z.number(), z.string(), z.null()])))
		}),
		z.looseObject({
			kind: z.literal('series'),
			label: z.string(),
			terms: z.array(z.looseObject({ k: z.number(), coeff: z.number(), latex: z.string() })),
			latex: z.string()
		}),
		z.looseObject({
			kind: z.literal('check'),
			label: z.string(),
			pass: z.boolean(),
			lhs: z.number(),
			rhs: z.number(),
			residual: z.number(),
			tolerance: z.number()
		}),
		z.looseObject({ kind: z.literal('figure'), label: z.string(), steps: z.array(z.number()) }),
		z.looseObject({ kind: z.literal('note'), text: z.string() })
	])
	.meta({ id: 'Result' });

export const errorSchema = z
	.looseObject({
		ok: z.literal(false),
		error: z.looseObject({
			message: z.string(),
			issues: z.array(z.object({ path: z.string(), message: z.string() })).optional(),
			retryAfter: z.number().optional()
		})
	})
	.meta({ id: 'Error' });

/** A language error points at characters of the line: [start, end) and perhaps a hint. */
export const lineErrorSchema = z
	.looseObject({
		ok: z.literal(false),
		error: z.looseObject({
			message: z.string(),
			start: z.number(),
			end: z.number(),
			hint: z.string().optional(),
			code: z.string().optional()
		})
	})
	.meta({ id: 'LineError' });

export const evalReplySchema = z
	.looseObject({
		ok: z.literal(true),
		step: z.looseObject({ id: z.string(), n: z.number(), version: z.number().optional() }).optional(),
		bulk: z.looseObject({ name: z.string(), params: z.record(z.string(), z.unknown()) }),
		ms: z.number(),
		results: z.array(resultSchema)
	})
	.meta({ id: 'EvalReply' });

/** One line of the `application/x-ndjson` form of POST /api/eval: progress lines, then the reply. */
export const evalStreamLineSchema = z
	.union([
		z.object({ progress: z.object({ done: z.number(), total: z.number() }) }),
		z.object({ reply: z.object({ status: z.number(), body: z.unknown() }) })
	])
	.meta({ id: 'EvalStreamLine' });

const keyListed = z.looseObject({
	id: z.string(),
	label: z.string(),
	prefix: z.string(),
	createdAt: z.string(),
	lastUsedAt: z.string().nullable(),
	perMinute: z.number(),
	expiresAt: z.string().nullable()
});
export const keyListSchema = z.looseObject({ ok: z.literal(true), keys: z.array(keyListed) });
export const keyMadeSchema = z.looseObject({
	ok: z.literal(true),
	key: z.string(),
	id: z.string(),
	prefix: z.string(),
	label: z.string(),
	perMinute: z.number(),
	expiresAt: z.string().nullable()
});

/** Any other success: `{ ok: true, … }` with the fields the route's summary names. */
export const okSchema = z.looseObject({ ok: z.literal(true) }).meta({ id: 'Ok' });
