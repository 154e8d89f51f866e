import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { orPageError } from '$lib/server/http';
import { deletePad, findOwnPad, findReadablePad, listPads, padSteps, renamePad } from '$lib/server/pads';
import { titleSchema } from '$lib/server/pad-view';
import type { BulkState, Result, UnitsState } from '$lib/lang/result';
import type { StepData } from '$lib/client/types';

/**
 * The layout redirects a visitor without a session, but SvelteKit runs this load beside the layout's (a
 * `__data.json` request too), so it checks for itself: a missing session never reaches the pad lookup, and an
 * existing pad and a missing one answer the same redirect (the layout's).
 */
export const load: PageServerLoad = async ({ locals, params, url }) => {
	const user = locals.user;
	if (!user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname + url.search)}`);
	const pad = orPageError(() => findReadablePad(user, params.id));
	const steps: StepData[] = padSteps(pad.id).map((s) => ({
		id: s.id,
		n: s.n,
		input: s.input,
		status: s.status,
		results: (s.results as Result[] | null) ?? [],
		error: (s.error as StepData['error']) ?? null,
		ms: s.ms
	}));
	const own = pad.ownerId === user.id && user.role !== 'reader';
	return {
		pad: {
			id: pad.id,
			title: pad.title,
			bulk: pad.bulk as BulkState,
			units: pad.units as UnitsState,
			history: own ? ((pad.history as string[]) ?? []) : [],
			own
		},
		steps
	};
};

export const actions: Actions = {
	rename: async ({ locals, params, request }) => {
		const user = locals.user;
		if (!user || user.role === 'reader') return fail(403, { message: 'Only the pad’s owner may rename it.' });
		// the same rule as PATCH /api/pads/[id], with its message
		const parsed = titleSchema.safeParse(String((await request.formData()).get('title') ?? ''));
		if (!parsed.success) return fail(400, { message: parsed.error.issues[0].message });
		const title = parsed.data;
		renamePad(
			orPageError(() => findOwnPad(user, params.id)),
			title
		);
		return { renamed: title };
	},
	delete: async ({ locals, params }) => {
		const user = locals.user;
		if (!user || user.role === 'reader') return fail(403, { message: 'Only the pad’s owner may delete it.' });
		deletePad(orPageError(() => findOwnPad(user, params.id)));
		const next = listPads(user.id)[0];
		redirect(303, next ? `/pads/${next.id}` : '/');
	}
};
