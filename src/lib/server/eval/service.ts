import { evaluateLine, type EvalOptions } from './dispatch';
import { answerFast } from './fast';
import { driftBetween, DRIFT_TOLERANCE } from './drift';
import { evalSettings } from './settings';
import type { QueueAnswer } from './queue';
import {
	DEFAULT_BULK,
	DEFAULT_UNITS,
	approvedMacros,
	lineLibrary,
	padContext,
	serialisePad,
	stepNames,
	validityOf,
	type PadRow,
	type StepRow
} from '../pads';
import { findStep, finishStep, reviseStep, startStep } from '../steps';
import { datasetRefs } from '../datasets';
import type { BulkState, EvalBody, LetValue, Result, StepRef, UnitsState } from '../../lang/result';
import type { EvalAnswer } from './worker';

export type { EvalOptions } from './dispatch';

export const MAX_INPUT = 2000;

export interface EvalReply {
	status: 200 | 400 | 422 | 429 | 500 | 503;
	body: EvalBody;
	headers?: Record<string, string>;
}

const STATUS: Record<string, EvalReply['status']> = { language: 400, limit: 422, busy: 503, throttled: 429 };

type Stored = { step?: { id: string; n: number; version?: number }; attempt?: { id: string } };

function reply(q: QueueAnswer, ms: number, stored: Stored = {}, bulkIfError?: BulkState): EvalReply {
	const { step, attempt } = stored;
	const { answer } = q;
	// waiting and running are reported apart: a line never pays for the queue in its own budget
	const timing = { ms, queuedMs: Math.round(q.waitMs), runMs: Math.round(q.runMs) };
	if (answer.ok) {
		return {
			status: 200,
			body: { ok: true, step, bulk: answer.outcome.bulk, units: answer.outcome.units, ...timing, results: answer.outcome.results }
		};
	}
	const status = STATUS[answer.error.code] ?? 500;
	const headers = answer.error.retryAfter ? { 'retry-after': String(answer.error.retryAfter) } : undefined;
	// a failed line is an attempt: it has an id (to dismiss it) but no step number
	return { status, headers, body: { ok: false, attempt, bulk: bulkIfError, ...timing, error: answer.error } };
}

function tooLong(input: string): QueueAnswer | undefined {
	if (input.length <= MAX_INPUT) return undefined;
	return {
		answer: {
			ok: false,
			error: {
				message: `input is ${input.length} characters; the limit is ${MAX_INPUT}`,
				start: MAX_INPUT,
				end: input.length,
				code: 'limit'
			}
		},
		runMs: 0,
		waitMs: 0
	};
}

/**
 * The reply to a stateless line that qualifies for the fast path (fast.ts), computed at once; undefined when the
 * line must wait for an evaluation process. The route tries this before it sets up anything a queued line needs.
 */
export function evaluateStatelessFast(input: string): EvalReply | undefined {
	if (input.length > MAX_INPUT) return undefined;
	const t0 = performance.now();
	const fast = answerFast(input, { bulk: DEFAULT_BULK, units: DEFAULT_UNITS, refs: {}, lets: {}, macros: {} });
	return fast && reply(fast, performance.now() - t0, undefined, DEFAULT_BULK);
}

/**
 * A line with the default bulk and its own keys; nothing is stored. A single-point strip line of bounded cost is
 * answered here at once (fast.ts); everything else waits for an evaluation process.
 */
export async function evaluateStateless(input: string, ownerId: string, opts: EvalOptions = {}): Promise<EvalReply> {
	const t0 = performance.now();
	const long = tooLong(input);
	const fast = long ? undefined : evaluateStatelessFast(input);
	if (fast) return fast;
	const ctx = { bulk: DEFAULT_BULK, units: DEFAULT_UNITS, refs: {}, lets: {}, ...lineLibrary(input) };
	const answer = long ?? (await evaluateLine(input, ctx, ownerId, ownerId, opts));
	return reply(answer, performance.now() - t0, {}, DEFAULT_BULK);
}

