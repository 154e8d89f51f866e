/**
 * Tab-completion candidates for the console: what may come at the cursor, given the statement it is in.
 * Works on characters, not on the parser, because the line being typed is usually not valid yet. No mathjs,
 * no zod: this ships to the browser.
 */
import { help } from './help';
import { verbNames, verbSpec } from './verbs/index';
import { BULKS, BULK_KEYS, KEYWORDS, SHAPES, SINKS, UNIT_SYSTEMS, WORD_KEYS, isBulk, isVerb } from './vocab';

export interface Completion {
	/** the text to put in place of the word at the cursor */
	insert: string;
	label: string;
	/** one line of help */
	detail?: string;
}

export interface CompletionResult {
	/** the span of the line the chosen completion replaces */
	start: number;
	end: number;
	items: Completion[];
}

export interface CompletionContext {
	/** the pad's bulk name (default brane) */
	bulk?: string;
	lets?: string[];
	macros?: string[];
	datasets?: string[];
}

const ORDER_VALUES = ['1', '2', '3', '4', 'exact'];

export function complete(input: string, cursor: number = input.length, cc: CompletionContext = {}): CompletionResult {
	const upto = input.slice(0, Math.max(0, Math.min(cursor, input.length)));
	const stmtStart = lastStatementStart(upto);
	const stmt = upto.slice(stmtStart);
	const wordMatch = /[^\s;|]*$/.exec(stmt)!;
	const word = wordMatch[0];
	const start = upto.length - word.length;
	let end = start + word.length;
	while (end < input.length && !/[\s;|]/.test(input[end]!)) end++;
	const before = stmt.slice(0, stmt.length - word.length);
	const words = before.trim() === '' ? [] : before.trim().split(/\s+/);

	const items = candidates(words, word, before, cc);
	const eq = word.indexOf('=');
	const prefix =
		eq >= 0
			? word
					.slice(eq + 1)
					.split(',')
					.pop()!
			: word;
	const offset = word.length - prefix.length;
	const chosen = items.filter((c) => c.insert.startsWith(prefix) && c.insert !== prefix);
	return { start: start + offset, end, items: chosen };
}

function lastStatementStart(s: string): number {
	let inString = false;
	let start = 0;
	for (let i = 0; i < s.length; i++) {
		if (s[i] === '"') inString = !inString;
		else if (s[i] === ';' && !inString) start = i + 1;
	}
	return start;
}

function entries(names: readonly string[], toHelp = (n: string) => n): Completion[] {
	return names.map((n) => {
		const h = help(toHelp(n));
		return h ? { insert: n, label: n, detail: h.summary } : { insert: n, label: n };
	});
}

function candidates(words: string[], word: string, before: string, cc: CompletionContext): Completion[] {
	if (/\|\s*$/.test(before)) return entries(SINKS);
	const eq = word.indexOf('=');
	if (eq >= 0) return valuesFor(word.slice(0, eq));
	const first = words[0];
	if (first === undefined) {
		return [
			...entries(KEYWORDS.filter((k) => k !== 'exact')),
			...entries(verbNames()),
			...(cc.macros ?? []).map((m) => ({ insert: `@${m}`, label: `@${m}`, detail: 'macro from the library' })),
			...(cc.lets ?? []).map((l) => ({ insert: l, label: l, detail: 'kept with let' }))
		];
	}
	if (first === 'let') return words.length >= 3 ? candidates(words.slice(3), word, '', cc) : [];
	if (first === 'use') return words.length === 1 ? entries(BULKS) : keysOf(words[1]!, undefined, undefined, words);
	if (first === 'units') return words.length === 1 ? entries(UNIT_SYSTEMS) : unitKey(words[1]!);
	if (first === 'compare') {
		if (words.length === 1) return (cc.datasets ?? []).map((d) => ({ insert: d, label: d, detail: 'dataset' }));
		return words.length === 2 ? entries(verbNames()) : [];
	}
	const verbAt = first === 'sweep' ? 1 : 0;
	if (first === 'sweep' && words.length === 1) return entries(verbNames());
	const verb = words[verbAt];
	if (!verb || !isVerb(verb)) return [];
	const subject = words[verbAt + 1];
	const hasSubject = subject !== undefined && !subject.includes('=');
	const subjects = Object.keys(verbSpec(verb)!.forms).filter((s) => s !== '');
	const out = keysOf(cc.bulk ?? 'brane', verb, hasSubject ? subject : undefined, words);
	if (!hasSubject && words.length === verbAt + 1 && subjects.length > 1) {
		out.unshift(...entries(subjects.filter((s) => (SHAPES as readonly string[]).includes(s) || isVerb(s))));
	}
	return out;
}

/** `key=` candidates not yet given on the statement. */
function keysOf(bulk: string, verb: string | undefined, subject: string | undefined, words: string[]): Completion[] {
	const given = new Set(words.filter((w) => w.includes('=')).map((w) => w.slice(0, w.indexOf('='))));
	const keys: string[] = [];
	const spec = verb ? verbSpec(verb) : undefined;
	if (spec) {
		const forms = spec.forms;
		const form = forms[subject ?? Object.keys(forms)[0]!];
		if (form) keys.push(...form.keys);
	}
	if (isBulk(bulk)) keys.push(...BULK_KEYS[bulk]);
	return (
		[...new Set(keys)]
			// phase= picks a soliton surface: elsewhere there is only one, so it is not offered; t= is for the quench
			.filter(
				(k) =>
					!given.has(k) && !(k === 'o' && given.has('order')) && !(k === 'phase' && bulk !== 'soliton') && !(k === 't' && bulk !== 'vaidya')
			)
			.map((k) => {
				const h = help(k);
				return h ? { insert: `${k}=`, label: k, detail: h.summary } : { insert: `${k}=`, label: k };
			})
	);
}

function valuesFor(key: string): Completion[] {
	if (key === 'o' || key === 'order') return ORDER_VALUES.map((v) => ({ insert: v, label: v }));
	if (key === 'f') return [{ insert: '"1 - (z/zh)^4"', label: 'brane-like f' }];
	if (key === 'h') return [{ insert: '"1"', label: 'h = 1' }];
	if (Object.prototype.hasOwnProperty.call(WORD_KEYS, key)) return WORD_KEYS[key]!.map((w) => ({ insert: w, label: w }));
	return [];
}

function unitKey(system: string): Completion[] {
	const k = system === 'geo' ? 'G' : system === 'cft' ? 'c' : system === 'sym' ? 'N' : undefined;
	return k ? [{ insert: `${k}=`, label: k }] : [];
}
