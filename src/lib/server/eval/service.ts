import { evaluateLine, type EvalOptions } from './dispatch';
import { driftBetween, DRIFT_TOLERANCE } from './drift';
import { evalSettings } from './settings';
import type { QueueAnswer } from './queue';
import {
	DEFAULT_BULK,
	DEFAULT_UNITS,
	approvedMacros,
	finishStep,
	lineLibrary,
	padContext,
	serialisePad,
	startStep,
	type PadRow,
	type StepRow
} from '../pads';
import { datasetRefs } from '../datasets';
import type { BulkState, LetValue, Result, StepRef, UnitsState } from '../../lang/result';
import type { EvalAnswer } from './worker';

export type { EvalOptions } from './dispatch';

export const MAX_INPUT = 2000;

export interface EvalReply {
	status: 200 | 400 | 422 | 429 | 500 | 503;
	body: Record<string, unknown>;
	headers?: Record<string, string>;
}

const STATUS: Record<string, EvalReply['status']> = { language: 400, limit: 422, busy: 503, throttled: 429 };

function reply(q: QueueAnswer, ms: number, step?: { id: string; n: number }, bulkIfError?: BulkState): EvalReply {
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
	return { status, headers, body: { ok: false, step, bulk: bulkIfError, ...timing, error: answer.error } };
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

/** A line with the default bulk and its own keys; nothing is stored. */
export async function evaluateStateless(input: string, ownerId: string, opts: EvalOptions = {}): Promise<EvalReply> {
	const t0 = performance.now();
	const ctx = { bulk: DEFAULT_BULK, units: DEFAULT_UNITS, refs: {}, lets: {}, ...lineLibrary(input) };
	const answer = tooLong(input) ?? (await evaluateLine(input, ctx, ownerId, ownerId, opts));
	return reply(answer, performance.now() - t0, undefined, DEFAULT_BULK);
}

/** A line in a pad: stored as the next step first, then evaluated, then its results or error recorded. */
export function evaluateInPad(padOf: () => PadRow, input: string, opts: EvalOptions = {}): Promise<EvalReply> {
	const padId = padOf().id;
	return serialisePad(padId, async () => {
		const pad = padOf(); // re-read: the previous line may have changed the bulk
		const t0 = performance.now();
		const step = startStep(pad, input);
		const q = tooLong(input) ?? (await evaluateLine(input, padContext(pad, input), pad.ownerId, pad.ownerId, opts));
		const ms = performance.now() - t0;
		finishStep(pad, step.id, ms, q.answer.ok ? { ok: true, ...q.answer.outcome } : q.answer);
		return reply(q, ms, step, pad.bulk as BulkState);
	});
}

/** What a replay reads of a step: a pad's row or a snapshot's copy of it. */
export type ReplayStep = Pick<StepRow, 'n' | 'input' | 'status' | 'results' | 'error' | 'bulkBefore'>;

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
			{ bulk, units, lets, refs, macros },
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
			const recorded = s.status === 'ok' ? (s.results as Result[]) : null;
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
