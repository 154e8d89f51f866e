/**
 * runLine: parse a line and run its statements in order against the pad's context. Statements share the
 * line's state (a `use` changes the bulk for the statements after it), and each answers its results in
 * order. The outcome carries the pad's state after the line and what `#n` of this step exposes: the last
 * statement that gave a value. Throws LangError (code 'language' → 400, 'limit' → 422).
 */
import type * as A from './ast';
import { evaluateExpr } from './arith';
import { runCompare } from './compare';
import { runPlot } from './figure';
import { runHelp } from './ask';
import { type LineEnv, type StatementOut, withEngine } from './env';
import { LangError } from './errors';
import { describeBulk, texNumber } from './format';
import { type Limits, resolveLimits } from './limits';
import { runMacro } from './macro';
import { parse } from './parser';
import { printExpr, texExpr } from './printer';
import type { BulkState, LineOutcome, PadContext, Result, StepRef, UnitsState } from './result';
import { runVerb } from './run-verb';
import { type Checked, checkBulk, checkUnits, UNITS_SCHEMAS } from './schema';
import { applySinks } from './sinks';
import { unitsAfterUse } from './units-note';
import { orderOfNames, resolverFor, resolveValue } from './values';
import { engine } from './engine';
import { BULKS, type BulkName, isBulk } from './vocab';

/** LANGUAGE.md: with no bulk set, the bulk is `brane d=4 zh=1`. */
export const DEFAULT_BULK: Readonly<BulkState> = Object.freeze({ name: 'brane', params: Object.freeze({ d: 4, zh: 1 }) });
/** Geometric units with G = 1 until `units …` says otherwise. */
export const DEFAULT_UNITS: Readonly<UnitsState> = Object.freeze({ system: 'geo', G: 1 });

/** A fresh pad's context (also the context of a stateless evaluation). */
export function emptyContext(): PadContext {
	return { bulk: { name: DEFAULT_BULK.name, params: { ...DEFAULT_BULK.params } }, units: { ...DEFAULT_UNITS }, refs: {}, lets: {} };
}

export interface RunOptions {
	limits?: Partial<Limits>;
	onProgress?: (done: number, total: number) => void;
}

export function runLine(input: string, ctx: PadContext, opts: RunOptions = {}): LineOutcome {
	// the quench's family curves live for one line: a line's numbers are then a function of the line alone, to the
	// last bit, whoever ran what before in this process (another member's lines, a replay, a fleet worker) — the
	// curve's points and refinements otherwise depend on the times asked earlier, and the answers' last bits with
	// them. A growth sweep still builds its curve once; a later line at the same width builds it again (ms).
	engine.clearQuenchCache();
	const limits = resolveLimits(opts.limits);
	const env: LineEnv = {
		ctx,
		limits,
		bulk: ctx.bulk
			? { name: ctx.bulk.name, params: { ...ctx.bulk.params } }
			: { name: DEFAULT_BULK.name, params: { ...DEFAULT_BULK.params } },
		units: ctx.units ? { ...ctx.units } : { ...DEFAULT_UNITS },
		lets: { ...(ctx.lets ?? {}) },
		pointsUsed: 0,
		macroDepth: 0,
		...(opts.onProgress ? { onProgress: opts.onProgress } : {})
	};
	const out = runText(input, env);
	return { results: out.results, bulk: env.bulk, units: env.units, lets: env.lets, ref: out.ref ?? { fields: {} } };
}

/** Parse and run one line of text in an existing line state (macro bodies come through here too). */
function runText(input: string, env: LineEnv): StatementOut {
	const line = parse(input, env.limits);
	const results: Result[] = [];
	let ref: StepRef | undefined;
	for (const s of line.statements) {
		const out = runStatement(s, input, env);
		results.push(...out.results);
		if (out.ref) ref = out.ref;
	}
	return { results, ...(ref ? { ref } : {}) };
}

function runStatement(s: A.Statement, input: string, env: LineEnv): StatementOut {
	switch (s.type) {
		case 'use':
			return runUse(s, env);
		case 'units':
			return runUnits(s, env);
		case 'verb':
			requireKnownBulk(s, env);
			return runVerb(s, env);
		case 'compare':
			requireKnownBulk(s, env);
			return runCompare(s, env);
		case 'plot':
			return runPlot(s, env);
		case 'help':
			return runHelp(s);
		case 'macro':
			return runMacro(s, input, env, runText);
		case 'arith':
			return runArith(s, env);
		case 'let': {
			const out = runStatement(s.body, input, env);
			const ref = out.ref;
			if (!ref || (ref.value === undefined && Object.keys(ref.fields).length === 0)) {
				throw new LangError(`nothing to keep: '${s.name.text}' would have no value`, s.body.start, s.body.end);
			}
			env.lets = { ...env.lets, [s.name.text]: { ...ref, fields: { ...ref.fields } } };
			const shown = ref.value !== undefined ? ` = ${Number(ref.value.toPrecision(10))}` : ` (fields ${Object.keys(ref.fields).join(', ')})`;
			return { results: [...out.results, { kind: 'note', text: `kept as ${s.name.text}${shown}` }], ref };
		}
	}
}

