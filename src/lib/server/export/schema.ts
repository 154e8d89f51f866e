/**
 * The versioned JSON form of a pad (`bulkpad-pad`, version 1) and its zod schema, used by export and import.
 * Pure: no database, so unit tests and scripts can use it. Imported files are untrusted, so every string has
 * a length cap and every array a count cap (the 1 MB body limit is checked before this).
 */
import { z } from 'zod';
import { DEFAULT_LIMITS } from '../../lang/limits';

export const PAD_FORMAT = 'bulkpad-pad';
export const PAD_FORMAT_VERSION = 1;
export const MAX_IMPORT_BYTES = 1_000_000;
export const MAX_IMPORT_STEPS = 1000;

const label = z.string().max(500);
const latex = z.string().max(20_000);
/** JSON has no NaN or ±Infinity: a non-finite number was written as null */
const num = z.number().nullable();
const fields = z.record(z.string().max(100), num);
const warning = z.string().max(2000).optional();
const order = z.union([z.number(), z.literal('exact')]);

export const resultSchema = z.discriminatedUnion('kind', [
	z.looseObject({ kind: z.literal('scalar'), label, value: num, order, unit: z.string().max(100).optional(), latex: latex.optional(), warning }),
	z.looseObject({ kind: z.literal('record'), label, fields, latex: latex.optional(), warning }),
	z.looseObject({
		kind: z.literal('table'),
		label,
		columns: z.array(z.string().max(200)).max(100),
		rows: z.array(z.array(z.union([z.number(), z.string().max(500), z.null()])).max(100)).max(20_000),
		warning
	}),
	z.looseObject({
		kind: z.literal('series'),
		label,
		terms: z.array(z.looseObject({ k: z.number(), coeff: num, latex })).max(200),
		latex,
		warning
	}),
	z.looseObject({ kind: z.literal('check'), label, pass: z.boolean(), lhs: num, rhs: num, residual: num, tolerance: num, warning }),
	z.looseObject({ kind: z.literal('note'), text: z.string().max(5000) })
]);

export const bulkSchema = z.object({
	name: z.string().min(1).max(40),
	params: z.record(z.string().max(40), z.union([z.number(), z.string().max(500)]))
});

export const unitsSchema = z.discriminatedUnion('system', [
	z.object({ system: z.literal('geo'), G: z.number() }),
	z.object({ system: z.literal('cft'), c: z.number() }),
	z.object({ system: z.literal('sym'), N: z.number() })
]);

const refSchema = z.object({ value: z.number().optional(), fields: z.record(z.string().max(100), z.number()) });

export const stepErrorSchema = z.looseObject({
	message: z.string().max(2000),
	start: z.number().int().min(0).optional(),
	end: z.number().int().min(0).optional(),
	hint: z.string().max(2000).optional()
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
		lets: z.record(z.string().max(100), refSchema).optional(),
		steps: z.array(exportedStepSchema).max(MAX_IMPORT_STEPS, `at most ${MAX_IMPORT_STEPS} steps`)
	})
	.superRefine((doc, ctx) => {
		doc.steps.forEach((s, i) => {
			if (s.n !== i + 1) ctx.addIssue({ code: 'custom', path: ['steps', i, 'n'], message: `steps must be numbered 1, 2, 3, …; found ${s.n} at position ${i + 1}` });
			if (s.status === 'ok' && !s.results) ctx.addIssue({ code: 'custom', path: ['steps', i, 'results'], message: 'a step with status "ok" needs results' });
			if (s.status === 'error' && !s.error) ctx.addIssue({ code: 'custom', path: ['steps', i, 'error'], message: 'a step with status "error" needs an error' });
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

/** Validates an untrusted document; the message names the first few offending paths. */
export function parsePadDocument(raw: unknown): { ok: true; doc: PadDocument } | { ok: false; message: string } {
	const parsed = padDocumentSchema.safeParse(raw);
	if (parsed.success) return { ok: true, doc: parsed.data };
	const issues = parsed.error.issues.slice(0, 5).map((i) => `${i.path.length ? i.path.join('.') + ': ' : ''}${i.message}`);
	const more = parsed.error.issues.length > 5 ? ` (and ${parsed.error.issues.length - 5} more)` : '';
	return { ok: false, message: `Not a Bulkpad pad file: ${issues.join('; ')}${more}` };
}
