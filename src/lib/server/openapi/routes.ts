/**
 * Every API route and method, described once: the zod schema the route validates its body (or query) with,
 * who may call it, and what it answers. /api/openapi.json and the API page (/help/api) are built from this list;
 * tests/unit/server/openapi.test.ts fails when a +server.ts method under src/routes/api has no entry here.
 */
import { z, type ZodType } from 'zod';
import {
	attemptDismissSchema,
	emailBodySchema,
	evalBodySchema,
	padCreateSchema,
	padChangeSchema,
	resetConfirmSchema,
	shareSchema,
	signupSettingsSchema,
	stepChangeSchema,
	stepRerunSchema,
	tokenBodySchema
} from '../api-schemas';
import { changePasswordSchema, signInSchema, signUpSchema } from '../auth/accounts';
import { setRoleSchema } from '../users';
import { createKeySchema } from '../keys';
import { changeSchema, proposeSchema, stateQuery } from '../macros';
import { commentSchema } from '../comments';
import { exportFormatSchema } from '../export';
import { padDocumentSchema } from '../export/schema';
import { evalReplySchema, evalStreamLineSchema, keyListSchema, keyMadeSchema } from './answers';

export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
/** who may call: anyone; any signed-in role (readers too); members and admins; admins only */
export type Auth = 'public' | 'signed-in' | 'writer' | 'admin';

export interface Operation {
	method: Method;
	/** SvelteKit's spelling, `/api/pads/[id]`; the document writes `{id}` */
	path: string;
	summary: string;
	auth: Auth;
	/** the JSON body schema the route validates with */
	body?: ZodType;
	/** a multipart upload instead of JSON: its field names and what they hold */
	multipart?: Record<string, string>;
	/** query parameters, each with the schema the route parses it with */
	query?: Record<string, ZodType>;
	/** the success status and, where a script needs it, the answer's schema */
	status?: number;
	answer?: ZodType;
	/** extra content types of the success answer (the eval stream), each with the schema of one line */
	stream?: Record<string, ZodType>;
	/** the download's media types, for routes that answer a file rather than JSON */
	download?: string[];
	/** error statuses worth naming beyond 400/401/403/404, with what they mean */
	errors?: Record<number, string>;
	/** the language error of an evaluation (400 with start/end/hint) */
	lineError?: boolean;
}

const lineRoutesErrors = {
	422: 'the line is refused as too large or over its time budget',
	429: 'too many lines waiting; see Retry-After',
	503: 'the evaluators are busy; see Retry-After'
};

