/**
 * The macro library: members propose, admins approve, edit and retire. Every edit keeps the previous
 * params and body readable as a version, so a pad that ran version 1 can still be understood later.
 */
import { and, asc, eq, or, type SQL } from 'drizzle-orm';
import { z } from 'zod';
import { getDb, schema } from './db';
import { newId } from './auth/accounts';
import type { AppUser } from './auth/guards';
import { failure } from './http';
import { BODY_LINE_MAX, BODY_LINES_MAX, MACRO_NAME_MAX, checkBody, checkMacroName, checkParams, type MacroProblem } from '../library/check';
import { MACRO_STATES, type Role } from './db/schema';
import { MACRO_EFFECTS, type MacroEffect } from '../lang/result';

export type MacroState = (typeof MACRO_STATES)[number];
type MacroRow = typeof schema.macros.$inferSelect;

const paramsSchema = z.record(z.string(), z.string().max(200)).default({});
/** the header: what the macro may leave changed in the pad; the rest is put back after it runs */
const effectsSchema = z.array(z.enum(MACRO_EFFECTS as unknown as ['bulk', 'units'])).max(2);
const bodySchema = z
	.array(z.string().max(BODY_LINE_MAX * 2))
	.min(1, 'A macro needs at least one body line.')
	.max(BODY_LINES_MAX * 2);

export const proposeSchema = z.object({
	name: z
		.string()
		.trim()
		.min(1)
		.max(MACRO_NAME_MAX * 2),
	description: z.string().trim().min(1, 'Say what the macro is for.').max(500),
	params: paramsSchema,
	body: bodySchema,
	effects: effectsSchema.default([])
});

export const changeSchema = z.discriminatedUnion('action', [
	z.object({ action: z.literal('approve') }),
	z.object({ action: z.literal('retire') }),
	z.object({
		action: z.literal('edit'),
		description: z.string().trim().min(1).max(500).optional(),
		params: z.record(z.string(), z.string().max(200)).optional(),
		body: bodySchema.optional(),
		effects: effectsSchema.optional()
	})
]);

export const stateQuery = z.enum(MACRO_STATES).optional();

/** 400 with the line the problem is on, so the proposer knows where to look. */
function reject(problem: MacroProblem | null): void {
	if (!problem) return;
	const { message, ...where } = problem;
	failure(400, message, where);
}

const isAdmin = (user: AppUser) => user.role === ('admin' satisfies Role);

/** What a user may see: admins everything; everyone else the approved library and their own macros. */
function visibleTo(user: AppUser): SQL | undefined {
	if (isAdmin(user)) return undefined;
	return or(eq(schema.macros.state, 'approved'), eq(schema.macros.authorId, user.id));
}

/** A header's effects as stored (null for macros from before headers: they declare nothing). */
export function effectsOf(row: Pick<MacroRow, 'effects'>): MacroEffect[] {
	const e = row.effects;
	return Array.isArray(e) ? MACRO_EFFECTS.filter((k) => e.includes(k)) : [];
}

function present(row: MacroRow, authorName: string | null) {
	return {
		id: row.id,
		name: row.name,
		description: row.description,
		state: row.state,
		version: row.version,
		params: row.params as Record<string, string>,
		body: row.body as string[],
		effects: effectsOf(row),
		author: { name: authorName ?? 'unknown' },
		mine: false,
		createdAt: row.createdAt,
		updatedAt: row.updatedAt
	};
}
export type MacroView = ReturnType<typeof present>;

export function listMacros(user: AppUser, state?: MacroState): MacroView[] {
	const where = and(visibleTo(user), state ? eq(schema.macros.state, state) : undefined);
	return getDb()
		.select({ macro: schema.macros, authorName: schema.users.name })
		.from(schema.macros)
		.leftJoin(schema.users, eq(schema.users.id, schema.macros.authorId))
		.where(where)
		.orderBy(asc(schema.macros.name))
		.all()
		.map((r) => ({ ...present(r.macro, r.authorName), mine: r.macro.authorId === user.id }));
}

/** A macro the user may see, or the same 404 for a missing one and one hidden from them. */
function findVisible(user: AppUser, id: string): { row: MacroRow; authorName: string | null } {
	const r = getDb()
		.select({ macro: schema.macros, authorName: schema.users.name })
		.from(schema.macros)
		.leftJoin(schema.users, eq(schema.users.id, schema.macros.authorId))
		.where(and(eq(schema.macros.id, id), visibleTo(user)))
		.get();
	if (!r) failure(404, 'No such macro.');
	return { row: r.macro, authorName: r.authorName };
}

