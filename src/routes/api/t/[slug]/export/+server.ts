import { api, failure } from '$lib/server/http';
import { ownerName } from '$lib/server/transcripts';
import { openShare } from '$lib/server/snapshots';
import { downloadResponse, exportFormatSchema, exportPad } from '$lib/server/export';

/** GET ?format=md|tex|json: a transcript is public, so its export (of the snapshot) is too (same 404 once revoked or expired). */
export const GET = api((event) => {
	const format = exportFormatSchema.safeParse(event.url.searchParams.get('format') ?? 'md');
	if (!format.success) failure(400, 'format must be md, tex or json');
	const { pad, snapshot } = openShare(event.params.slug!);
	return downloadResponse(exportPad(snapshot, format.data, { owner: ownerName(pad), exportedAt: new Date() }));
});
