import type { PageServerLoad } from './$types';
import { env } from '$lib/server/env';
import { buildOpenApiDocument } from '$lib/server/openapi/document';

/** Public like /api/openapi.json: the page is that document, made readable. */
export const load: PageServerLoad = ({ locals }) => ({
	doc: buildOpenApiDocument(env.origin),
	origin: env.origin,
	signedIn: locals.user !== null
});
