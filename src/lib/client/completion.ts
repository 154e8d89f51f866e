/**
 * Tab completion for the input line. What may go at the caret comes from the language itself
 * ($lib/lang/complete.ts, mathjs-free); this module turns its answer into edits of the line: which span is
 * replaced, the shared prefix of several candidates, where the caret lands.
 */
import { complete, type CompletionContext } from '$lib/lang/complete';
import type { Word } from './words';

export interface Candidate {
	/** what replaces the span under the caret */
	insert: string;
	label: string;
	detail?: string;
}

/** The span a candidate replaces, and what of it is typed up to the caret. */
export interface WordAt {
	start: number;
	end: number;
	word: string;
}

/** What the palette lists, and what completion knows beyond the language: macros of the library. */
export interface Vocabulary {
	verbs: Word[];
	bulks: Word[];
	macros: { name: string; description?: string; params?: Record<string, string>; effects?: ('bulk' | 'units')[] }[];
}

export function completeAt(line: string, caret: number, cc: CompletionContext = {}): { at: WordAt; candidates: Candidate[] } {
	const r = complete(line, caret, cc);
	return { at: { start: r.start, end: r.end, word: line.slice(r.start, Math.max(r.start, caret)) }, candidates: r.items };
}

/** The longest prefix all candidates share (what a first Tab inserts when there are several). */
export function commonPrefix(xs: string[]): string {
	if (!xs.length) return '';
	let p = xs[0]!;
	for (const x of xs) while (!x.startsWith(p)) p = p.slice(0, -1);
	return p;
}

/** The line with the span `at` replaced by `insert`, and where the caret goes. */
export function applyCandidate(line: string, at: WordAt, insert: string): { line: string; caret: number } {
	// a finished word gets a space after it; a key waiting for its value does not
	const tail = line.slice(at.end);
	const space = insert.endsWith('=') || insert.endsWith(',') || tail.startsWith(' ') ? '' : ' ';
	const next = line.slice(0, at.start) + insert + space + tail;
	return { line: next, caret: at.start + insert.length + space.length };
}