/** A line in a pad: stored first as a pending attempt, then evaluated, then a numbered step or a kept attempt. */
export function evaluateInPad(padOf: () => PadRow, input: string, opts: EvalOptions = {}): Promise<EvalReply> {
	const padId = padOf().id;
	return serialisePad(padId, async () => {
		const pad = padOf(); // re-read: the previous line may have changed the bulk
		const t0 = performance.now();
		const typed = startStep(pad, input);
		const q = tooLong(input) ?? (await evaluateLine(input, padContext(pad, input), pad.ownerId, pad.ownerId, opts));
		const ms = performance.now() - t0;
		const stored = finishStep(pad, typed.id, ms, q.answer.ok ? { ok: true, ...q.answer.outcome } : q.answer);
		return reply(q, ms, stored, pad.bulk);
	});
}

/**
 * Step `n` re-run with an edited line, as its next version. The line is evaluated where the step stood: in the
 * bulk it started from, seeing only the steps before it (and their names), with the pad's units and lets. A
 * failure changes nothing and is kept as an attempt for that step.
 */
export function rerunInPad(padOf: () => PadRow, n: number, input: string, opts: EvalOptions = {}): Promise<EvalReply> {
	const padId = padOf().id;
	return serialisePad(padId, async () => {
		const pad = padOf();
		const step = findStep(pad, n);
		const t0 = performance.now();
		const typed = startStep(pad, input, n);
		const ctx = padContext(pad, input);
		const bulkBefore = (step.bulkBefore as BulkState | null) ?? pad.bulk;
		const before = (m: number) => m < n;
		ctx.bulk = bulkBefore;
		ctx.refs = Object.fromEntries(Object.entries(ctx.refs).filter(([k]) => before(Number(k))));
		ctx.names = Object.fromEntries(Object.entries(ctx.names ?? {}).filter(([, m]) => before(m)));
		const q = tooLong(input) ?? (await evaluateLine(input, ctx, pad.ownerId, pad.ownerId, opts));
		const ms = performance.now() - t0;
		if (!q.answer.ok) return reply(q, ms, finishStep(pad, typed.id, ms, q.answer), bulkBefore);
		const revised = reviseStep(pad, step, input, ms, { ok: true, ...q.answer.outcome }, bulkBefore, typed.id);
		return reply(q, ms, { step: { id: revised.id, n: revised.n, version: revised.version } });
	});
}

/** What a replay reads of a step: a pad's row or a snapshot's copy of it. */
/** What replay reads of a step (a step row, or a snapshot's copy of one); `name` when the step had one. */
export type ReplayStep = Pick<StepRow, 'n' | 'input' | 'status' | 'results' | 'error' | 'bulkBefore'> & { name?: string | null };

export interface ReplayedStep {
	n: number;
	input: string;
	drift: boolean;
	/** the fresh run ended in an error: such a step never counts as reproduced, even when it fails as recorded */
	failed: boolean;
	delta: number | null;
	results?: Result[];
	error?: { message: string; start: number; end: number };
	recordedError?: unknown;
	/** not run: the replay's budget was used up, the queue refused it, or the client left */
	skipped?: boolean;
}

export interface ReplayOptions {
	/** who is replaying (a user id, or the client address for anonymous replays): one heavy step at a time */
	owner: string;
	signal?: AbortSignal;
	/** running time of the whole replay; each step still has the per-line budget */
	budgetMs?: number;
}

/** A step run afresh: its answer now, or why it was not run. */
export type FreshStep = { n: number; answer: EvalAnswer; skipped?: undefined } | { n: number; answer?: undefined; skipped: string };

/**
 * Re-evaluates every step of a pad now, in order, from the state the first step started in. Steps run at
 * replay priority (after everyone's own lines) within one budget for the whole replay; once it is spent, or
 * the client has gone, the remaining steps are reported as skipped instead of run. What the fresh answers
 * depend on is only the inputs and the first step's bulk (plus the library for `@` and `compare`), which is
 * what lets replay.ts reuse them.
 */
