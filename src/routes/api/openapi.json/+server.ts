import { json } from '@sveltejs/kit';
import { env } from '$lib/server/env';
import { buildOpenApiDocument } from '$lib/server/openapi/document';

let built: Record<string, unknown> | undefined;

/**
 * GET /api/openapi.json — the OpenAPI 3.1 description of every API route, built from the zod schemas the routes
 * validate with. Public and the same for everyone (it names no user's data), so caches may keep it a while.
 */
export function GET() {
	built ??= buildOpenApiDocument(env.origin);
	return json(built, { headers: { 'cache-control': 'public, max-age=300' } });
}
