import { fail, redirect } from '@sveltejs/kit';
import type { Actions, PageServerLoad } from './$types';
import { orPageError } from '$lib/server/http';
import { deletePad, findOwnPad, findReadablePad, listPads, padSteps, renamePad } from '$lib/server/pads';
import { titleSchema } from '$lib/server/pad-view';
import type { AttemptData, StepData } from '$lib/client/types';
import { padAttempts, padStepVersions } from '$lib/server/steps';

/**
 * The layout redirects a visitor without a session, but SvelteKit runs this load beside the layout's (a
 * `__data.json` request too), so it checks for itself: a missing session never reaches the pad lookup, and an
 * existing pad and a missing one answer the same redirect (the layout's).
 */
export const load: PageServerLoad = async ({ locals, params, url }) => {
	const user = locals.user;
	if (!user) redirect(303, `/signin?next=${encodeURIComponent(url.pathname + url.search)}`);
	const pad = orPageError(() => findReadablePad(user, params.id));
	const versions = padStepVersions(pad.id);
	const steps: StepData[] = padSteps(pad.id).map((s) => ({
		id: s.id,
		n: s.n,
		input: s.input,
		status: s.status,
		results: s.results ?? [],
		error: (s.error as StepData['error']) ?? null,
		ms: s.ms,
		name: s.name,
		hidden: s.hiddenAt !== null,
		version: s.version,
		figureLabels: s.figureLabels ?? null,
		versions: (versions.get(s.id) ?? []).map((v) => ({
			version: v.version,
			input: v.input,
			status: v.status,
			results: v.results ?? [],
			error: (v.error as StepData['error']) ?? null
		}))
	}));
	const own = pad.ownerId === user.id && user.role !== 'reader';
	// failed lines are the owner's working notes: an invited reader never sees them
	const attempts: AttemptData[] = own
		? padAttempts(pad.id).map((a) => ({
				id: a.id,
				input: a.input,
				status: a.status,
				error: (a.error as StepData['error']) ?? null,
				afterN: a.afterN,
				forN: a.forN,
				dismissed: a.dismissedAt !== null
			}))
		: [];
	return {
		pad: {
			id: pad.id,
			title: pad.title,
			bulk: pad.bulk,
			units: pad.units,
			history: own ? (pad.history ?? []) : [],
			own,
			validityTol: pad.validityTol ?? null
		},
		steps,
		attempts
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