export async function replaySteps(pad: PadRow, steps: ReplayStep[], opts: ReplayOptions): Promise<FreshStep[]> {
	let bulk = (steps[0]?.bulkBefore as BulkState | null) ?? DEFAULT_BULK;
	let units: UnitsState = DEFAULT_UNITS;
	let lets: Record<string, LetValue> = {};
	const refs: Record<number, StepRef> = {};
	// names as the steps carry them now: a name follows its step, so a renumbered pad still replays
	const names = stepNames(steps.filter((s) => s.name));
	const macros = steps.some((s) => s.input.includes('@')) ? approvedMacros() : {};
	let datasets: ReturnType<typeof datasetRefs> | undefined;
	const refsOnce = () => (datasets ??= datasetRefs(pad.ownerId));
	const budgetMs = opts.budgetMs ?? evalSettings.replayBudgetMs;
	let spentMs = 0;
	let stopped: string | undefined;
	const out: FreshStep[] = [];
	for (const s of steps) {
		const left = budgetMs - spentMs;
		if (!stopped && opts.signal?.aborted) stopped = 'not replayed: the replay was cancelled';
		if (!stopped && left <= 0) stopped = `not replayed: the replay used its budget of ${(budgetMs / 1000).toFixed(1)} s`;
		if (stopped) {
			out.push({ n: s.n, skipped: stopped });
			continue;
		}
		const q = await evaluateLine(
			s.input,
			{ bulk, units, lets, refs, names, macros, ...validityOf(pad) },
			opts.owner,
			pad.ownerId,
			{ priority: 'replay', signal: opts.signal, budgetMs: Math.min(evalSettings.budgetMs, left) },
			refsOnce
		);
		spentMs += q.runMs;
		const answer = q.answer;
		if (!answer.ok && (answer.error.code === 'busy' || answer.error.code === 'throttled' || opts.signal?.aborted)) {
			stopped = `not replayed: ${answer.error.message}`;
			out.push({ n: s.n, skipped: stopped });
			continue;
		}
		if (answer.ok) {
			({ bulk, units, lets } = answer.outcome);
			refs[s.n] = answer.outcome.ref;
		}
		out.push({ n: s.n, answer });
	}
	return out;
}

/** Marks each step whose fresh result differs from the recorded one beyond DRIFT_TOLERANCE. */
export function markDrift(steps: ReplayStep[], fresh: FreshStep[]): ReplayedStep[] {
	return steps.map((s, i) => {
		const f = fresh[i];
		if (!f || f.n !== s.n || f.skipped !== undefined) {
			const message = f?.skipped ?? 'not replayed';
			return {
				n: s.n,
				input: s.input,
				drift: false,
				failed: false,
				delta: null,
				skipped: true,
				error: { message, start: 0, end: s.input.length }
			};
		}
		const answer = f.answer;
		if (answer.ok) {
			const recorded = s.status === 'ok' ? s.results : null;
			// the recorded results went through JSON (NaN and ±Infinity became null); compare like with like
			const fresh = JSON.parse(JSON.stringify(answer.outcome.results)) as Result[];
			const delta = recorded ? driftBetween(recorded, fresh) : null;
			return {
				n: s.n,
				input: s.input,
				drift: delta === null || delta > DRIFT_TOLERANCE,
				failed: false,
				delta: delta === null || Number.isFinite(delta) ? delta : null,
				results: answer.outcome.results
			};
		}
		const recordedMessage = s.status === 'error' ? (s.error as { message?: string } | null)?.message : undefined;
		return {
			n: s.n,
			input: s.input,
			drift: recordedMessage !== answer.error.message,
			failed: true,
			delta: null,
			error: answer.error,
			recordedError: s.error
		};
	});
}
