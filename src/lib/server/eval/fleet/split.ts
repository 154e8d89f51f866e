/**
 * Splitting a sweep across the fleet at the job level, with as little knowledge of the language as possible:
 * a chunk is the same line with the swept key's list or range replaced by a list of a run of its points, each
 * written so it reads back as the very same double. Each chunk is evaluated like any line; the chunks' tables
 * are put back together in order, and the line's answer is then the in-process answer bit for bit.
 *
 * Only lines where that is plainly true are split: one verb statement (after `use`/`units` settings), with no sink but `table`/`plot`, one
 * swept key (not the order) whose list items or range ends and count are number literals, and exact values
 * only: a truncated order's table carries warnings merged over all its points (the largest l past the radius,
 * per order), which no chunk can say alone — and series sweeps are cheap, the heavy sweeps are exact ones
 * (quench growth over widths, metric bulks; exact balls continue from point to point and a quench sweep over t shares one
 * family curve, so those stay whole). Anything else runs whole on one worker. Merging checks that every chunk answered the same table apart from its rows (label,
 * columns, plot hints, warning, note, the pad's state); when they differ, or a chunk answers a language error
 * (its span points into the chunk's text), the caller runs the line whole instead — exactness over speed.
 */
import { isDeepStrictEqual } from 'node:util';
import type * as A from '../../../lang/ast';
import { DEFAULT_LIMITS } from '../../../lang/limits';
import { parse } from '../../../lang/parser';
import type { LineOutcome, PlotGuide, TableResult } from '../../../lang/result';

export interface Chunk {
	input: string;
	/** evaluation points of this chunk (its swept values: one order each), for progress before it reports its own */
	points: number;
}

/** Fewer points than this in a chunk and the queue's overhead outweighs the work. */
const MIN_CHUNK_POINTS = 4;
const SINKS_KEPT = new Set(['table', 'plot']);
/** Statements that may come before the sweep: they set the pad's state and answer the same note in every chunk. */
const SETTINGS = new Set<A.Statement['type']>(['use', 'units']);

/** A literal number (`0.5`, `-2`, `+1e-3`), or undefined for anything that needs the pad's context. */
function literal(e: A.Item | undefined): number | undefined {
	if (!e) return undefined;
	if (e.type === 'number') return e.value;
	if (e.type === 'unary' && e.arg.type === 'number') return e.op === '-' ? -e.arg.value : e.arg.value;
	return undefined;
}

/**
 * The swept values, computed exactly as the language does (src/lib/lang/values.ts `resolveValue`: both ends
 * included, `a + (b − a)·i/(n − 1)`, the last point exactly b; 50 points by default); tests/unit/server/
 * fleet-split.test.ts checks this against the language's own function.
 */
function valuesOf(v: A.Value): number[] | undefined {
	if (v.type === 'list') {
		const out = v.items.map(literal);
		return out.every((x): x is number => x !== undefined) ? out : undefined;
	}
	if (v.type !== 'range') return undefined;
	const a = literal(v.from);
	const b = literal(v.to);
	const n = v.points ? literal(v.points) : 50;
	if (a === undefined || b === undefined || n === undefined || !Number.isInteger(n) || n < 2 || n > DEFAULT_LIMITS.maxPoints) {
		return undefined;
	}
	const values: number[] = [];
	for (let i = 0; i < n; i++) values.push(i === n - 1 ? b : a + ((b - a) * i) / (n - 1));
	return values;
}

/** How a double is written so the lexer reads back the same double: the shortest round-trip form. */
function written(x: number): string | undefined {
	if (!Number.isFinite(x) || Object.is(x, -0)) return undefined;
	return String(x);
}

/**
 * The line's chunks, in order, or undefined when the line is not split (see the top of this file). `target`
 * is how many chunks to aim for; more are made when a chunk's text would pass the language's length limits.
 */
