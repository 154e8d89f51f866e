import { sqliteTable, text, integer, real, index, uniqueIndex } from 'drizzle-orm/sqlite-core';
import type { BulkState, LetValue, Result, StepError, StepRef, UnitsState } from '../../lang/result';

/** Roles of PRODUCT.md: readers open what is shared with them, members work, admins curate. */
export const ROLES = ['admin', 'member', 'reader'] as const;
export type Role = (typeof ROLES)[number];

const createdAt = () =>
	integer('created_at', { mode: 'timestamp_ms' })
		.notNull()
		.$defaultFn(() => new Date());

export const users = sqliteTable('users', {
	id: text('id').primaryKey(),
	email: text('email').notNull().unique(),
	name: text('name').notNull(),
	passwordHash: text('password_hash').notNull(),
	role: text('role', { enum: ROLES }).notNull().default('member'),
	/** null until the address is confirmed through the mailed link; unconfirmed accounts cannot sign in */
	emailConfirmedAt: integer('email_confirmed_at', { mode: 'timestamp_ms' }),
	createdAt: createdAt()
});

/**
 * Lucia's sessions. The id is sha-256 of the cookie's token, never the token: a copy of the database holds no
 * live session.
 */
export const sessions = sqliteTable('sessions', {
	id: text('id').primaryKey(),
	userId: text('user_id')
		.notNull()
		.references(() => users.id, { onDelete: 'cascade' }),
	expiresAt: integer('expires_at').notNull(),
	createdAt: integer('created_at', { mode: 'timestamp_ms' }),
	lastSeenAt: integer('last_seen_at', { mode: 'timestamp_ms' }),
	/** the browser's User-Agent (cut short), so a person can tell their sessions apart */
	userAgent: text('user_agent')
});

