/**
 * The versioned JSON form of a pad (`bulkpad-pad`, version 1) and its zod schema, used by export and import.
 * Pure: no database, so unit tests and scripts can use it. Imported files are untrusted, so every string has
 * a length cap and every array a count cap (the 1 MB body limit is checked before this).
 */
import { z } from 'zod';
import { DEFAULT_LIMITS } from '../../lang/limits';
import { checkBulk, checkUnits } from '../../lang/schema';
import { BULKS, UNIT_SYSTEMS, isBulk } from '../../lang/vocab';

export const PAD_FORMAT = 'bulkpad-pad';
export const PAD_FORMAT_VERSION = 1;
export const MAX_IMPORT_BYTES = 1_000_000;
export const MAX_IMPORT_STEPS = 1000;

const label = z.string().max(500);
/** the longest formula the language writes (boosted d=5 coefficients to order 12) is ~430k characters */
const latex = z.string().max(600_000);
/** JSON has no NaN or ±Infinity: a non-finite number was written as null */
const num = z.number().nullable();
const numbers = z.record(z.string().max(100), num).refine((r) => Object.keys(r).length <= 200, 'at most 200 fields');
const warning = z.string().max(2000).optional();
const order = z.union([z.number(), z.literal('exact')]);
/**
 * A field result.ts does not name yet (the engine may add fields; API.md allows more): accepted only as a
 * plain value or a flat record of numbers, so nothing nested or unbounded rides along on an unknown key.
 */
const extra = z.union([z.number(), z.string().max(2000), z.boolean(), z.null(), numbers]);
/**
 * An object with exactly these typed fields plus, at most, plain extras. Typed as a loose object (extras are
 * `unknown` to TypeScript): an index signature of `extra` would clash with the named fields' own types.
 */
const shape = <T extends z.ZodRawShape>(fields: T) => z.object(fields).catchall(extra) as unknown as z.ZodObject<T, z.core.$loose>;

/** The result types of src/lib/lang/result.ts, field by field: an allow-list, not a loose bag. */
export const resultSchema = z.discriminatedUnion('kind', [
	shape({
		kind: z.literal('scalar'),
		label,
		value: num,
		order,
		unit: z.string().max(100).optional(),
		latex: latex.optional(),
		warning,
		fields: numbers.optional()
	}),
	shape({ kind: z.literal('record'), label, fields: numbers, latex: latex.optional(), warning }),
	shape({
		kind: z.literal('table'),
		label,
		columns: z.array(z.string().max(200)).max(100),
		rows: z.array(z.array(z.union([z.number(), z.string().max(500), z.null()])).max(100)).max(20_000),
		plot: shape({
			x: z.string().max(200),
			log: z.boolean().optional(),
			validity: numbers.optional(),
			dataset: z.string().max(200).optional(),
			show: z.boolean().optional(),
			// reference curves under a growth plot (result.ts PlotGuide): a few, each a bounded polyline
			guides: z
				.array(shape({ label, points: z.array(z.tuple([num, num])).max(20_000) }))
				.max(10)
				.optional()
		}).optional(),
		warning,
		latex: latex.optional(),
		download: shape({ format: z.literal('csv'), filename: z.string().max(200) }).optional()
	}),
	shape({
		kind: z.literal('series'),
		label,
		terms: z.array(shape({ k: z.number(), coeff: num, latex, power: z.number().optional() })).max(200),
		latex,
		list: latex.optional(),
		text: z.string().max(20_000).optional(),
		order: order.optional(),
		warning
	}),
	shape({
		kind: z.literal('check'),
		label,
		pass: z.boolean(),
		lhs: num,
		rhs: num,
		residual: num,
		tolerance: num,
		order: order.optional(),
		warning,
		relation: z.string().max(500).optional(),
		chi2dof: num.optional(),
		pvalue: num.optional()
	}),
	shape({
		kind: z.literal('figure'),
		label,
		steps: z.array(z.number().int().positive()).min(1).max(8),
		xlabel: z.string().max(200).optional(),
		ylabel: z.string().max(200).optional()
	}),
	shape({ kind: z.literal('note'), text: z.string().max(5000) })
]);

const bulkNames = BULKS.join(', ');

/**
 * A bulk as a pad stores it, checked by the language's own schema for that bulk (src/lib/lang/schema.ts), so
 * an imported pad can only hold a bulk a `use` line could have set. Only zod runs here: the engine's checks
 * (and a metric's formula) are evaluated later, in a worker, when a line uses the bulk.
 */
export const bulkSchema = z
	.object({
		name: z.string().min(1).max(40),
		params: z.record(z.string().max(40), z.union([z.number(), z.string().max(500)]))
	})
	.superRefine((b, ctx) => {
		if (!isBulk(b.name)) {
			ctx.addIssue({ code: 'custom', path: ['name'], message: `unknown bulk '${b.name}': Bulkpad knows ${bulkNames}` });
			return;
		}
		const checked = checkBulk(b.name, b.params);
		if (!checked.ok) {
			const message = `bulk ${b.name}: ${checked.message}${checked.hint ? ` (${checked.hint})` : ''}`;
			ctx.addIssue({ code: 'custom', path: checked.key ? ['params', checked.key] : ['params'], message });
		}
	});