/**
 * A pad keeps its bulk by name, and a stored name may be one this Bulkpad does not know (an old import, a
 * hand-edited database). A verb needs a known bulk, so it says which one is unknown and how to leave it,
 * instead of failing inside the schema lookup; `use`, `units`, `let` and arithmetic still run.
 */
function requireKnownBulk(s: A.Span, env: LineEnv) {
	const name: unknown = env.bulk.name;
	if (typeof name === 'string' && isBulk(name)) return;
	const shown = typeof name === 'string' ? `'${name.slice(0, 40)}'` : 'with no valid name';
	throw new LangError(`this pad's bulk ${shown} is not one Bulkpad knows`, s.start, s.end, {
		hint: `start with use <bulk> …, one of ${BULKS.join(', ')}`
	});
}

/** Keys given once each, evaluated against `scope`; lists and ranges make no sense for `use`/`units`. */
function singleValues(
	keys: A.KeyValue[],
	scope: Parameters<typeof resolveValue>[1],
	env: LineEnv,
	what: string
): Record<string, number | string> {
	const out: Record<string, number | string> = {};
	for (const kv of keys) {
		const r = resolveValue(kv.value, scope, env.limits);
		if (r.many || r.value === 'exact') {
			throw new LangError(`${what} takes one value per key`, kv.value.start, kv.value.end, {
				hint: 'sweep on a verb line instead: sweep darea v=0..0.9'
			});
		}
		out[kv.key] = r.value;
	}
	return out;
}

function checkedOrThrow<T>(c: Checked<T>, keys: A.KeyValue[], fallback: A.Span): T {
	if (c.ok) return c.value;
	const kv = keys.find((k) => k.key === c.key);
	const span = kv ? (c.message.startsWith('key ') || c.message.startsWith('units ') ? kv.keySpan : kv.value) : fallback;
	throw new LangError(c.message, span.start, span.end, c.hint ? { hint: c.hint } : {});
}

/** `use <bulk> k=v…`: a fresh bulk (unnamed keys take their defaults), checked by its schema and the engine. */
function runUse(s: A.UseStmt, env: LineEnv): StatementOut {
	const name = s.bulk.text as BulkName;
	const given = singleValues(s.keys, { ctx: env.ctx, lets: env.lets, bulk: env.bulk.params }, env, 'use');
	const params = checkedOrThrow(checkBulk(name, given), s.keys, s.bulk);
	const made = withEngine(s.keys, s.bulk, '', () => engine.makeBulk(name, params));
	env.bulk = { name, params };
	const units = unitsAfterUse(env.units, made.d);
	return { results: [{ kind: 'note', text: `bulk: ${describeBulk(env.bulk)}` }, ...(units ? [units] : [])] };
}

function runUnits(s: A.UnitsStmt, env: LineEnv): StatementOut {
	const system = s.system.text as keyof typeof UNITS_SCHEMAS;
	const given = singleValues(s.keys, { ctx: env.ctx, lets: env.lets, bulk: env.bulk.params }, env, 'units');
	const p = checkedOrThrow(checkUnits(system, given), s.keys, s.system);
	env.units = system === 'geo' ? { system, G: p.G! } : system === 'cft' ? { system, c: p.c! } : { system, N: p.N! };
	const how = { geo: `G = ${p.G}`, cft: `c = ${p.c} (d = 2, G = 3/(2c))`, sym: `N = ${p.N} (d = 4, L³/G₅ = 2N²/π)` }[system];
	return { results: [{ kind: 'note', text: `units: ${system}, ${how}` }] };
}

function runArith(s: A.ArithStmt, env: LineEnv): StatementOut {
	const scope = { ctx: env.ctx, lets: env.lets, bulk: env.bulk.params };
	const value = evaluateExpr(s.expr, resolverFor(scope));
	const order = orderOfNames(s.expr, scope);
	const result: Result = {
		kind: 'scalar',
		label: printExpr(s.expr),
		value,
		order,
		latex: `${texExpr(s.expr)} = ${texNumber(value)}`
	};
	return { results: applySinks([result], s.sinks, 'value'), ref: { value, fields: {}, order } };
}
