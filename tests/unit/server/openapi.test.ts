// The OpenAPI document must describe every API route: a +server.ts method under src/routes/api without an
// entry in src/lib/server/openapi/routes.ts fails here, and so does an entry whose route is gone. The
// document's shape is checked against the OpenAPI 3.1 rules a script's generator relies on.
import { readdirSync, readFileSync } from 'node:fs';
import { join, relative } from 'node:path';
import { Validator } from '@seriousme/openapi-schema-validator';
import { describe, expect, it } from 'vitest';
import { buildOpenApiDocument, openApiPath, operations } from '../../../src/lib/server/openapi';
import { evalBodySchema } from '../../../src/lib/server/api-schemas';

type Json = Record<string, any>;

/** `METHOD /api/…` for every exported method of every +server.ts under src/routes/api (route groups dropped). */
function discoverApiRoutes(root = 'src/routes'): string[] {
	const found: string[] = [];
	const walk = (dir: string) => {
		for (const e of readdirSync(dir, { withFileTypes: true })) {
			if (e.isDirectory()) walk(join(dir, e.name));
			else if (e.name === '+server.ts' || e.name === '+server.js') {
				const route =
					'/' +
					relative(root, dir)
						.split('/')
						.filter((s) => s && !/^\(.*\)$/.test(s))
						.join('/');
				const src = readFileSync(join(dir, e.name), 'utf8');
				for (const m of src.matchAll(/export\s+(?:const|(?:async\s+)?function)\s+(GET|POST|PUT|PATCH|DELETE)\b/g))
					found.push(`${m[1]} ${route}`);
			}
		}
	};
	walk(join(root, 'api'));
	return found.sort();
}

const doc = buildOpenApiDocument('http://127.0.0.1:3000') as Json;
const METHODS = ['get', 'put', 'post', 'delete', 'options', 'head', 'patch', 'trace'];

describe('the route list', () => {
	it('finds the API routes it walks (the walk itself works)', () => {
		const routes = discoverApiRoutes();
		expect(routes).toContain('POST /api/eval');
		expect(routes).toContain('DELETE /api/keys/[id]');
		expect(routes.length).toBeGreaterThan(30);
	});

	it('documents every route and method, and nothing that is not there', () => {
		const listed = operations.map((o) => `${o.method} ${o.path}`).sort();
		const routes = discoverApiRoutes();
		expect(
			routes.filter((r) => !listed.includes(r)),
			'routes missing from src/lib/server/openapi/routes.ts'
		).toEqual([]);
		expect(
			listed.filter((r) => !routes.includes(r)),
			'documented routes that do not exist'
		).toEqual([]);
		expect(new Set(listed).size).toBe(listed.length);
	});

	it('puts every documented route in the document, under OpenAPI path syntax', () => {
		for (const op of operations) {
			const { path, params } = openApiPath(op.path);
			expect(path).not.toMatch(/[[\]]/);
			const entry = doc.paths[path]?.[op.method.toLowerCase()];
			expect(entry, `${op.method} ${path}`).toBeDefined();
			const declared = (entry.parameters ?? []).filter((p: Json) => p.in === 'path').map((p: Json) => p.name);
			expect(declared).toEqual(params);
		}
	});
});

