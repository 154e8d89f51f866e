/**
 * The pad list's shape: pads grouped by the bulk they work in, bulks in the language's own order (vacuum,
 * brane, boosted, …, unknown names last), pads within a bulk by title. Nothing here orders by recency.
 */
import type { BulkState } from '$lib/lang/result';
import type { PadSummary } from './types';

/** The bulks in the order LANGUAGE.md lists them (kept here: the vocabulary module is not client-safe to import). */
const BULK_ORDER = ['vacuum', 'brane', 'boosted', 'charged', 'dp', 'wave', 'soliton', 'metric', 'vaidya'];

/** `d=4`, `zh=1`, `v=0.6`; a metric's formula strings are left out (too long for a chip). */
export function paramChips(b: BulkState | null | undefined): string[] {
	if (!b?.params) return [];
	return Object.entries(b.params)
		.filter(([, v]) => typeof v === 'number')
		.map(([k, v]) => `${k}=${v}`);
}

export interface PadGroup {
	bulk: string;
	pads: PadSummary[];
}

/** Matches a title word, the bulk's name or a chip (`d=4`); every word of the query must match. */
function matches(p: PadSummary, words: string[]): boolean {
	const hay = [p.title.toLowerCase(), p.bulk?.name ?? '', ...paramChips(p.bulk)];
	return words.every((w) => hay.some((h) => h.includes(w)));
}

export function groupPadsByBulk(pads: PadSummary[], query = ''): PadGroup[] {
	const words = query.trim().toLowerCase().split(/\s+/).filter(Boolean);
	const groups = new Map<string, PadSummary[]>();
	for (const p of pads) {
		if (words.length && !matches(p, words)) continue;
		const name = p.bulk?.name ?? 'unknown';
		groups.set(name, [...(groups.get(name) ?? []), p]);
	}
	const rank = (b: string) => (BULK_ORDER.includes(b) ? BULK_ORDER.indexOf(b) : BULK_ORDER.length);
	return [...groups.entries()]
		.sort(([a], [b]) => rank(a) - rank(b) || a.localeCompare(b))
		.map(([bulk, list]) => ({ bulk, pads: list.sort((x, y) => x.title.localeCompare(y.title) || x.id.localeCompare(y.id)) }));
}
