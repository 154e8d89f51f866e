/**
 * Builds the OpenAPI 3.1 document from the operation list (./routes.ts). Request schemas are converted by zod
 * itself (z.toJSONSchema, JSON Schema 2020-12, which OpenAPI 3.1 speaks natively), in their *input* form: what a
 * script sends, before trims and defaults. Shared answer shapes (Result, Error…) become components.
 */
import { z, type ZodType } from 'zod';
import { errorSchema, lineErrorSchema, okSchema } from './answers';
import { operations, type Auth, type Operation } from './routes';

type Json = Record<string, unknown>;

export const AUTH_WORDS: Record<Auth, string> = {
	public: 'anyone, no key needed',
	'signed-in': 'any signed-in role (readers too), by session or key',
	writer: 'members and admins, by session or key',
	admin: 'admins only'
};

/** `/api/pads/[id]` → `/api/pads/{id}` and its path parameter names. */
export function openApiPath(path: string): { path: string; params: string[] } {
	const params: string[] = [];
	const out = path.replace(/\[([^\]]+)\]/g, (_, name: string) => {
		params.push(name);
		return `{${name}}`;
	});
	return { path: out, params };
}

/**
 * A schema as JSON Schema; shapes zod cannot express (transforms) are left open rather than failing the whole
 * document. Registered components (`.meta({ id })`) become `$ref`s to #/components/schemas.
 */
function jsonSchemaOf(schema: ZodType, io: 'input' | 'output'): Json {
	const out = z.toJSONSchema(schema, {
		io,
		unrepresentable: 'any',
		target: 'draft-2020-12',
		override: (ctx) => {
			// dates are carried as ISO strings in JSON
			if ((ctx.zodSchema as { _zod?: { def?: { type?: string } } })._zod?.def?.type === 'date') {
				ctx.jsonSchema.type = 'string';
				ctx.jsonSchema.format = 'date-time';
			}
		}
	}) as Json;
	delete out.$schema;
	return out;
}

/**
 * Moves the `$defs` of each converted schema (the ones registered with `.meta({ id })`) into the shared
 * components and points their `$ref`s there, so they resolve document-wide.
 */
function hoist(schema: Json, components: Json): Json {
	const moved = JSON.parse(JSON.stringify(schema).replaceAll('"#/$defs/', '"#/components/schemas/')) as Json;
	const defs = moved.$defs as Json | undefined;
	if (defs) {
		for (const [id, def] of Object.entries(defs)) components[id] = def;
		delete moved.$defs;
	}
	return moved;
}

function errorResponses(op: Operation, ref: (s: ZodType) => Json): Json {
	const error = (description: string, schema: ZodType = errorSchema) => ({
		description,
		content: { 'application/json': { schema: ref(schema) } }
	});
	const out: Json = {};
	if (op.body || op.query || op.multipart)
		out['400'] = error(op.lineError ? 'a language error in the line, or a body that does not fit' : 'a body that does not fit');
	if (op.lineError) out['400'] = error('a language error: the message, the span [start, end) of the line, and a hint', lineErrorSchema);
	if (op.auth !== 'public') out['401'] = error('no session or key, or an expired key');
	if (op.auth === 'writer' || op.auth === 'admin') out['403'] = error(op.auth === 'admin' ? 'not an admin' : 'readers may not do this');
	if (op.path.includes('[')) out['404'] = error('no such thing, or not yours');
	out['429'] = error('over a rate limit (a key over its requests a minute, or the route’s own limit); see Retry-After');
	for (const [status, description] of Object.entries(op.errors ?? {})) out[status] = error(description);
	return out;
}

/** The whole document; `origin` becomes the server URL when known. */
export function buildOpenApiDocument(origin?: string): Json {
	const components: Json = {};
	const ref = (schema: ZodType, io: 'input' | 'output' = 'output') => hoist(jsonSchemaOf(schema, io), components);
	const paths: Record<string, Json> = {};

	for (const op of operations) {
		const { path, params } = openApiPath(op.path);
		const parameters: Json[] = params.map((name) => ({ name, in: 'path', required: true, schema: { type: 'string' } }));
		for (const [name, schema] of Object.entries(op.query ?? {})) {
			parameters.push({ name, in: 'query', required: !schema.safeParse(undefined).success, schema: ref(schema, 'input') });
		}
		const success: Json = { description: op.download ? 'the file' : 'done' };
		if (op.download) success.content = Object.fromEntries(op.download.map((t) => [t, { schema: { type: 'string' } }]));
		else {
			const content: Json = { 'application/json': { schema: ref(op.answer ?? okSchema) } };
			for (const [type, line] of Object.entries(op.stream ?? {})) {
				content[type] = { schema: ref(line) };
				success.description = `done; as ${type}, one JSON object per line`;
			}
			success.content = content;
		}
		const operation: Json = {
			operationId: `${op.method.toLowerCase()}${path.replace(/[^A-Za-z0-9]+(.)?/g, (_, c: string | undefined) => (c ? c.toUpperCase() : ''))}`,
			summary: op.summary,
			'x-bulkpad-auth': op.auth,
			description: `Who may call: ${AUTH_WORDS[op.auth]}.`,
			security: op.auth === 'public' ? [] : [{ bearerKey: [] }, { sessionCookie: [] }],
			...(parameters.length ? { parameters } : {}),
			responses: { [String(op.status ?? 200)]: success, ...errorResponses(op, ref) }
		};
		if (op.body) {
			operation.requestBody = { required: true, content: { 'application/json': { schema: ref(op.body, 'input') } } };
		} else if (op.multipart) {
			const properties = Object.fromEntries(Object.entries(op.multipart).map(([k, d]) => [k, { type: 'string', description: d }]));
			operation.requestBody = {
				required: true,
				content: { 'multipart/form-data': { schema: { type: 'object', properties, required: ['file'] } } }
			};
		}
		(paths[path] ??= {})[op.method.toLowerCase()] = operation;
	}

	return {
		openapi: '3.1.0',
		info: {
			title: 'Bulkpad API',
			version: '1',
			description:
				'JSON in, JSON out. Send a personal key (made on the Keys page) as `Authorization: Bearer <key>`; each key has its own requests-a-minute budget and may expire. Failures answer `{ ok:false, error:{ message, … } }`.'
		},
		...(origin ? { servers: [{ url: origin }] } : {}),
		paths,
		components: {
			securitySchemes: {
				bearerKey: { type: 'http', scheme: 'bearer', description: 'a personal key, `bpk_…`' },
				sessionCookie: { type: 'apiKey', in: 'cookie', name: 'auth_session' }
			},
			schemas: components
		}
	};
}
