/**
 * The line to type in a pad for a dataset. The language's `compare` takes x from the dataset, so no `l=`
 * is written: the verb is the column named after a verb (`darea`), or the first other column via `y="…"`.
 */
import { isVerb } from '../lang/vocab';

export function compareHint(name: string, columns: string[]): string {
	const verb = columns.find((c) => isVerb(c));
	if (verb) return `compare ${name} ${verb}`;
	const y = columns[1] ?? columns[0] ?? 'y';
	return `compare ${name} darea y="${y}"`;
}
