/**
 * A pad's lines as a working document: a typed line is stored first as a pending attempt, becomes the next
 * numbered step when it evaluates, or stays an attempt (no number) when it fails. Steps can be hidden, named
 * and re-run as a new version. Nothing here deletes a step, a version or an attempt: hiding and dismissing set
 * a date, a re-run moves the old content to step_versions. The only row ever removed is the pending attempt
 * that became a step, in the same transaction that wrote the step (it was that line's write-ahead record).
 */
import { and, asc, desc, eq, max } from 'drizzle-orm';
import { z } from 'zod';
import { getDb, schema } from './db';
import { ApiFailure } from './http';
import { newId } from './auth/accounts';
import type { PadRow, StepRow } from './pads';
import type { BulkState, LetValue, StepError, Result, StepRef, UnitsState } from '../lang/result';

export type AttemptRow = typeof schema.attempts.$inferSelect;
export type StepVersionRow = typeof schema.stepVersions.$inferSelect;

const HISTORY_MAX = 200;

type LineError = StepError;
export type LineAnswer =
	| { ok: true; results: Result[]; ref: StepRef; bulk: BulkState; units: UnitsState; lets: Record<string, LetValue> }
	| { ok: false; error: LineError };

type Tx = Parameters<Parameters<ReturnType<typeof getDb>['transaction']>[0]>[0];

function lastStepNumber(tx: Tx, padId: string): number {
	return (
		tx
			.select({ n: max(schema.steps.n) })
			.from(schema.steps)
			.where(eq(schema.steps.padId, padId))
			.get()?.n ?? 0
	);
}

/** Stores the typed line (a pending attempt) and the pad's history before anything runs: nothing typed is lost. */
export function startStep(pad: PadRow, input: string, forN?: number): { id: string } {
	const db = getDb();
	return db.transaction((tx) => {
		const id = newId();
		const afterN = forN ?? lastStepNumber(tx, pad.id);
		tx.insert(schema.attempts)
			.values({ id, padId: pad.id, input, status: 'pending', afterN, forN: forN ?? null })
			.run();
		const history = [...((pad.history as string[]) ?? []), input].slice(-HISTORY_MAX);
		tx.update(schema.pads).set({ history, updatedAt: new Date() }).where(eq(schema.pads.id, pad.id)).run();
		return { id };
	});
}

/**
 * Records a line's outcome. A success becomes the next numbered step and moves the pad's state on; a failure
 * stays an attempt with its error and changes nothing else.
 */
export function finishStep(
	pad: PadRow,
	attemptId: string,
	ms: number,
	answer: LineAnswer
): { step: { id: string; n: number }; attempt?: undefined } | { step?: undefined; attempt: { id: string } } {
	const db = getDb();
	return db.transaction((tx) => {
		if (!answer.ok) {
			tx.update(schema.attempts).set({ status: 'error', error: answer.error, ms }).where(eq(schema.attempts.id, attemptId)).run();
			return { attempt: { id: attemptId } };
		}
		const typed = tx.select().from(schema.attempts).where(eq(schema.attempts.id, attemptId)).get();
		const n = lastStepNumber(tx, pad.id) + 1;
		const id = newId();
		tx.insert(schema.steps)
			.values({
				id,
				padId: pad.id,
				n,
				input: typed?.input ?? '',
				status: 'ok',
				results: answer.results,
				ref: answer.ref,
				bulkBefore: pad.bulk,
				ms
			})
			.run();
		tx.delete(schema.attempts).where(eq(schema.attempts.id, attemptId)).run();
		tx.update(schema.pads)
			.set({ bulk: answer.bulk, units: answer.units, lets: answer.lets, updatedAt: new Date() })
			.where(eq(schema.pads.id, pad.id))
			.run();
		return { step: { id, n } };
	});
}

/** A pad's attempts in the order they were typed, dismissed ones too (the page folds those away). */
export function padAttempts(padId: string): AttemptRow[] {
	return getDb().select().from(schema.attempts).where(eq(schema.attempts.padId, padId)).orderBy(asc(schema.attempts.createdAt)).all();
}

export function dismissAttempt(pad: PadRow, id: string, dismissed: boolean): AttemptRow {
	const db = getDb();
	const row = db
		.select()
		.from(schema.attempts)
		.where(and(eq(schema.attempts.id, id), eq(schema.attempts.padId, pad.id)))
		.get();
	if (!row) throw new ApiFailure(404, 'No such attempt in this pad.');
	const dismissedAt = dismissed ? (row.dismissedAt ?? new Date()) : null;
	db.update(schema.attempts).set({ dismissedAt }).where(eq(schema.attempts.id, id)).run();
	return { ...row, dismissedAt };
}