export function macroVersions(macroId: string) {
	return getDb()
		.select({
			version: schema.macroVersions.version,
			params: schema.macroVersions.params,
			body: schema.macroVersions.body,
			editedBy: schema.users.name,
			createdAt: schema.macroVersions.createdAt
		})
		.from(schema.macroVersions)
		.leftJoin(schema.users, eq(schema.users.id, schema.macroVersions.editedBy))
		.where(eq(schema.macroVersions.macroId, macroId))
		.orderBy(asc(schema.macroVersions.version))
		.all()
		.map((v) => ({
			...v,
			params: v.params as Record<string, string>,
			body: v.body as string[],
			editedBy: { name: v.editedBy ?? 'unknown' }
		}));
}

export function getMacro(user: AppUser, id: string) {
	const { row, authorName } = findVisible(user, id);
	return { ...present(row, authorName), mine: row.authorId === user.id, versions: macroVersions(row.id) };
}

export function proposeMacro(user: AppUser, input: z.infer<typeof proposeSchema>): MacroView {
	reject(checkMacroName(input.name) ?? checkParams(input.params) ?? checkBody(input.body, input.params));
	const db = getDb();
	return db.transaction((tx) => {
		const taken = tx.select({ id: schema.macros.id }).from(schema.macros).where(eq(schema.macros.name, input.name)).get();
		if (taken) failure(409, `The library has a macro called '${input.name}' already; pick another name.`);
		const now = new Date();
		const row: MacroRow = {
			id: newId(),
			name: input.name,
			description: input.description,
			state: 'proposed',
			version: 1,
			params: input.params,
			body: input.body,
			effects: [...new Set(input.effects)],
			authorId: user.id,
			createdAt: now,
			updatedAt: now
		};
		tx.insert(schema.macros).values(row).run();
		tx.insert(schema.macroVersions)
			.values({ id: newId(), macroId: row.id, version: 1, params: row.params, body: row.body, editedBy: user.id })
			.run();
		return { ...present(row, user.name), mine: true };
	});
}

/** Which state an action may start from: approving a retired macro brings it back. */
const FROM: Record<'approve' | 'retire', MacroState[]> = {
	approve: ['proposed', 'retired'],
	retire: ['proposed', 'approved']
};

/**
 * Admins approve, retire and edit any macro; an author may edit their own macro while it is proposed.
 * Anything else a member can see answers 403; what they cannot see answers 404.
 */
export function changeMacro(user: AppUser, id: string, change: z.infer<typeof changeSchema>) {
	const { row } = findVisible(user, id);
	const admin = isAdmin(user);
	if (change.action !== 'edit') {
		if (!admin) failure(403, `Only an admin may ${change.action} a macro.`);
		if (!FROM[change.action].includes(row.state)) failure(409, `'${row.name}' is ${row.state}; it cannot be ${change.action}d.`);
		const state: MacroState = change.action === 'approve' ? 'approved' : 'retired';
		getDb().update(schema.macros).set({ state, updatedAt: new Date() }).where(eq(schema.macros.id, row.id)).run();
		return getMacro(user, id);
	}
	if (!admin && !(row.authorId === user.id && row.state === 'proposed')) {
		failure(403, 'Only an admin may edit this macro; authors may edit their own while it is proposed.');
	}
	if (change.description === undefined && change.params === undefined && change.body === undefined && change.effects === undefined) {
		failure(400, 'Nothing to edit: give a description, params, body or effects.');
	}
	const params = change.params ?? (row.params as Record<string, string>);
	const body = change.body ?? (row.body as string[]);
	reject(checkParams(params) ?? checkBody(body, params));
	// no await between the read above and this write, so nothing can slip a version in between
	getDb().transaction((tx) => {
		const version = row.version + 1;
		tx.update(schema.macros)
			.set({
				description: change.description ?? row.description,
				params,
				body,
				effects: change.effects ? [...new Set(change.effects)] : effectsOf(row),
				version,
				updatedAt: new Date()
			})
			.where(eq(schema.macros.id, row.id))
			.run();
		tx.insert(schema.macroVersions).values({ id: newId(), macroId: row.id, version, params, body, editedBy: user.id }).run();
	});
	return getMacro(user, id);
}
