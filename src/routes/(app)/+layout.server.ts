import { redirect } from '@sveltejs/kit';
import katex from 'katex';
import type { LayoutServerLoad } from './$types';
import { listPads } from '$lib/server/pads';
import { useKatex } from '$lib/client/tex';

// The server typesets formulas during rendering, so a pad's first paint shows them before the browser has
// loaded KaTeX (which it fetches lazily, see $lib/client/tex.ts).
useKatex(katex);

/** Every page of the console needs a signed-in user; the side panel lists their pads. */
export const load: LayoutServerLoad = ({ locals, url, depends }) => {
	depends('app:pads');
	const user = locals.user;
	if (!user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname + url.search)}`);
	const pads = listPads(user.id).map((p) => ({
		id: p.id,
		title: p.title,
		bulk: p.bulk as { name: string; params: Record<string, number | string> },
		updatedAt: p.updatedAt.getTime()
	}));
	return { user, pads };
};