export function findStep(pad: PadRow, n: number): StepRow {
	const row = getDb()
		.select()
		.from(schema.steps)
		.where(and(eq(schema.steps.padId, pad.id), eq(schema.steps.n, n)))
		.get();
	if (!row) throw new ApiFailure(404, `No step #${n} in this pad.`);
	return row;
}

/** Hidden steps keep their number, results and references; only the pad's view folds them away. */
export function hideStep(pad: PadRow, step: StepRow, hidden: boolean): StepRow {
	const hiddenAt = hidden ? (step.hiddenAt ?? new Date()) : null;
	getDb().update(schema.steps).set({ hiddenAt }).where(eq(schema.steps.id, step.id)).run();
	return { ...step, hiddenAt };
}

/**
 * A step name as the language reads it after '#': a letter or '_' first, then letters, digits and '_'. Names
 * of the language's own words would read oddly but cannot be mistaken for a number, so they are allowed.
 */
export const stepNameSchema = z
	.string()
	.trim()
	.regex(/^[A-Za-z_][A-Za-z0-9_]{0,31}$/, 'A step name is a letter or _ and then up to 31 letters, digits or _ (e.g. btz).');

export function nameStep(pad: PadRow, step: StepRow, name: string | null): StepRow {
	const db = getDb();
	if (name !== null) {
		const taken = db
			.select({ n: schema.steps.n })
			.from(schema.steps)
			.where(and(eq(schema.steps.padId, pad.id), eq(schema.steps.name, name)))
			.get();
		if (taken && taken.n !== step.n) throw new ApiFailure(409, `#${name} already names step #${taken.n}.`);
	}
	db.update(schema.steps).set({ name }).where(eq(schema.steps.id, step.id)).run();
	return { ...step, name };
}

/**
 * A re-run with an edited line: the step's current content becomes a row of step_versions and the step takes
 * the new line and results under the same number (and name), so `#n` now reads the new version. When the step
 * is the pad's last, the pad's state moves on as after any line; an earlier step leaves it as it is (the later
 * steps were computed from the old version, and a replay shows whether they still hold).
 */
export function reviseStep(
	pad: PadRow,
	step: StepRow,
	input: string,
	ms: number,
	answer: Extract<LineAnswer, { ok: true }>,
	bulkBefore: BulkState,
	attemptId?: string
): StepRow {
	const db = getDb();
	return db.transaction((tx) => {
		if (attemptId) tx.delete(schema.attempts).where(eq(schema.attempts.id, attemptId)).run();
		tx.insert(schema.stepVersions)
			.values({
				id: newId(),
				stepId: step.id,
				version: step.version,
				input: step.input,
				status: step.status,
				results: step.results,
				error: step.error,
				ref: step.ref,
				bulkBefore: step.bulkBefore,
				ms: step.ms,
				createdAt: step.createdAt
			})
			.run();
		const next = {
			input,
			status: 'ok' as const,
			results: answer.results,
			error: null,
			ref: answer.ref,
			bulkBefore,
			ms,
			version: step.version + 1
		};
		tx.update(schema.steps).set(next).where(eq(schema.steps.id, step.id)).run();
		if (step.n === lastStepNumber(tx, pad.id)) {
			tx.update(schema.pads)
				.set({ bulk: answer.bulk, units: answer.units, lets: answer.lets, updatedAt: new Date() })
				.where(eq(schema.pads.id, pad.id))
				.run();
		}
		return { ...step, ...next };
	});
}

/** Every earlier version of a step, newest first. */
export function stepVersions(stepId: string): StepVersionRow[] {
	return getDb()
		.select()
		.from(schema.stepVersions)
		.where(eq(schema.stepVersions.stepId, stepId))
		.orderBy(desc(schema.stepVersions.version))
		.all();
}

/** Earlier versions of every step of a pad, by step id (one query for the pad page). */
export function padStepVersions(padId: string): Map<string, StepVersionRow[]> {
	const rows = getDb()
		.select({ v: schema.stepVersions })
		.from(schema.stepVersions)
		.innerJoin(schema.steps, eq(schema.steps.id, schema.stepVersions.stepId))
		.where(eq(schema.steps.padId, padId))
		.orderBy(desc(schema.stepVersions.version))
		.all();
	const out = new Map<string, StepVersionRow[]>();
	for (const { v } of rows) out.set(v.stepId, [...(out.get(v.stepId) ?? []), v]);
	return out;
}
