import { evaluateInPool, type EvalOptions } from './pool';
import { driftBetween, DRIFT_TOLERANCE } from './drift';
import {
	DEFAULT_BULK,
	DEFAULT_UNITS,
	approvedMacros,
	finishStep,
	lineLibrary,
	ownerDatasets,
	padContext,
	serialisePad,
	startStep,
	type PadRow,
	type StepRow
} from '../pads';
import type { BulkState, LetValue, PadContext, Result, StepRef, UnitsState } from '../../lang/result';
import type { EvalAnswer } from './worker';

export const MAX_INPUT = 2000;

export interface EvalReply {
	status: 200 | 400 | 422 | 500;
	body: Record<string, unknown>;
}

function reply(answer: EvalAnswer, ms: number, step?: { id: string; n: number }, bulkIfError?: BulkState): EvalReply {
	if (answer.ok) {
		return { status: 200, body: { ok: true, step, bulk: answer.outcome.bulk, units: answer.outcome.units, ms, results: answer.outcome.results } };
	}
	const status = answer.error.code === 'language' ? 400 : answer.error.code === 'limit' ? 422 : 500;
	return { status, body: { ok: false, step, bulk: bulkIfError, ms, error: answer.error } };
}

function tooLong(input: string): EvalAnswer | undefined {
	if (input.length <= MAX_INPUT) return undefined;
	return {
		ok: false,
		error: { message: `input is ${input.length} characters; the limit is ${MAX_INPUT}`, start: MAX_INPUT, end: input.length, code: 'limit' }
	};
}

/** A line with the default bulk and its own keys; nothing is stored. */
export async function evaluateStateless(input: string, ownerId: string | null, opts: EvalOptions = {}): Promise<EvalReply> {
	const t0 = performance.now();
	const ctx: PadContext = {
		bulk: DEFAULT_BULK,
		units: DEFAULT_UNITS,
		refs: {},
		lets: {},
		...lineLibrary(input, ownerId)
	};
	const answer = tooLong(input) ?? (await evaluateInPool(input, ctx, opts));
	return reply(answer, performance.now() - t0, undefined, DEFAULT_BULK);
}

/** A line in a pad: stored as the next step first, then evaluated, then its results or error recorded. */
export function evaluateInPad(padOf: () => PadRow, input: string, opts: EvalOptions = {}): Promise<EvalReply> {
	const padId = padOf().id;
	return serialisePad(padId, async () => {
		const pad = padOf(); // re-read: the previous line may have changed the bulk
		const t0 = performance.now();
		const step = startStep(pad, input);
		const answer = tooLong(input) ?? (await evaluateInPool(input, padContext(pad, input), opts));
		const ms = performance.now() - t0;
		finishStep(pad, step.id, ms, answer.ok ? { ok: true, ...answer.outcome } : answer);
		return reply(answer, ms, step, pad.bulk as BulkState);
	});
}

export interface ReplayedStep {
	n: number;
	input: string;
	drift: boolean;
	delta: number | null;
	results?: Result[];
	error?: { message: string; start: number; end: number };
	recordedError?: unknown;
}

/**
 * Re-evaluates every step of a pad now, in order, from the state the first step started in, and marks each
 * step whose fresh result differs from the recorded one beyond DRIFT_TOLERANCE.
 */
export async function replaySteps(pad: PadRow, steps: StepRow[], opts: EvalOptions = {}): Promise<ReplayedStep[]> {
	let bulk = (steps[0]?.bulkBefore as BulkState | null) ?? DEFAULT_BULK;
	let units: UnitsState = DEFAULT_UNITS;
	let lets: Record<string, LetValue> = {};
	const refs: Record<number, StepRef> = {};
	const macros = approvedMacros();
	const datasets = ownerDatasets(pad.ownerId);
	const out: ReplayedStep[] = [];
	for (const s of steps) {
		const answer = await evaluateInPool(s.input, { bulk, units, lets, refs, macros, datasets }, opts);
		if (answer.ok) {
			({ bulk, units, lets } = answer.outcome);
			refs[s.n] = answer.outcome.ref;
			const recorded = s.status === 'ok' ? (s.results as Result[]) : null;
			// the recorded results went through JSON (NaN and ±Infinity became null); compare like with like
			const fresh = JSON.parse(JSON.stringify(answer.outcome.results)) as Result[];
			const delta = recorded ? driftBetween(recorded, fresh) : null;
			out.push({
				n: s.n,
				input: s.input,
				drift: delta === null || delta > DRIFT_TOLERANCE,
				delta: delta === null || Number.isFinite(delta) ? delta : null,
				results: answer.outcome.results
			});
		} else {
			const recordedMessage = s.status === 'error' ? (s.error as { message?: string } | null)?.message : undefined;
			out.push({
				n: s.n,
				input: s.input,
				drift: recordedMessage !== answer.error.message,
				delta: null,
				error: answer.error,
				recordedError: s.error
			});
		}
	}
	return out;
}