export const operations: Operation[] = [
	// evaluation
	{
		method: 'POST',
		path: '/api/eval',
		summary:
			'Evaluate one line. Without pad nothing is stored; with pad the line becomes that pad\'s next step. Send Accept: application/x-ndjson to receive {"progress":{done,total}} lines while a sweep runs, then {"reply":{status,body}}.',
		auth: 'writer',
		body: evalBodySchema,
		answer: evalReplySchema,
		stream: { 'application/x-ndjson': evalStreamLineSchema },
		lineError: true,
		errors: lineRoutesErrors
	},
	// pads
	{ method: 'GET', path: '/api/pads', summary: "The caller's own pads, newest first.", auth: 'signed-in' },
	{
		method: 'POST',
		path: '/api/pads',
		summary: 'A fresh pad in the default bulk (an empty body is fine).',
		auth: 'writer',
		body: padCreateSchema,
		status: 201
	},
	{ method: 'GET', path: '/api/pads/[id]', summary: 'One pad with its steps (and, for its owner, its attempts).', auth: 'signed-in' },
	{
		method: 'PATCH',
		path: '/api/pads/[id]',
		summary: 'Rename a pad or set its validity tolerance (owner only).',
		auth: 'writer',
		body: padChangeSchema
	},
	{ method: 'DELETE', path: '/api/pads/[id]', summary: 'Delete a pad (owner only).', auth: 'writer' },
	{
		method: 'GET',
		path: '/api/pads/[id]/export',
		summary: 'The whole pad as a download (Markdown, LaTeX or the bulkpad-pad JSON document).',
		auth: 'signed-in',
		query: { format: exportFormatSchema.optional() },
		download: ['text/markdown', 'application/x-tex', 'application/json']
	},
	{
		method: 'POST',
		path: '/api/pads/import',
		summary: 'A bulkpad-pad JSON document (the body, or the file field of a multipart form) becomes a new pad.',
		auth: 'writer',
		body: padDocumentSchema,
		status: 201,
		errors: { 413: 'the document is over the import limit' }
	},
	{
		method: 'POST',
		path: '/api/pads/[id]/replay',
		summary: 'Re-evaluate every step now and mark drift; nothing is stored.',
		auth: 'signed-in'
	},
	{
		method: 'POST',
		path: '/api/pads/[id]/invite',
		summary: 'Mail a single-use invitation to read the pad.',
		auth: 'writer',
		body: emailBodySchema
	},
	{ method: 'GET', path: '/api/pads/[id]/invitations', summary: "Every invitation of the owner's pad.", auth: 'writer' },
	{
		method: 'DELETE',
		path: '/api/pads/[id]/invitations/[invitation]',
		summary: 'Revoke an invitation (and the access it gave).',
		auth: 'writer'
	},
	{ method: 'GET', path: '/api/pads/[id]/steps/[n]', summary: 'A step as it is now and every earlier version.', auth: 'signed-in' },
	{
		method: 'PATCH',
		path: '/api/pads/[id]/steps/[n]',
		summary: 'Hide or restore a step, name or unname it.',
		auth: 'writer',
		body: stepChangeSchema
	},
	{
		method: 'POST',
		path: '/api/pads/[id]/steps/[n]',
		summary: 'Re-run a step with an edited line, as its next version (the answer of POST /api/eval).',
		auth: 'writer',
		body: stepRerunSchema,
		answer: evalReplySchema,
		lineError: true,
		errors: lineRoutesErrors
	},
	{
		method: 'PATCH',
		path: '/api/pads/[id]/attempts/[attempt]',
		summary: 'Fold a failed line away, or bring it back.',
		auth: 'writer',
		body: attemptDismissSchema
	},
	// snapshots and transcripts
	{ method: 'GET', path: '/api/pads/[id]/share', summary: 'Every snapshot of the pad, live or not, newest first.', auth: 'writer' },
	{
		method: 'POST',
		path: '/api/pads/[id]/share',
		summary: 'A new snapshot of the pad behind a read-only link → {slug, url, expiresAt, note}.',
		auth: 'writer',
		body: shareSchema,
		status: 201
	},
	{ method: 'DELETE', path: '/api/pads/[id]/share/[slug]', summary: 'Revoke a snapshot link.', auth: 'writer' },
	{ method: 'GET', path: '/api/pads/[id]/share/[slug]/comments', summary: "The comments on one of the owner's snapshots.", auth: 'writer' },
	{ method: 'GET', path: '/api/t/[slug]', summary: 'The public transcript of a snapshot.', auth: 'public' },
	{
		method: 'GET',
		path: '/api/t/[slug]/export',
		summary: 'The snapshot as a download.',
		auth: 'public',
		query: { format: exportFormatSchema.optional() },
		download: ['text/markdown', 'application/x-tex', 'application/json']
	},
	{
		method: 'POST',
		path: '/api/t/[slug]/replay',
		summary:
			'Re-evaluate every step of the snapshot now → {steps:[{n, drift, failed, delta, results?, error?}], drifted, failed, skipped}.',
		auth: 'public',
		errors: { 429: 'replayed too often; see Retry-After' }
	},
	{ method: 'POST', path: '/api/t/[slug]/fork', summary: 'Copy the snapshot into a new pad of your own.', auth: 'writer', status: 201 },
	{ method: 'GET', path: '/api/t/[slug]/comments', summary: "The snapshot's comments.", auth: 'signed-in' },
	{
		method: 'POST',
		path: '/api/t/[slug]/comments',
		summary: 'Comment on one step of the snapshot.',
		auth: 'signed-in',
		body: commentSchema,
		status: 201
	},
	// library
	{
		method: 'GET',
		path: '/api/macros',
		summary: 'The macro library as the caller may see it.',
		auth: 'signed-in',
		query: { state: stateQuery }
	},
	{
		method: 'POST',
		path: '/api/macros',
		summary: 'Propose a macro; it joins the library once an admin approves it.',
		auth: 'writer',
		body: proposeSchema,
		status: 201
	},
	{ method: 'GET', path: '/api/macros/[id]', summary: 'One macro with every version it has had.', auth: 'signed-in' },
	{ method: 'PATCH', path: '/api/macros/[id]', summary: 'Approve or retire (admin), or edit a macro.', auth: 'writer', body: changeSchema },
	{
		method: 'POST',
		path: '/api/macros/[id]/trial',
		summary: 'Run a macro on its example parameters in a fresh pad; nothing is stored.',
		auth: 'writer'
	},
	// datasets
	{ method: 'GET', path: '/api/datasets', summary: "The caller's datasets (without rows) and the upload limits.", auth: 'signed-in' },
	{
		method: 'POST',
		path: '/api/datasets',
		summary: 'Upload a CSV dataset.',
		auth: 'writer',
		multipart: { file: 'the CSV file', name: 'optional: the name compare refers to' },
		status: 201,
		errors: { 413: 'the file is over the upload limit' }
	},
	{ method: 'GET', path: '/api/datasets/[id]', summary: 'A dataset with its columns and every row.', auth: 'signed-in' },
	{ method: 'DELETE', path: '/api/datasets/[id]', summary: 'Delete a dataset.', auth: 'writer' },
	// keys
	{
		method: 'GET',
		path: '/api/keys',
		summary: "The caller's keys: label, prefix, limit and expiry, never the key.",
		auth: 'signed-in',
		answer: keyListSchema
	},
	{
		method: 'POST',
		path: '/api/keys',
		summary: 'Make a key (from a signed-in session, not with another key); the key is in this answer and nowhere else.',
		auth: 'writer',
		body: createKeySchema,
		status: 201,
		answer: keyMadeSchema
	},
	{ method: 'DELETE', path: '/api/keys/[id]', summary: 'Revoke one of your keys.', auth: 'signed-in' },
	// accounts
	{
		method: 'POST',
		path: '/api/auth/signup',
		summary: 'Make an account; it signs in once its address is confirmed.',
		auth: 'public',
		body: signUpSchema,
		status: 201
	},
	{
		method: 'POST',
		path: '/api/auth/signin',
		summary: 'Sign in; sets the session cookie.',
		auth: 'public',
		body: signInSchema,
		errors: { 429: 'too many wrong tries' }
	},
	{ method: 'POST', path: '/api/auth/signout', summary: 'End this session.', auth: 'public' },
	{ method: 'GET', path: '/api/auth/me', summary: 'Who the caller is, and whether by session or key.', auth: 'signed-in' },
	{
		method: 'POST',
		path: '/api/auth/password',
		summary: 'Change the password; every other session and every key ends.',
		auth: 'signed-in',
		body: changePasswordSchema
	},
	{
		method: 'POST',
		path: '/api/auth/confirm',
		summary: "Confirm an account's address with the mailed token.",
		auth: 'public',
		body: tokenBodySchema
	},
	{
		method: 'POST',
		path: '/api/auth/confirm/resend',
		summary: 'A new confirmation link for an unconfirmed account.',
		auth: 'public',
		body: emailBodySchema
	},
	{
		method: 'POST',
		path: '/api/auth/reset',
		summary: 'Mail a password-reset link (same answer for any address).',
		auth: 'public',
		body: emailBodySchema
	},
	{
		method: 'POST',
		path: '/api/auth/reset/confirm',
		summary: 'Set a new password with the mailed token.',
		auth: 'public',
		body: resetConfirmSchema
	},
	{ method: 'GET', path: '/api/auth/sessions', summary: "The caller's live sessions.", auth: 'signed-in' },
	{ method: 'DELETE', path: '/api/auth/sessions', summary: 'End every session of the caller except this one.', auth: 'signed-in' },
	{ method: 'DELETE', path: '/api/auth/sessions/[id]', summary: "End one of the caller's sessions.", auth: 'signed-in' },
	{
		method: 'POST',
		path: '/api/invitations/accept',
		summary: 'Accept an invitation to read a pad.',
		auth: 'signed-in',
		body: tokenBodySchema
	},
	// admin
	{ method: 'GET', path: '/api/admin/users', summary: 'Everyone in the group with their role.', auth: 'admin' },
	{
		method: 'PATCH',
		path: '/api/admin/users',
		summary: "Change someone's role; the last admin cannot be demoted.",
		auth: 'admin',
		body: setRoleSchema
	},
	{ method: 'GET', path: '/api/admin/settings', summary: 'The sign-up policy.', auth: 'admin' },
	{ method: 'PATCH', path: '/api/admin/settings', summary: 'Change the sign-up policy.', auth: 'admin', body: signupSettingsSchema },
	{ method: 'GET', path: '/api/admin/outbox', summary: 'The latest messages Bulkpad sent or tried to send.', auth: 'admin' },
	// service
	{
		method: 'GET',
		path: '/api/health',
		summary: '{ok, db, queue} after a real database query, for supervisors.',
		auth: 'public',
		errors: { 503: 'the database did not answer' }
	},
	{ method: 'GET', path: '/api/openapi.json', summary: 'This document.', auth: 'public', answer: z.looseObject({ openapi: z.string() }) }
];