describe('the document', () => {
	it('is OpenAPI 3.1.0 with info and paths', () => {
		expect(doc.openapi).toBe('3.1.0');
		expect(typeof doc.info.title).toBe('string');
		expect(typeof doc.info.version).toBe('string');
		expect(doc.servers).toEqual([{ url: 'http://127.0.0.1:3000' }]);
		expect(Object.keys(doc.paths).every((p) => p.startsWith('/api/'))).toBe(true);
	});

	it('passes the OpenAPI 3.1 schema validator', async () => {
		const validator = new Validator();
		const verdict = await validator.validate(structuredClone(doc));
		expect(validator.version).toBe('3.1');
		expect(verdict.errors ?? [], JSON.stringify(verdict.errors, null, 1)).toEqual([]);
		expect(verdict.valid).toBe(true);
		// and it is no rubber stamp: a path parameter that does not say where it is fails it
		const broken = structuredClone(doc);
		delete broken.paths['/api/pads/{id}'].get.parameters[0].in;
		expect((await new Validator().validate(broken)).valid).toBe(false);
	});

	it('gives every operation responses with a success, a summary and a unique operationId', () => {
		const ids = new Set<string>();
		for (const [path, item] of Object.entries(doc.paths as Json)) {
			for (const [method, op] of Object.entries(item as Json)) {
				expect(METHODS, `${method} ${path}`).toContain(method);
				expect(Object.keys(op.responses).length, `${method} ${path}`).toBeGreaterThan(0);
				expect(
					Object.keys(op.responses).some((s) => /^2\d\d$/.test(s)),
					`${method} ${path} has a success`
				).toBe(true);
				for (const [status, r] of Object.entries(op.responses as Json)) {
					expect(status).toMatch(/^[1-5]\d\d$/);
					expect(typeof r.description).toBe('string');
				}
				expect(op.summary.length).toBeGreaterThan(5);
				expect(ids.has(op.operationId)).toBe(false);
				ids.add(op.operationId);
			}
		}
	});

	it('resolves every $ref and every security scheme it names', () => {
		const text = JSON.stringify(doc);
		const refs = [...text.matchAll(/"\$ref":"([^"]+)"/g)].map((m) => m[1]);
		expect(refs.length).toBeGreaterThan(10);
		for (const ref of refs) {
			expect(ref.startsWith('#/components/schemas/'), ref).toBe(true);
			expect(doc.components.schemas[ref.slice('#/components/schemas/'.length)], ref).toBeDefined();
		}
		expect(text).not.toContain('$defs');
		for (const item of Object.values(doc.paths as Json))
			for (const op of Object.values(item as Json))
				for (const req of op.security ?? [])
					for (const name of Object.keys(req)) expect(doc.components.securitySchemes[name]).toBeDefined();
	});

	it('describes the eval body with the very schema the route validates', () => {
		const body = doc.paths['/api/eval'].post.requestBody.content['application/json'].schema;
		expect(body.required).toEqual(['input']);
		expect(Object.keys(body.properties).sort()).toEqual(Object.keys(evalBodySchema.shape).sort());
		expect(body.properties.input.maxLength).toBe(100_000);
		expect(doc.paths['/api/eval'].post.responses['400'].content['application/json'].schema.$ref).toBe('#/components/schemas/LineError');
		expect(doc.paths['/api/eval'].post.responses['200'].content['application/x-ndjson']).toBeDefined();
	});

	it('describes every Result kind of API.md', () => {
		const kinds = doc.components.schemas.Result.oneOf.map((s: Json) => s.properties.kind.const).sort();
		expect(kinds).toEqual(expect.arrayContaining(['check', 'note', 'record', 'scalar', 'series', 'table']));
	});

	it('documents the key limits a key is made with', () => {
		const body = doc.paths['/api/keys'].post.requestBody.content['application/json'].schema;
		expect(body.required).toEqual(['label']);
		expect(body.properties.perMinute).toMatchObject({ type: 'integer', minimum: 1 });
		expect(body.properties.expiresAt.anyOf.map((s: Json) => s.format).sort()).toEqual(['date', 'date-time']);
	});

	it('marks public routes without security and names the path parameters', () => {
		expect(doc.paths['/api/t/{slug}'].get.security).toEqual([]);
		expect(doc.paths['/api/pads/{id}/steps/{n}'].get.parameters.map((p: Json) => p.name)).toEqual(['id', 'n']);
		expect(doc.paths['/api/macros'].get.parameters).toEqual([expect.objectContaining({ name: 'state', in: 'query', required: false })]);
	});
});