/** Units as `units geo|cft|sym …` would set them, checked by the language's units schema. */
export const unitsSchema = z
	.object({ system: z.enum(UNIT_SYSTEMS, { error: `units: the system is ${UNIT_SYSTEMS.join(', ')}` }) })
	.catchall(z.unknown())
	.superRefine((u, ctx) => {
		const { system, ...params } = u;
		const checked = checkUnits(system, params);
		if (!checked.ok) ctx.addIssue({ code: 'custom', path: checked.key ? [checked.key] : [], message: checked.message });
	});

const refSchema = z.object({ value: z.number().optional(), fields: z.record(z.string().max(100), z.number()), order: order.optional() });

/** A let-name as the lexer reads a name; a key that would reach Object.prototype is no name. */
const letName = z
	.string()
	.max(100)
	.regex(/^[A-Za-z_][A-Za-z0-9_]*$/, 'a let name is a letter or _ followed by letters, digits or _')
	.refine((n) => !['__proto__', 'constructor', 'prototype'].includes(n), 'not a let name');

export const stepErrorSchema = shape({
	message: z.string().max(2000),
	start: z.number().int().min(0).optional(),
	end: z.number().int().min(0).optional(),
	hint: z.string().max(2000).optional(),
	code: z.string().max(40).optional()
});

export const exportedStepSchema = z.object({
	n: z.number().int().min(1),
	input: z.string().max(DEFAULT_LIMITS.maxInput),
	status: z.enum(['ok', 'error', 'pending']),
	results: z.array(resultSchema).max(100).nullable(),
	error: stepErrorSchema.nullable(),
	/** optional extras written by Bulkpad so an imported pad keeps `#n` references and replays from the same bulk */
	ref: refSchema.nullable().optional(),
	bulkBefore: bulkSchema.nullable().optional()
});

export const padDocumentSchema = z
	.object({
		format: z.literal(PAD_FORMAT, { error: `format must be "${PAD_FORMAT}"` }),
		version: z.literal(PAD_FORMAT_VERSION, { error: `version must be ${PAD_FORMAT_VERSION} (the only one this Bulkpad reads)` }),
		title: z.string().trim().min(1).max(200),
		bulk: bulkSchema,
		units: unitsSchema,
		lets: z.record(letName, refSchema).optional(),
		steps: z.array(exportedStepSchema).max(MAX_IMPORT_STEPS, `at most ${MAX_IMPORT_STEPS} steps`)
	})
	.superRefine((doc, ctx) => {
		doc.steps.forEach((s, i) => {
			if (s.n !== i + 1)
				ctx.addIssue({
					code: 'custom',
					path: ['steps', i, 'n'],
					message: `steps must be numbered 1, 2, 3, …; found ${s.n} at position ${i + 1}`
				});
			if (s.status === 'ok' && !s.results)
				ctx.addIssue({ code: 'custom', path: ['steps', i, 'results'], message: 'a step with status "ok" needs results' });
			if (s.status === 'error' && !s.error)
				ctx.addIssue({ code: 'custom', path: ['steps', i, 'error'], message: 'a step with status "error" needs an error' });
		});
	});

export type PadDocument = z.infer<typeof padDocumentSchema>;
export type ExportedStep = z.infer<typeof exportedStepSchema>;

/** What export needs from a pad and its steps (the rows' JSON columns, as stored). */
export interface PadSource {
	title: string;
	bulk: unknown;
	units: unknown;
	lets: unknown;
	steps: { n: number; input: string; status: string; results: unknown; error: unknown; ref?: unknown; bulkBefore?: unknown }[];
}

/** The versioned document of a pad. Stored JSON is written back as stored (it came from the engine). */
export function toPadDocument(src: PadSource): PadDocument {
	return {
		format: PAD_FORMAT,
		version: PAD_FORMAT_VERSION,
		title: src.title,
		bulk: src.bulk as PadDocument['bulk'],
		units: src.units as PadDocument['units'],
		lets: (src.lets ?? {}) as PadDocument['lets'],
		steps: src.steps.map((s) => ({
			n: s.n,
			input: s.input,
			status: s.status as ExportedStep['status'],
			results: (s.results ?? null) as ExportedStep['results'],
			error: (s.error ?? null) as ExportedStep['error'],
			ref: (s.ref ?? null) as ExportedStep['ref'],
			bulkBefore: (s.bulkBefore ?? null) as ExportedStep['bulkBefore']
		}))
	};
}

/** Where an issue is, for people: `step 3, steps.2.bulkBefore.name: …` (steps count from 1, paths from 0). */
function describeIssue(i: z.core.$ZodIssue): string {
	const path = i.path.map(String).join('.');
	const step = i.path[0] === 'steps' && typeof i.path[1] === 'number' ? `step ${i.path[1] + 1}, ` : '';
	return `${step}${path ? path + ': ' : ''}${i.message}`;
}

/** Validates an untrusted document; the message names the first few offending steps and paths. */
export function parsePadDocument(raw: unknown): { ok: true; doc: PadDocument } | { ok: false; message: string } {
	const parsed = padDocumentSchema.safeParse(raw);
	if (parsed.success) return { ok: true, doc: parsed.data };
	const issues = parsed.error.issues.slice(0, 5).map(describeIssue);
	const more = parsed.error.issues.length > 5 ? ` (and ${parsed.error.issues.length - 5} more)` : '';
	return { ok: false, message: `Not a Bulkpad pad file: ${issues.join('; ')}${more}` };
}
