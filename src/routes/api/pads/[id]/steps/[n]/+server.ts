import { json } from '@sveltejs/kit';
import { api, failure, ok, readBody } from '$lib/server/http';
import { requireUser, requireWriter } from '$lib/server/auth/guards';
import { findOwnPad, findReadablePad } from '$lib/server/pads';
import { stepView, versionView } from '$lib/server/pad-view';
import { findStep, hideStep, nameStep, stepVersions } from '$lib/server/steps';
import { rerunInPad } from '$lib/server/eval/service';
import { setFigureLabels } from '$lib/server/figure-labels';
import { clientGone } from '$lib/server/eval/disconnect';
import { stepChangeSchema, stepRerunSchema } from '$lib/server/api-schemas';

function stepNumber(raw: string | undefined): number {
	const n = Number(raw);
	if (!Number.isSafeInteger(n) || n < 1) failure(404, 'No such step.');
	return n;
}

/** GET: the step as it is now and every earlier version, newest first (readers of the pad too). */
export const GET = api((event) => {
	const user = requireUser(event);
	const pad = findReadablePad(user, event.params.id!);
	const step = findStep(pad, stepNumber(event.params.n));
	return ok({ step: stepView(step), versions: stepVersions(step.id).map(versionView) });
});

/**
 * PATCH {hidden?, name?, figureLabels?}: hide or restore, name or unname (null), and keep the labels typed in
 * a figure's label editor ({ "<result index>": {xlabel?, ylabel?, legends?} | null }). Nothing is deleted.
 */
export const PATCH = api(async (event) => {
	const user = requireWriter(event);
	const pad = findOwnPad(user, event.params.id!);
	let step = findStep(pad, stepNumber(event.params.n));
	const body = await readBody(event, stepChangeSchema);
	if (body.hidden !== undefined) step = hideStep(pad, step, body.hidden);
	if (body.name !== undefined) step = nameStep(pad, step, body.name);
	if (body.figureLabels !== undefined) step = setFigureLabels(step, body.figureLabels);
	return ok({ step: stepView(step) });
});

/**
 * POST {input}: re-run the step with an edited line, as its next version (the answer of POST /api/eval, with
 * `step.version`). A line that fails leaves the step as it was and is kept as an attempt.
 */
export const POST = api(async (event) => {
	const user = requireWriter(event);
	const n = stepNumber(event.params.n);
	const { input } = await readBody(event, stepRerunSchema);
	const padOf = () => findOwnPad(user, event.params.id!);
	findStep(padOf(), n); // 404 before anything runs
	const gone = clientGone(event);
	try {
		const r = await rerunInPad(padOf, n, input, { signal: gone.signal });
		return json(r.body, { status: r.status, headers: r.headers });
	} finally {
		gone.done();
	}
});