export const pads = sqliteTable(
	'pads',
	{
		id: text('id').primaryKey(),
		ownerId: text('owner_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		title: text('title').notNull(),
		/** JSON BulkState, UnitsState and lets: the pad's state after its last step */
		bulk: text('bulk', { mode: 'json' }).$type<BulkState>().notNull(),
		units: text('units', { mode: 'json' }).$type<UnitsState>().notNull(),
		lets: text('lets', { mode: 'json' }).$type<Record<string, LetValue>>().notNull(),
		/** input history for Up/Down, newest last (includes lines that failed) */
		history: text('history', { mode: 'json' }).$type<string[]>().notNull(),
		createdAt: createdAt(),
		updatedAt: integer('updated_at', { mode: 'timestamp_ms' })
			.notNull()
			.$defaultFn(() => new Date()),
		// ── paper output (branch paper): the pad's validity tolerance ──
		/** relative tolerance of series warnings, `validity` and plot shading; null: the default (1e-3) */
		validityTol: real('validity_tol')
	},
	(t) => [index('pads_owner_idx').on(t.ownerId, t.updatedAt)]
);

/** Labels typed for one figure (branch paper): LaTeX, each absent one keeps the figure's default. */
export interface FigureLabels {
	xlabel?: string;
	ylabel?: string;
	legends?: Record<string, string>;
}

export const steps = sqliteTable(
	'steps',
	{
		id: text('id').primaryKey(),
		padId: text('pad_id')
			.notNull()
			.references(() => pads.id, { onDelete: 'cascade' }),
		n: integer('n').notNull(),
		input: text('input').notNull(),
		/** pending → ok | error; the input is stored before evaluation so nothing typed is lost */
		status: text('status', { enum: ['pending', 'ok', 'error'] }).notNull(),
		results: text('results', { mode: 'json' }).$type<Result[]>(),
		error: text('error', { mode: 'json' }).$type<StepError>(),
		/** what `#n` exposes to later steps */
		ref: text('ref', { mode: 'json' }).$type<StepRef>(),
		/** the bulk the step was evaluated in, so a replay starts from the same state */
		bulkBefore: text('bulk_before', { mode: 'json' }).$type<BulkState>(),
		ms: real('ms'),
		createdAt: createdAt(),
		// ── pad document (branch pad): named, hidden and re-run steps ──
		/** `#btz`: a name a later line may use instead of the number; unique within the pad, survives reordering */
		name: text('name'),
		/** hidden, not deleted: the step keeps its number and its references; restoring clears this */
		hiddenAt: integer('hidden_at', { mode: 'timestamp_ms' }),
		/** 1, then +1 for each re-run with an edited line; earlier versions live in step_versions */
		version: integer('version').notNull().default(1),
		// ── paper output (branch paper): figure labels typed in the label editor, by result index ──
		/** LaTeX labels the reader typed for the step's figures ({ "0": { xlabel, ylabel, legends } }); null: defaults */
		figureLabels: text('figure_labels', { mode: 'json' }).$type<Record<string, FigureLabels>>()
	},
	(t) => [uniqueIndex('steps_pad_n_idx').on(t.padId, t.n), uniqueIndex('steps_pad_name_idx').on(t.padId, t.name)]
);

// ── pad document (branch pad): attempts and step versions ──

/**
 * A line that has not (yet) become a step: stored `pending` before it runs, so nothing typed is lost, then
 * either turned into the next numbered step (this row is removed in the same transaction: it was only the
 * line's write-ahead record) or kept as an `error` attempt. Attempts take no step number, are never exported
 * or shared, and are dismissed (dismissedAt), not deleted. Failed steps stored before attempts existed stay
 * numbered steps (see DEVELOPERS.md › Steps and attempts): renumbering them would change what `#n` meant in
 * lines already written.
 */
export const attempts = sqliteTable(
	'attempts',
	{
		id: text('id').primaryKey(),
		padId: text('pad_id')
			.notNull()
			.references(() => pads.id, { onDelete: 'cascade' }),
		input: text('input').notNull(),
		status: text('status', { enum: ['pending', 'error'] }).notNull(),
		error: text('error', { mode: 'json' }).$type<StepError>(),
		/** the step number it was typed after (0: before any step), to place it in the pad */
		afterN: integer('after_n').notNull().default(0),
		/** a failed re-run of this step number (null for a new line) */
		forN: integer('for_n'),
		ms: real('ms'),
		dismissedAt: integer('dismissed_at', { mode: 'timestamp_ms' }),
		createdAt: createdAt()
	},
	(t) => [index('attempts_pad_idx').on(t.padId, t.createdAt)]
);

/** Earlier versions of a step, written when it is re-run with an edited line (the step row holds the newest). */
export const stepVersions = sqliteTable(
	'step_versions',
	{
		id: text('id').primaryKey(),
		stepId: text('step_id')
			.notNull()
			.references(() => steps.id, { onDelete: 'cascade' }),
		version: integer('version').notNull(),
		input: text('input').notNull(),
		status: text('status', { enum: ['pending', 'ok', 'error'] }).notNull(),
		results: text('results', { mode: 'json' }).$type<Result[]>(),
		error: text('error', { mode: 'json' }).$type<StepError>(),
		ref: text('ref', { mode: 'json' }).$type<StepRef>(),
		bulkBefore: text('bulk_before', { mode: 'json' }).$type<BulkState>(),
		ms: real('ms'),
		/** when this version was first recorded (the step's time for version 1) */
		createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull(),
		/** when the next version replaced it */
		replacedAt: integer('replaced_at', { mode: 'timestamp_ms' })
			.notNull()
			.$defaultFn(() => new Date())
	},
	(t) => [uniqueIndex('step_versions_idx').on(t.stepId, t.version)]
);

export const shares = sqliteTable('shares', {
	slug: text('slug').primaryKey(),
	padId: text('pad_id')
		.notNull()
		.references(() => pads.id, { onDelete: 'cascade' }),
	createdBy: text('created_by')
		.notNull()
		.references(() => users.id, { onDelete: 'cascade' }),
	expiresAt: integer('expires_at', { mode: 'timestamp_ms' }),
	revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
	createdAt: createdAt(),
	// --- snapshots (share branch): a link shows the pad frozen when it was made, not the live pad ---
	/** the owner's label for this snapshot, e.g. "as submitted v2" */
	note: text('note'),
	/**
	 * JSON Snapshot (server/snapshots.ts): title, bulk, units, lets and the steps' inputs and results copied.
	 * null only for links made before snapshots existed: those are frozen the first time anyone opens them.
	 */
	snapshot: text('snapshot', { mode: 'json' }),
	frozenAt: integer('frozen_at', { mode: 'timestamp_ms' })
	// --- end snapshots ---
});

// --- snapshot comments (share branch) ---
/** A reader's comment on one step of one snapshot; kept with the snapshot, gone with its link's row. */
export const snapshotComments = sqliteTable(
	'snapshot_comments',
	{
		id: text('id').primaryKey(),
		slug: text('slug')
			.notNull()
			.references(() => shares.slug, { onDelete: 'cascade' }),
		stepN: integer('step_n').notNull(),
		authorId: text('author_id')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		body: text('body').notNull(),
		createdAt: createdAt()
	},
	(t) => [index('snapshot_comments_slug_idx').on(t.slug, t.createdAt)]
);
// --- end snapshot comments ---

/**
 * Who reads a pad besides its owner: a row is written only when an invitation is accepted, with the address of
 * the account that accepted it (addresses are unique and cannot be changed), never when the invitation is sent.
 */
export const padAccess = sqliteTable(
	'pad_access',
	{
		padId: text('pad_id')
			.notNull()
			.references(() => pads.id, { onDelete: 'cascade' }),
		email: text('email').notNull(),
		createdAt: createdAt()
	},
	(t) => [uniqueIndex('pad_access_idx').on(t.padId, t.email)]
);

export const MACRO_STATES = ['proposed', 'approved', 'retired'] as const;

export const macros = sqliteTable('macros', {
	id: text('id').primaryKey(),
	name: text('name').notNull().unique(),
	description: text('description').notNull(),
	state: text('state', { enum: MACRO_STATES }).notNull().default('proposed'),
	version: integer('version').notNull().default(1),
	/** { param: default } */
	params: text('params', { mode: 'json' }).$type<Record<string, string>>().notNull(),
	body: text('body', { mode: 'json' }).$type<string[]>().notNull(),
	authorId: text('author_id')
		.notNull()
		.references(() => users.id, { onDelete: 'cascade' }),
	createdAt: createdAt(),
	updatedAt: integer('updated_at', { mode: 'timestamp_ms' })
		.notNull()
		.$defaultFn(() => new Date()),
	// --- macro header (share branch) ---
	/**
	 * JSON array of what the macro may leave changed in the pad: 'bulk', 'units'. null or [] = nothing: the
	 * pad's bulk and units are put back after the macro runs (lang/macro.ts).
	 */
	effects: text('effects', { mode: 'json' })
	// --- end macro header ---
});

/** Every version a macro has had, so an approved macro's history stays readable. */
export const macroVersions = sqliteTable(
	'macro_versions',
	{
		id: text('id').primaryKey(),
		macroId: text('macro_id')
			.notNull()
			.references(() => macros.id, { onDelete: 'cascade' }),
		version: integer('version').notNull(),
		params: text('params', { mode: 'json' }).$type<Record<string, string>>().notNull(),
		body: text('body', { mode: 'json' }).$type<string[]>().notNull(),
		editedBy: text('edited_by').notNull(),
		createdAt: createdAt()
	},
	(t) => [uniqueIndex('macro_versions_idx').on(t.macroId, t.version)]
);

export const datasets = sqliteTable('datasets', {
	id: text('id').primaryKey(),
	ownerId: text('owner_id')
		.notNull()
		.references(() => users.id, { onDelete: 'cascade' }),
	name: text('name').notNull(),
	columns: text('columns', { mode: 'json' }).$type<string[]>().notNull(),
	rows: text('rows', { mode: 'json' }).$type<number[][]>().notNull(),
	bytes: integer('bytes').notNull(),
	createdAt: createdAt(),
	// ── paper output (branch paper): a copy made by a fork names where it came from ──
	/** "<original name> of <owner>, copied when forking '<pad title>'"; null for an upload */
	origin: text('origin')
});

export const apiKeys = sqliteTable('api_keys', {
	id: text('id').primaryKey(),
	userId: text('user_id')
		.notNull()
		.references(() => users.id, { onDelete: 'cascade' }),
	label: text('label').notNull(),
	/** sha-256 of the key; the key itself is shown once */
	hash: text('hash').notNull().unique(),
	prefix: text('prefix').notNull(),
	lastUsedAt: integer('last_used_at', { mode: 'timestamp_ms' }),
	createdAt: createdAt(),
	// --- scripting: per-key limits (additive). A script's key has its own request budget per minute, and may
	// stop working on a chosen date; keys made before these columns get the default budget and never expire.
	perMinute: integer('per_minute').notNull().default(120),
	expiresAt: integer('expires_at', { mode: 'timestamp_ms' })
	// --- end scripting
});

export const MAIL_KINDS = ['invite', 'reset', 'confirm', 'other'] as const;

export const outbox = sqliteTable('outbox', {
	id: text('id').primaryKey(),
	to: text('to').notNull(),
	subject: text('subject').notNull(),
	/** the body with every link that carries a token replaced by a marker: the outbox never holds a secret */
	text: text('text').notNull(),
	kind: text('kind', { enum: MAIL_KINDS }).notNull().default('other'),
	status: text('status', { enum: ['queued', 'sent', 'failed'] }).notNull(),
	error: text('error'),
	createdAt: createdAt()
});

/** Tokens below are stored as sha-256 hashes and only count once their mail (outbox_id) was sent. */
export const passwordResets = sqliteTable('password_resets', {
	tokenHash: text('token_hash').primaryKey(),
	userId: text('user_id')
		.notNull()
		.references(() => users.id, { onDelete: 'cascade' }),
	expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
	outboxId: text('outbox_id')
});

export const emailConfirmations = sqliteTable('email_confirmations', {
	tokenHash: text('token_hash').primaryKey(),
	userId: text('user_id')
		.notNull()
		.references(() => users.id, { onDelete: 'cascade' }),
	/** the invitation the account was made through: accepted for it when the address is confirmed */
	inviteId: text('invite_id'),
	expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
	outboxId: text('outbox_id')
});

export const INVITATION_STATES = ['pending', 'accepted', 'revoked'] as const;

export const invitations = sqliteTable(
	'invitations',
	{
		id: text('id').primaryKey(),
		padId: text('pad_id')
			.notNull()
			.references(() => pads.id, { onDelete: 'cascade' }),
		/** where the link was mailed; whoever holds the token may accept, with any confirmed account */
		email: text('email').notNull(),
		tokenHash: text('token_hash').notNull().unique(),
		invitedBy: text('invited_by')
			.notNull()
			.references(() => users.id, { onDelete: 'cascade' }),
		state: text('state', { enum: INVITATION_STATES }).notNull().default('pending'),
		acceptedBy: text('accepted_by').references(() => users.id, { onDelete: 'set null' }),
		acceptedAt: integer('accepted_at', { mode: 'timestamp_ms' }),
		revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
		expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
		outboxId: text('outbox_id'),
		createdAt: createdAt()
	},
	(t) => [index('invitations_pad_idx').on(t.padId, t.createdAt)]
);

/** Group-wide settings an admin changes at run time (the sign-up policy), one JSON value per key. */
export const settings = sqliteTable('settings', {
	key: text('key').primaryKey(),
	value: text('value', { mode: 'json' }).notNull(),
	updatedAt: integer('updated_at', { mode: 'timestamp_ms' })
		.notNull()
		.$defaultFn(() => new Date())
});
