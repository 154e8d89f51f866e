import { and, asc, desc, eq } from 'drizzle-orm';
import { getDb, schema } from './db';
import { ApiFailure } from './http';
import { newId } from './auth/accounts';
import type { AppUser } from './auth/guards';
import { effectsOf } from './macros';
import type { BulkState, LetValue, PadContext, StepRef, UnitsState } from '../lang/result';

export const DEFAULT_BULK: BulkState = { name: 'brane', params: { d: 4, zh: 1 } };
export const DEFAULT_UNITS: UnitsState = { system: 'geo', G: 1 };

export type PadRow = typeof schema.pads.$inferSelect;
export type StepRow = typeof schema.steps.$inferSelect;

const notFound = () => new ApiFailure(404, 'No such pad.');

export function listPads(ownerId: string) {
	return getDb()
		.select({ id: schema.pads.id, title: schema.pads.title, bulk: schema.pads.bulk, updatedAt: schema.pads.updatedAt })
		.from(schema.pads)
		.where(eq(schema.pads.ownerId, ownerId))
		.orderBy(desc(schema.pads.updatedAt))
		.all();
}

export function createPad(
	ownerId: string,
	title: string,
	state?: { bulk?: BulkState; units?: UnitsState; lets?: Record<string, LetValue> }
): PadRow {
	const now = new Date();
	const row = {
		id: newId(),
		ownerId,
		title,
		bulk: state?.bulk ?? DEFAULT_BULK,
		units: state?.units ?? DEFAULT_UNITS,
		lets: state?.lets ?? {},
		history: [] as string[],
		validityTol: null as number | null,
		createdAt: now,
		updatedAt: now
	};
	getDb().insert(schema.pads).values(row).run();
	return row;
}

/** Where `/` and `/pads` send a signed-in user: readers to what is shared with them, others to their latest pad. */
export function homePath(user: AppUser): string {
	if (user.role === 'reader') return '/shared';
	const latest = listPads(user.id)[0] ?? createPad(user.id, 'First pad');
	return `/pads/${latest.id}`;
}

/** The user's own pad; any other id — missing or somebody else's — is the same 404. */
export function findOwnPad(user: AppUser, id: string): PadRow {
	const pad = getDb()
		.select()
		.from(schema.pads)
		.where(and(eq(schema.pads.id, id), eq(schema.pads.ownerId, user.id)))
		.get();
	if (!pad) throw notFound();
	return pad;
}

/** A pad the user may read: their own, or one they were invited to by e-mail. */
export function findReadablePad(user: AppUser, id: string): PadRow {
	const db = getDb();
	const pad = db.select().from(schema.pads).where(eq(schema.pads.id, id)).get();
	if (!pad) throw notFound();
	if (pad.ownerId === user.id) return pad;
	const invited = db
		.select()
		.from(schema.padAccess)
		.where(and(eq(schema.padAccess.padId, id), eq(schema.padAccess.email, user.email)))
		.get();
	if (!invited) throw notFound();
	return pad;
}

export function padSteps(padId: string): StepRow[] {
	return getDb().select().from(schema.steps).where(eq(schema.steps.padId, padId)).orderBy(asc(schema.steps.n)).all();
}

export function renamePad(pad: PadRow, title: string) {
	getDb().update(schema.pads).set({ title, updatedAt: new Date() }).where(eq(schema.pads.id, pad.id)).run();
}

export function deletePad(pad: PadRow) {
	getDb().delete(schema.pads).where(eq(schema.pads.id, pad.id)).run();
}

/** Approved macros, as the language expands them. */
export function approvedMacros(): NonNullable<PadContext['macros']> {
	const rows = getDb().select().from(schema.macros).where(eq(schema.macros.state, 'approved')).all();
	return Object.fromEntries(rows.map((m) => [m.name, { params: m.params, body: m.body, effects: effectsOf(m) }]));
}

/**
 * The library pieces one line can reach before it is queued: macros only through '@'. Datasets are not read
 * here at all: eval/dispatch.ts names the few a line can reach and the evaluation process gets their rows
 * once, by id.
 */
export function lineLibrary(input: string): Pick<PadContext, 'macros'> {
	return { macros: input.includes('@') ? approvedMacros() : {} };
}

/** The references `#n` may read: every step that evaluated. */
export function stepRefs(steps: Pick<StepRow, 'n' | 'status' | 'ref'>[]): Record<number, StepRef> {
	const refs: Record<number, StepRef> = {};
	for (const s of steps) if (s.status === 'ok' && s.ref) refs[s.n] = s.ref;
	return refs;
}

/** `#name` → step number, for the names given to steps (a name follows its step wherever it is numbered). */
export function stepNames(steps: { n: number; name?: string | null }[]): Record<string, number> {
	const names: Record<string, number> = {};
	for (const s of steps) if (s.name) names[s.name] = s.n;
	return names;
}

/** What a line evaluated in this pad needs: its state, the `#n` references (not whole results) and library. */
export function padContext(pad: PadRow, input: string): PadContext {
	const refRows = getDb()
		.select({ n: schema.steps.n, status: schema.steps.status, ref: schema.steps.ref, name: schema.steps.name })
		.from(schema.steps)
		.where(eq(schema.steps.padId, pad.id))
		.all();
	return {
		bulk: pad.bulk,
		units: pad.units,
		lets: pad.lets,
		refs: stepRefs(refRows),
		names: stepNames(refRows),
		...validityOf(pad),
		...lineLibrary(input)
	};
}

/** The pad's own validity tolerance for the evaluation context; none set leaves the language's default. */
export function validityOf(pad: Pick<PadRow, 'validityTol'>): Pick<PadContext, 'validityTol'> {
	return pad.validityTol != null ? { validityTol: pad.validityTol } : {};
}

/** Sets (a number) or clears (null: back to the default 1e-3) the pad's validity tolerance. */
export function setValidityTol(pad: PadRow, validityTol: number | null) {
	getDb().update(schema.pads).set({ validityTol, updatedAt: new Date() }).where(eq(schema.pads.id, pad.id)).run();
}

/** Lines of one pad run one after another: each sees the bulk and references the previous left. */
const padQueues = new Map<string, Promise<unknown>>();
export function serialisePad<T>(padId: string, work: () => Promise<T>): Promise<T> {
	const prev = padQueues.get(padId) ?? Promise.resolve();
	const next = prev.then(work, work);
	const tail = next.catch(() => undefined);
	padQueues.set(padId, tail);
	tail.then(() => {
		if (padQueues.get(padId) === tail) padQueues.delete(padId);
	});
	return next;
}
