import type { PadDocument } from './schema';
import { formatNumber, orderText } from './numbers';
import { safeMath } from './safe-math';

type Results = NonNullable<PadDocument['steps'][number]['results']>;

/** A fence longer than any backtick run inside, so an input can never close its own code block. */
function fenced(text: string, lang = ''): string {
	const longest = Math.max(0, ...(text.match(/`+/g) ?? []).map((r) => r.length));
	const fence = '`'.repeat(Math.max(3, longest + 1));
	return `${fence}${lang}\n${text}\n${fence}`;
}

/** An inline code span that no backtick inside can close (CommonMark: the fence is a run of equal length). */
function code(text: string): string {
	const longest = Math.max(0, ...(text.match(/`+/g) ?? []).map((r) => r.length));
	const fence = '`'.repeat(longest + 1);
	return `${fence} ${text.replace(/[\r\n]+/g, ' ')} ${fence}`;
}

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;' };

/**
 * User text (titles, labels, messages, table cells) as plain Markdown text: no raw HTML (`<`, `>` and `&` become
 * entities, which every renderer shows as the character and none parses as a tag), no emphasis, link, code or
 * table syntax (backslash escapes), no control characters and no line breaks.
 */
function inline(text: string): string {
	return (
		text
			.replace(/[\r\n]+/g, ' ')
			// eslint-disable-next-line no-control-regex -- control characters are what this line removes
			.replace(/[\x00-\x1f\x7f]/g, ' ')
			.replace(/[&<>]/g, (c) => ENTITIES[c])
			.replace(/([\\`*_[\]|~])/g, '\\$1')
	);
}

function cell(v: unknown): string {
	return inline(formatNumber(v));
}

/**
 * A display formula for renderers with math support. Only formulas the .tex export would compile get a math
 * block (so no `$` or raw text gets out), and `<`, `>` become \lt, \gt so no tag can form; anything else is
 * shown as a code block.
 */
function mathBlock(latex: string | undefined): string[] {
	if (!latex) return [];
	const safe = safeMath(latex);
	if (safe === null) return ['', fenced(latex.replace(/\r?\n/g, ' '), 'tex')];
	return ['', '$$', safe.replace(/</g, '\\lt ').replace(/>/g, '\\gt '), '$$'];
}

function renderResult(r: Results[number]): string[] {
	switch (r.kind) {
		case 'scalar':
			return [
				`- **${inline(r.label)}** = ${cell(r.value)}${r.unit ? ' ' + inline(r.unit) : ''} (${inline(orderText(r.order))})`,
				...mathBlock(r.latex),
				...warn(r.warning)
			];
		case 'record':
			return [
				`- **${inline(r.label)}**: ${Object.entries(r.fields)
					.map(([k, v]) => `${inline(k)} = ${cell(v)}`)
					.join(', ')}`,
				...mathBlock(r.latex),
				...warn(r.warning)
			];
		case 'table':
			return [
				`- **${inline(r.label)}** (${r.rows.length} rows)`,
				'',
				`| ${r.columns.map(cell).join(' | ')} |`,
				`| ${r.columns.map(() => '---').join(' | ')} |`,
				...r.rows.map((row) => `| ${row.map(cell).join(' | ')} |`),
				...warn(r.warning)
			];
		case 'series':
			return [
				`- **${inline(r.label)}** (series, ${r.terms.length} terms): ${r.terms.map((t) => `k=${t.k}: ${cell(t.coeff)}`).join(', ')}`,
				...mathBlock(r.latex),
				...warn(r.warning)
			];
		case 'check':
			return [
				`- **${inline(r.label)}**: ${r.pass ? 'holds' : 'fails'} — lhs = ${cell(r.lhs)}, rhs = ${cell(r.rhs)}, residual = ${cell(r.residual)} (tolerance ${cell(r.tolerance)})`,
				...warn(r.warning)
			];
		case 'figure':
			return [`- **${inline(r.label)}**: a figure overlaying the tables of steps ${r.steps.map((n) => `#${n}`).join(', ')}`];
		case 'note':
			return [`- ${inline(r.text)}`];
	}
}

function warn(w: string | undefined): string[] {
	return w ? ['', `  > ⚠ ${inline(w)}`] : [];
}

function bulkText(bulk: PadDocument['bulk']): string {
	const params = Object.entries(bulk.params)
		.map(([k, v]) => `${k}=${v}`)
		.join(' ');
	return `${bulk.name}${params ? ' ' + params : ''}`;
}

/** The pad as Markdown: each step's input in a code block, its results as a list, tables as Markdown tables. */
export function renderMarkdown(doc: PadDocument, meta: { owner?: string; exportedAt?: Date } = {}): string {
	const out: string[] = [`# ${inline(doc.title)}`, ''];
	const by = meta.owner ? ` by ${inline(meta.owner)}` : '';
	out.push(
		`Bulkpad pad${by}; bulk now ${code(bulkText(doc.bulk))}; ${doc.steps.length} steps${meta.exportedAt ? `; exported ${meta.exportedAt.toISOString()}` : ''}.`
	);
	for (const s of doc.steps) {
		out.push('', `## Step ${s.n}`, '', fenced(s.input, 'bulkpad'), '');
		if (s.status === 'ok') for (const r of s.results ?? []) out.push(...renderResult(r));
		else if (s.status === 'error') out.push(`- error: ${inline(s.error?.message ?? 'unknown error')}`);
		else out.push('- (not evaluated)');
	}
	return out.join('\n') + '\n';
}

export { bulkText };
