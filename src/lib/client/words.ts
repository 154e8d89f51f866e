/**
 * The console's vocabulary for the palette and Tab completion, taken from the language's own help table
 * ($lib/lang/help.ts: plain data, no mathjs) so the two never disagree. Bulk keys and value hints that the
 * help table does not carry come from ./vocabulary.
 */
import { helpEntries } from '$lib/lang/help';
import { BULK_KEYS, VALUE_HINTS, type Word } from './vocabulary';
import type { Vocabulary } from './completion';

const words = (kind: Parameters<typeof helpEntries>[0]): Word[] =>
	helpEntries(kind).map((e) => ({ name: e.name, help: e.summary, example: e.example }));

/** statements that read like verbs at the start of a line (not `@macro` or `arithmetic`, which are forms) */
const statements = () => words('statement').filter((w) => /^[a-z]+$/.test(w.name) && w.name !== 'arithmetic');

export function buildVocabulary(macros: Vocabulary['macros'] = []): Vocabulary {
	return {
		verbs: [...words('verb'), ...statements()],
		bulks: words('bulk'),
		keys: words('key'),
		sinks: words('sink'),
		macros,
		bulkKeys: BULK_KEYS,
		values: VALUE_HINTS
	};
}
