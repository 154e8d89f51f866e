/**
 * `help darea`, `?darea`, `help`: what a word of the language does, answered as notes in the pad. A verb's
 * answer comes from the verb registry (its forms and keys, method, accuracy, published source and examples),
 * the rest from help.ts's table; an unknown word gets the nearest known one.
 */
import type * as A from './ast';
import type { StatementOut } from './env';
import { LangError } from './errors';
import { help, helpEntries } from './help';
import type { Result } from './result';
import { didYouMean } from './suggest';

const note = (text: string): Result => ({ kind: 'note', text });

export function runHelp(s: A.HelpStmt): StatementOut {
	if (!s.topic) {
		const verbs = helpEntries('verb').map((e) => e.name);
		const rest = helpEntries('statement').map((e) => e.name);
		return {
			results: [
				note(`verbs: ${verbs.join(', ')}`),
				note(`statements: ${rest.join(', ')}, plot #n #m, help <word>`),
				note('help <word> or ?<word> explains one, e.g. ?darea')
			]
		};
	}
	const word = s.topic.text;
	const e = help(word);
	if (!e) {
		const names = helpEntries().map((x) => x.name);
		throw new LangError(`no help for '${word}'${didYouMean(word, names)}`, s.topic.start, s.topic.end, {
			hint: 'help alone lists the verbs'
		});
	}
	const out: Result[] = [note(`${e.name} (${e.kind}): ${e.summary}`)];
	if (e.detail) {
		out.push(note(`forms: ${e.detail.forms.join(' · ')}`));
		out.push(note(`method: ${e.detail.method}`));
		out.push(note(`accuracy: ${e.detail.accuracy}`));
		out.push(note(`source: ${e.detail.source}`));
		out.push(note(`examples: ${e.detail.examples.slice(0, 2).join('  ·  ')}`));
	} else out.push(note(`example: ${e.example}`));
	return { results: out };
}
