/**
 * Request bodies that used to be written inline in their routes, moved here so the route and the OpenAPI
 * document (src/lib/server/openapi) read the very same zod schema: what /api/openapi.json describes is what
 * the route validates. Schemas that already lived beside their domain code (signUpSchema, proposeSchema…) stay
 * there; the document imports them from where they are.
 */
import { z } from 'zod';
import { emailSchema, passwordSchema } from './auth/accounts';
import { signupPolicySchema } from './auth/policy';
import { titleSchema, validityTolSchema } from './pad-view';
import { figureLabelsPatchSchema } from './figure-labels';
import { stepNameSchema } from './steps';
import { NOTE_MAX } from './transcripts';

/** a single-use link's token (confirmation, invitation) */
export const tokenBodySchema = z.object({ token: z.string().min(10).max(200) });
export const emailBodySchema = z.object({ email: emailSchema });
export const resetConfirmSchema = z.object({ token: z.string().min(10).max(200), password: passwordSchema });
export const signupSettingsSchema = z.object({ signup: signupPolicySchema });

export const evalBodySchema = z.object({
	input: z
		.string()
		.max(100_000, 'input is far over the 2000-character limit')
		.meta({ description: 'one line of the Bulkpad language', examples: ['darea l=0.3 o=2'] }),
	pad: z.string().min(1).max(64).optional().meta({ description: 'a pad id: store the line as its next step' })
});

export const padCreateSchema = z.object({ title: titleSchema.optional() });
export const padChangeSchema = z
	.object({ title: titleSchema.optional(), validityTol: validityTolSchema.nullable().optional() })
	.refine((b) => b.title !== undefined || b.validityTol !== undefined, 'Give a title or a validityTol.')
	.meta({ examples: [{ title: 'Boosted brane: first law at order 3' }, { validityTol: 1e-4 }] });
export const attemptDismissSchema = z.object({ dismissed: z.boolean() });
export const shareSchema = z.object({
	expiresInDays: z.number().int().min(1).max(365).optional(),
	note: z.string().max(NOTE_MAX, `A note has at most ${NOTE_MAX} characters.`).optional()
});
export const stepChangeSchema = z
	.object({ hidden: z.boolean().optional(), name: stepNameSchema.nullable().optional(), figureLabels: figureLabelsPatchSchema.optional() })
	.strict();
export const stepRerunSchema = z.object({
	input: z
		.string()
		.min(1)
		.max(100_000)
		.meta({ examples: ['darea l=0.4 o=2'] })
});
