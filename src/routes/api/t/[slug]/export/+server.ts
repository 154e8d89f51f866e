import { api, failure } from '$lib/server/http';
import { findSharedPad, ownerName } from '$lib/server/transcripts';
import { padSteps } from '$lib/server/pads';
import { downloadResponse, exportFormatSchema, exportPad } from '$lib/server/export';

/** GET ?format=md|tex|json: a transcript is public, so its export is too (same 404 once revoked or expired). */
export const GET = api((event) => {
	const format = exportFormatSchema.safeParse(event.url.searchParams.get('format') ?? 'md');
	if (!format.success) failure(400, 'format must be md, tex or json');
	const pad = findSharedPad(event.params.slug!);
	return downloadResponse(exportPad({ ...pad, steps: padSteps(pad.id) }, format.data, { owner: ownerName(pad), exportedAt: new Date() }));
});
