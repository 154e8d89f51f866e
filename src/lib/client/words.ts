/**
 * The palette's verbs and bulks with one line of help and an example each, from the language's own help
 * table ($lib/lang/help.ts: plain data, no mathjs), so the palette and the language never disagree.
 */
import { helpEntries } from '$lib/lang/help';
import type { Vocabulary } from './completion';

export interface Word {
	name: string;
	help: string;
	example: string;
}

const words = (kind: Parameters<typeof helpEntries>[0]): Word[] =>
	helpEntries(kind).map((e) => ({ name: e.name, help: e.summary, example: e.example }));

/** statements that start a line like verbs (`@macro` and `arithmetic` are forms, listed elsewhere) */
const statements = () => words('statement').filter((w) => /^[a-z]+$/.test(w.name) && w.name !== 'arithmetic');

export function buildVocabulary(macros: Vocabulary['macros'] = []): Vocabulary {
	return { verbs: [...words('verb'), ...statements()], bulks: words('bulk'), macros };
}
