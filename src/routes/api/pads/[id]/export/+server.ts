import { api, failure } from '$lib/server/http';
import { requireUser } from '$lib/server/auth/guards';
import { findReadablePad, padSteps } from '$lib/server/pads';
import { ownerName } from '$lib/server/transcripts';
import { downloadResponse, exportFormatSchema, exportPad } from '$lib/server/export';

/** GET ?format=md|tex|json: the whole pad as a download, for its owner and the people invited to it. */
export const GET = api((event) => {
	const user = requireUser(event);
	const format = exportFormatSchema.safeParse(event.url.searchParams.get('format') ?? 'md');
	if (!format.success) failure(400, 'format must be md, tex or json');
	const pad = findReadablePad(user, event.params.id!);
	return downloadResponse(exportPad({ ...pad, steps: padSteps(pad.id) }, format.data, { owner: ownerName(pad), exportedAt: new Date() }));
});