export function splitSweep(input: string, target: number): Chunk[] | undefined {
	let line: A.Line;
	try {
		line = parse(input);
	} catch {
		return undefined;
	}
	// `use …; sweep …` (a stateless script's way to pick a bulk) splits too: every chunk repeats the settings
	const s = line.statements[line.statements.length - 1]!;
	if (!line.statements.slice(0, -1).every((p) => SETTINGS.has(p.type))) return undefined;
	if (s.type !== 'verb' || s.sinks.some((k) => !SINKS_KEPT.has(k.text))) return undefined;
	// a ball sweep starts each exact ball from the previous ones (verbs/point.ts, Point.carry): a chunk would start
	// afresh and land within 1e-14 of the whole line's numbers but not on them — and balls take a millisecond each
	if (s.subject?.text === 'ball') return undefined;
	const isOrder = (kv: A.KeyValue) => kv.key === 'o' || kv.key === 'order';
	const many = s.keys.filter((kv) => !isOrder(kv) && (kv.value.type === 'list' || kv.value.type === 'range'));
	if (many.length !== 1) return undefined;
	const swept = many[0]!;
	// a quench sweep over t shares one family curve (holo/vaidya/curve.ts), refined for each time in turn: chunks would
	// each build it (the work split is mostly the same build repeated) and land within rounding of the whole line's
	// numbers, not on them. Sweeps over l (a curve per width) split as any other
	if (swept.key === 't') return undefined;
	const xs = valuesOf(swept.value);
	const texts = xs?.map(written);
	if (!xs || !texts || texts.some((t) => t === undefined)) return undefined;
	const orderKey = s.keys.find(isOrder);
	if (orderKey && orderKey.value.type !== 'exact') return undefined;
	// a list over the points limit is left whole, so it answers the limit's own message
	if (xs.length > DEFAULT_LIMITS.maxPoints) return undefined;
	if (xs.length < 2 * MIN_CHUNK_POINTS) return undefined;

	const head = input.slice(0, swept.value.start);
	const tail = input.slice(swept.value.end);
	for (let count = Math.min(target, Math.floor(xs.length / MIN_CHUNK_POINTS)); count <= xs.length / 2; count++) {
		if (count < 2) return undefined;
		const size = Math.ceil(xs.length / count);
		const chunks: Chunk[] = [];
		let fits = true;
		for (let i = 0; i < xs.length && fits; i += size) {
			// never a one-point chunk: a verb without `sweep` answers one point as a scalar, not a table
			const end = xs.length - (i + size) === 1 ? xs.length : Math.min(xs.length, i + size);
			const text = `${head}${texts.slice(i, end).join(',')}${tail}`;
			try {
				parse(text);
			} catch {
				fits = false;
			}
			chunks.push({ input: text, points: end - i });
			if (end === xs.length) break;
		}
		if (fits) return chunks;
	}
	return undefined;
}

const withoutRows = (t: TableResult) => ({ ...t, rows: [], plot: t.plot && { ...t.plot, guides: [] } });

/**
 * Reference curves of the chunks joined into the whole line's: a guide's points sit at the table's own x values
 * (over a part of the range fixed by the physics, not by the range), so joining each label's points in chunk
 * order, labels in order of first appearance, gives the whole line's guides.
 */
function mergeGuides(tables: TableResult[]): PlotGuide[] | undefined {
	const byLabel = new Map<string, PlotGuide>();
	for (const t of tables) {
		for (const g of t.plot?.guides ?? []) {
			const seen = byLabel.get(g.label);
			if (seen) seen.points.push(...g.points);
			else byLabel.set(g.label, { label: g.label, points: [...g.points] });
		}
	}
	return byLabel.size ? [...byLabel.values()] : undefined;
}

/**
 * The whole line's outcome from its chunks' outcomes, in order; undefined when they do not agree on anything
 * but their rows (the caller then runs the line whole). A split line answers the same notes of its settings
 * (`use …`) in every chunk, then one table of at least two rows per chunk, so its `#n` exposes no single value,
 * the same for each chunk and the whole.
 */
export function mergeChunks(outcomes: LineOutcome[]): LineOutcome | undefined {
	const first = outcomes[0];
	const last = first?.results.length ? first.results[first.results.length - 1] : undefined;
	if (!first || last?.kind !== 'table') return undefined;
	const tables: TableResult[] = [];
	for (const o of outcomes) {
		const t = o.results[o.results.length - 1];
		if (o.results.length !== first.results.length || t?.kind !== 'table') return undefined;
		if (!isDeepStrictEqual(withoutRows(t), withoutRows(last))) return undefined;
		if (!isDeepStrictEqual({ ...o, results: o.results.slice(0, -1) }, { ...first, results: first.results.slice(0, -1) })) return undefined;
		tables.push(t);
	}
	const table: TableResult = { ...last, rows: tables.flatMap((t) => t.rows) };
	const guides = mergeGuides(tables);
	if (guides) table.plot = { ...last.plot!, guides };
	return { ...first, results: [...first.results.slice(0, -1), table] };
}
