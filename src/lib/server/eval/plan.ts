/**
 * What the server needs to know about a line before it queues it, read from the parsed line (the parser is
 * cheap and carries no package): whether it is heavy, and which datasets and macros it can reach, so only
 * those are read from the database and sent to the evaluation process.
 */
import { parse } from '../../lang/parser';
import type * as A from '../../lang/ast';
import type { PadContext } from '../../lang/result';

/** A list or range of more points than this is a sweep, whatever the verb. */
const LIGHT_POINTS = 8;
/** Series orders above this take noticeably longer (exact rationals grow fast). */
export const LIGHT_ORDER = 6;

const WORD = /[a-z][a-z0-9_]*/g;

function pointsOf(v: A.Value): number {
	if (v.type === 'list') return v.items.length;
	if (v.type === 'range') return v.points?.type === 'number' ? v.points.value : Infinity;
	return 1;
}

function heavyStatement(s: A.Statement, bulk: string): boolean {
	switch (s.type) {
		case 'use':
			return s.bulk.text === 'metric';
		case 'macro':
		case 'compare':
			return true; // a macro body or a dataset's rows: unknown or proportional work
		case 'let':
			return heavyStatement(s.body, bulk);
		case 'verb': {
			if (s.sweep || s.subject?.text === 'ball' || bulk === 'metric') return true;
			for (const kv of s.keys) {
				if (pointsOf(kv.value) > LIGHT_POINTS) return true;
				if ((kv.key === 'o' || kv.key === 'order') && kv.value.type === 'number' && kv.value.value > LIGHT_ORDER) return true;
			}
			return false;
		}
		default:
			return false;
	}
}

/**
 * Heavy or light, from the statements; a line that does not parse is light (it answers its error at once).
 * The pad's bulk matters: every verb in a metric bulk integrates a user formula numerically.
 */
export function isHeavyLine(input: string, bulkName: string): boolean {
	let line: A.Line;
	try {
		line = parse(input);
	} catch {
		return false;
	}
	let bulk = bulkName;
	for (const s of line.statements) {
		if (heavyStatement(s, bulk)) return true;
		if (s.type === 'use') bulk = s.bulk.text;
	}
	return false;
}

/**
 * Every word the line can reach: its own and, through `@name`, the bodies and defaults of the macros it calls
 * (macros calling macros included). A dataset is loaded only if its name is one of these words — a superset
 * of what `compare` can name, and far less than all of the owner's datasets.
 */
export function reachableWords(input: string, macros: NonNullable<PadContext['macros']>): Set<string> {
	const words = new Set<string>();
	const seen = new Set<string>();
	const todo = [input];
	while (todo.length) {
		const text = todo.pop()!;
		for (const w of text.toLowerCase().match(WORD) ?? []) words.add(w);
		for (const m of text.matchAll(/@([A-Za-z_][A-Za-z0-9_]*)/g)) {
			const name = m[1]!;
			if (seen.has(name) || !Object.prototype.hasOwnProperty.call(macros, name)) continue;
			seen.add(name);
			todo.push(...macros[name]!.body, ...Object.values(macros[name]!.params));
		}
	}
	return words;
}
