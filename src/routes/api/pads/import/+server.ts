import { api, failure, ok } from '$lib/server/http';
import { requireWriter } from '$lib/server/auth/guards';
import { importPad } from '$lib/server/export/import';
import { MAX_IMPORT_BYTES, parsePadDocument } from '$lib/server/export/schema';
import { padView } from '$lib/server/pad-view';

const tooBig = () => failure(413, `The file is over ${MAX_IMPORT_BYTES / 1_000_000} MB; Bulkpad imports pads up to that size.`);

/** The body's text, read no further than the limit (a declared length is checked before reading anything). */
async function readLimited(request: Request): Promise<Buffer> {
	const declared = Number(request.headers.get('content-length') ?? NaN);
	// multipart adds a little framing around the file
	if (declared > MAX_IMPORT_BYTES + 64_000) tooBig();
	const reader = request.body?.getReader();
	if (!reader) return Buffer.alloc(0);
	const chunks: Uint8Array[] = [];
	let size = 0;
	for (;;) {
		const { done, value } = await reader.read();
		if (done) break;
		size += value.byteLength;
		if (size > MAX_IMPORT_BYTES + 64_000) {
			await reader.cancel();
			tooBig();
		}
		chunks.push(value);
	}
	return Buffer.concat(chunks);
}

/** The JSON text of the upload: the body itself, or the `file` field of a multipart form. */
async function uploadedText(request: Request): Promise<string> {
	const type = request.headers.get('content-type') ?? '';
	const raw = await readLimited(request);
	if (!type.startsWith('multipart/form-data')) return raw.toString('utf8');
	const form = await new Response(new Uint8Array(raw), { headers: { 'content-type': type } })
		.formData()
		.catch(() => failure(400, 'The form could not be read.'));
	const file = form.get('file');
	if (!(file instanceof File)) failure(400, 'Attach the pad as the form field "file".');
	if (file.size > MAX_IMPORT_BYTES) tooBig();
	return file.text();
}

/** POST: a `bulkpad-pad` JSON document (body or multipart `file`), validated, becomes a new pad of the caller's. */
export const POST = api(async (event) => {
	const user = requireWriter(event);
	const text = await uploadedText(event.request);
	if (Buffer.byteLength(text) > MAX_IMPORT_BYTES) tooBig();
	let raw: unknown;
	try {
		raw = JSON.parse(text);
	} catch (e) {
		failure(400, `The file is not JSON: ${e instanceof Error ? e.message : 'parse error'}`);
	}
	const parsed = parsePadDocument(raw);
	if (!parsed.ok) failure(400, parsed.message);
	const pad = importPad(user, parsed.doc);
	return ok({ pad: padView(pad, user.name), steps: parsed.doc.steps.length }, { status: 201 });
});
