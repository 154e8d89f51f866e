/**
 * Cross-site request forgery: a page on another origin (another port of the same host counts, and shares the
 * SameSite cookie) can send a POST with no body, or with a form or text/plain body, without asking first.
 * It cannot send `content-type: application/json` without a CORS preflight, which Bulkpad never answers.
 * So a state-changing request is served only when it declares JSON, or is a form posted from Bulkpad's own
 * origin (SvelteKit checks that too in a build; checking it here keeps `vite dev` the same).
 */
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
const FORM_TYPES = ['application/x-www-form-urlencoded', 'multipart/form-data', 'text/plain'];

export type WriteVerdict = { ok: true } | { ok: false; status: 403 | 415; message: string };

function mediaType(contentType: string | null): string {
	return (contentType ?? '').split(';')[0].trim().toLowerCase();
}

export function judgeWrite(request: Request, url: URL): WriteVerdict {
	if (SAFE_METHODS.has(request.method)) return { ok: true };
	// a browser never attaches an Authorization header by itself, and another site cannot add one without a
	// preflight Bulkpad never answers: a request carrying a key is the script's own (multipart uploads, bare DELETEs)
	if (request.headers.get('authorization')?.startsWith('Bearer ')) return { ok: true };
	const type = mediaType(request.headers.get('content-type'));
	if (type === 'application/json') return { ok: true };
	if (FORM_TYPES.includes(type)) {
		if (request.headers.get('origin') === url.origin) return { ok: true };
		return { ok: false, status: 403, message: 'Cross-site form posts are refused.' };
	}
	return {
		ok: false,
		status: 415,
		message: `A ${request.method} must send content-type: application/json (an empty JSON object is fine) or be a form posted from this site.`
	};
}
