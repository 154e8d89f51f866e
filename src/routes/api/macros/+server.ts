import { api, failure, ok, readBody } from '$lib/server/http';
import { requireUser, requireWriter } from '$lib/server/auth/guards';
import { listMacros, proposeMacro, proposeSchema, stateQuery } from '$lib/server/macros';

/** GET /api/macros[?state=approved|proposed|retired] — the library as the caller may see it. */
export const GET = api((event) => {
	const user = requireUser(event);
	const state = stateQuery.safeParse(event.url.searchParams.get('state') ?? undefined);
	if (!state.success) failure(400, 'state must be approved, proposed or retired.');
	return ok({ macros: listMacros(user, state.data) });
});

/** POST /api/macros — propose a macro; it joins the library once an admin approves it. */
export const POST = api(async (event) => {
	const user = requireWriter(event);
	const input = await readBody(event, proposeSchema);
	return ok({ macro: proposeMacro(user, input) }, { status: 201 });
});
