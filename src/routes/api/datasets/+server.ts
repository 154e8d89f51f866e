import { api, failure, ok } from '$lib/server/http';
import { requireUser, requireWriter } from '$lib/server/auth/guards';
import { env } from '$lib/server/env';
import { listDatasets, uploadDataset } from '$lib/server/datasets';
import { formatBytes } from '$lib/library/format';
import { CSV_MAX_COLUMNS, CSV_MAX_ROWS } from '$lib/server/csv';

/** room for the multipart boundaries and the name field around the file itself */
const MULTIPART_OVERHEAD = 16_384;

/** GET /api/datasets — the caller's own datasets, without their rows, and the upload limits. */
export const GET = api((event) =>
	ok({ datasets: listDatasets(requireUser(event)), limits: { bytes: env.uploadMaxBytes, rows: CSV_MAX_ROWS, columns: CSV_MAX_COLUMNS } })
);

/** POST /api/datasets — multipart: `file` (a CSV), optional `name`. */
export const POST = api(async (event) => {
	const user = requireWriter(event);
	const tooBig = () => failure(413, `The upload is over the limit of ${formatBytes(env.uploadMaxBytes)}.`, { limit: env.uploadMaxBytes });
	// refuse before reading a byte when the client says up front that it is too big
	const declared = Number(event.request.headers.get('content-length') ?? NaN);
	if (Number.isFinite(declared) && declared > env.uploadMaxBytes + MULTIPART_OVERHEAD) tooBig();
	if (!(event.request.headers.get('content-type') ?? '').startsWith('multipart/form-data')) {
		failure(400, 'Upload the CSV as multipart/form-data with the field "file".');
	}
	let form: FormData;
	try {
		form = await event.request.formData();
	} catch (e) {
		// the HTTP server's own body limit (adapter-node's BODY_SIZE_LIMIT) surfaces here as a 413 from the stream;
		// it should sit above the dataset limit, and when it does not, say which limit was hit
		if ((e as { status?: number }).status === 413) {
			const serverLimit = Number(/(\d+)(?: bytes)?\.?$/.exec((e as Error).message)?.[1] ?? NaN);
			if (Number.isFinite(serverLimit) && serverLimit < env.uploadMaxBytes) {
				failure(
					413,
					`The upload is over the server's request limit of ${formatBytes(serverLimit)} (datasets may be up to ${formatBytes(env.uploadMaxBytes)}).`,
					{ limit: serverLimit }
				);
			}
			tooBig();
		}
		failure(400, 'The upload could not be read as multipart/form-data.');
	}
	const file = form.get('file');
	if (!(file instanceof File)) failure(400, 'Attach the CSV in the field "file".');
	const name = form.get('name');
	if (name !== null && typeof name !== 'string') failure(400, 'The field "name" must be text.');
	return ok({ dataset: await uploadDataset(user, file, name) }, { status: 201 });
});
