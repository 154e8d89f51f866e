/**
 * Tab completion for the input line: which word the caret is in, what may go there (verbs, bulks, keys,
 * values, sinks, macros), and how the line reads after accepting a candidate. Pure, so it is unit-tested.
 */
import { BULK_KEYS, FALLBACK_BULKS, FALLBACK_KEYS, FALLBACK_SINKS, FALLBACK_VERBS, VALUE_HINTS, type Word } from './vocabulary';

export interface Candidate {
	/** what replaces the word under the caret */
	insert: string;
	label: string;
	detail?: string;
}

export interface Vocabulary {
	verbs: Word[];
	bulks: Word[];
	keys: Word[];
	sinks: Word[];
	macros: { name: string; description?: string; params?: Record<string, string> }[];
	bulkKeys: Record<string, string[]>;
	values: Record<string, string[]>;
}

export const FALLBACK_VOCABULARY: Vocabulary = {
	verbs: FALLBACK_VERBS,
	bulks: FALLBACK_BULKS,
	keys: FALLBACK_KEYS,
	sinks: FALLBACK_SINKS,
	macros: [],
	bulkKeys: BULK_KEYS,
	values: VALUE_HINTS
};

const STATEMENT_WORDS = new Set(['use', 'units', 'let', 'sweep', 'compare']);
const QUANTITY_KEYS = ['l', 'R', 'gap', 'o', 'zstar', 'tol', 'G'];
const SHAPES = ['strip', 'ball', 'pair'];

export interface WordAt {
	start: number;
	end: number;
	word: string;
}

/** The word around the caret: letters, digits and the value characters of the language, up to a space, `;` or `|`. */
export function wordAt(line: string, caret: number): WordAt {
	const isWord = (c: string | undefined) => c !== undefined && !/[\s;|]/.test(c);
	let start = caret;
	while (start > 0 && isWord(line[start - 1])) start--;
	let end = caret;
	while (end < line.length && isWord(line[end])) end++;
	return { start, end, word: line.slice(start, caret) };
}

/** Candidates for the word at the caret, best first. */
export function complete(line: string, caret: number, vocab: Vocabulary = FALLBACK_VOCABULARY): { at: WordAt; candidates: Candidate[] } {
	const at = wordAt(line, caret);
	const stmtStart = line.lastIndexOf(';', at.start - 1) + 1;
	const before = line.slice(stmtStart, at.start);
	const pipe = before.includes('|');
	const words = before.replace(/\|.*$/, '').trim().split(/\s+/).filter(Boolean);
	const w = at.word;
	const pick = (items: Candidate[]) => ({ at, candidates: items.filter((c) => c.insert.startsWith(w) && c.insert !== w) });
	const fromWords = (ws: Word[], suffix = '') => ws.map((x) => ({ insert: x.name + suffix, label: x.name + suffix, detail: x.help }));

	if (pipe) return pick(fromWords(vocab.sinks));
	if (w.startsWith('@'))
		return pick(vocab.macros.map((m) => ({ insert: '@' + m.name, label: '@' + m.name, detail: m.description })));

	// key=value: values for that key
	const eq = w.indexOf('=');
	if (eq > 0) {
		const key = w.slice(0, eq);
		const typed = w.slice(eq + 1);
		const hints = vocab.values[key] ?? [];
		const prefix = typed.includes(',') ? typed.slice(0, typed.lastIndexOf(',') + 1) : '';
		return pick(hints.map((v) => ({ insert: `${key}=${prefix}${v.startsWith(prefix) ? v.slice(prefix.length) : v}`, label: v })));
	}

	if (words.length === 0) {
		const verbs = fromWords(vocab.verbs);
		return pick(verbs);
	}
	const first = words[0]!;
	const given = new Set(words.filter((x) => x.includes('=')).map((x) => x.slice(0, x.indexOf('='))));
	const keyCands = (names: string[]) =>
		names
			.filter((k) => !given.has(k))
			.map((k) => ({ insert: k + '=', label: k + '=', detail: vocab.keys.find((x) => x.name === k)?.help }));

	if (first === 'use') {
		if (words.length === 1) return pick(fromWords(vocab.bulks));
		return pick(keyCands(vocab.bulkKeys[words[1]!] ?? []));
	}
	if (first === 'units') {
		if (words.length === 1) return pick(['geo', 'cft', 'sym'].map((u) => ({ insert: u, label: u })));
		return pick(keyCands({ geo: ['G'], cft: ['c'], sym: ['N'] }[words[1]!] ?? []));
	}
	if (first === 'sweep' && words.length === 1) return pick(fromWords(vocab.verbs.filter((v) => !STATEMENT_WORDS.has(v.name))));
	if (first === 'let') return { at, candidates: [] };

	// a verb line: a shape right after the verb, then keys (quantity keys and any bulk key, which overrides)
	const allBulkKeys = [...new Set(Object.values(vocab.bulkKeys).flat())];
	const shapes = words.length === (first === 'sweep' ? 2 : 1) ? SHAPES.map((s) => ({ insert: s, label: s, detail: 'shape' })) : [];
	return pick([...keyCands(QUANTITY_KEYS), ...shapes, ...keyCands(allBulkKeys)]);
}

/** The longest prefix all candidates share (what a first Tab inserts when there are several). */
export function commonPrefix(xs: string[]): string {
	if (!xs.length) return '';
	let p = xs[0]!;
	for (const x of xs) while (!x.startsWith(p)) p = p.slice(0, -1);
	return p;
}

/** The line with the word at `at` replaced by `insert`, and where the caret goes. */
export function applyCandidate(line: string, at: WordAt, insert: string): { line: string; caret: number } {
	// a finished word gets a space after it; a key waiting for its value does not
	const tail = line.slice(at.end);
	const space = insert.endsWith('=') || insert.endsWith(',') || tail.startsWith(' ') ? '' : ' ';
	const next = line.slice(0, at.start) + insert + space + tail;
	return { line: next, caret: at.start + insert.length + space.length };
}
