/**
 * The fast path: a light stateless line answered in the server process, without the queue, the IPC round trip
 * to an evaluation process and its structured clone (the light line's overhead; bench/RESULTS.md, api).
 *
 * Isolation holds because only lines of provably bounded cost qualify (anything else goes to the queue):
 * - one statement: a strip verb of `FAST_VERBS`, no `sweep`, no subject other than `strip`, no sinks;
 * - every key's value a plain number literal, or `exact` for the order: no user formula string, no names, no
 *   `#n`, no lists or ranges — a single point; no `@` macro, no `compare`, no `use`: the bulk is the default
 *   brane with the line's own keys, never `metric`;
 * - a series order, if given, at most plan.ts's light order.
 * Such a line costs the engine one strip solve: a safeguarded Newton capped at a fixed number of iterations
 * (strip.ts) over fixed quadrature nodes, or a cached series — microseconds, no loop that a number can stretch.
 * Its answer comes from the same `evaluateTask` the evaluation processes run, so answers, shapes and error
 * messages are those of the queued path (tests/api/eval-fast.test.ts compares them).
 */
import { parse } from '../../lang/parser';
import type * as A from '../../lang/ast';
import type { PadContext } from '../../lang/result';
import { LIGHT_ORDER } from './plan';
import { evaluateTask, type EvalAnswer } from './worker';

/** Strip verbs whose cost is one strip solve (or a cached series) at one point. */
export const FAST_VERBS = new Set(['zstar', 'width', 'area', 'darea', 'entropy', 'dentropy']);

function plainNumber(v: A.Value): boolean {
	if (v.type === 'number') return true;
	return v.type === 'unary' && v.op === '-' && v.arg.type === 'number';
}

/** Whether `input` qualifies for the fast path (see the module comment). */
export function isFastLine(input: string): boolean {
	if (input.includes('@')) return false;
	let line: A.Line;
	try {
		line = parse(input);
	} catch {
		return false; // its error is answered by the queued path, with the same message
	}
	if (line.statements.length !== 1) return false;
	const s = line.statements[0]!;
	if (s.type !== 'verb' || s.sweep || s.sinks.length || !FAST_VERBS.has(s.verb.text)) return false;
	if (s.subject && s.subject.text !== 'strip') return false;
	for (const kv of s.keys) {
		const order = kv.key === 'o' || kv.key === 'order';
		if (order && kv.value.type === 'exact') continue;
		if (!plainNumber(kv.value)) return false;
		if (order && kv.value.type === 'number' && kv.value.value > LIGHT_ORDER) return false;
	}
	return true;
}

/** The answer of a qualifying stateless line, computed here; undefined when the line must be queued. */
export function answerFast(input: string, ctx: PadContext): { answer: EvalAnswer; runMs: number; waitMs: 0 } | undefined {
	if (!isFastLine(input)) return undefined;
	const t0 = performance.now();
	const answer = evaluateTask({ input, ctx });
	return { answer, runMs: performance.now() - t0, waitMs: 0 };
}
