// The API page reads the real OpenAPI document: every operation becomes an entry with its fields and a curl line.
import { describe, expect, it } from 'vitest';
import { buildOpenApiDocument, operations } from '../../../src/lib/server/openapi';
import { exampleOf, readApiDocument } from '../../../src/lib/components/apidoc/read';
import { createKeySchema } from '../../../src/lib/server/keys';
import { evalBodySchema } from '../../../src/lib/server/api-schemas';

type Json = Record<string, any>;
const doc = buildOpenApiDocument('https://bulkpad.example.org') as Json;
const entries = readApiDocument(doc);
const entry = (method: string, path: string) => entries.find((e) => e.method === method && e.path === path)!;

describe('the API page reader', () => {
	it('has one entry per documented operation', () => {
		expect(entries.length).toBe(operations.length);
	});

	it('lists the eval body fields with their limits and an example that the route accepts', () => {
		const e = entry('POST', '/api/eval');
		expect(e.auth).toBe('writer');
		expect(e.variants).toHaveLength(1);
		expect(e.variants[0].map((f) => [f.name, f.type, f.required])).toEqual([
			['input', 'string', true],
			['pad', 'string', false]
		]);
		expect(e.variants[0][0].limits).toBe('at most 100000 characters');
		expect(e.curl).toContain('"https://bulkpad.example.org/api/eval"');
		expect(e.curl).toContain('Authorization: Bearer $BULKPAD_KEY');
		const body = JSON.parse(/-d '(.*)'$/m.exec(e.curl)![1]);
		expect(evalBodySchema.safeParse(body).success).toBe(true);
		expect(body).toEqual({ input: 'darea l=0.3 o=2' });
	});

	it('writes an example body that its own route schema accepts, for every JSON body with one shape', () => {
		const key = entry('POST', '/api/keys');
		expect(
			createKeySchema.safeParse(exampleOf(doc, doc.paths['/api/keys'].post.requestBody.content['application/json'].schema)).success
		).toBe(true);
		expect(key.variants[0].find((f) => f.name === 'expiresAt')!.type).toBe('date | date-time');
		expect(key.variants[0].find((f) => f.name === 'perMinute')!.limits).toBe('1–6000');
		for (const op of operations.filter((o) => o.body)) {
			const schema =
				doc.paths[op.path.replace(/\[([^\]]+)\]/g, '{$1}')][op.method.toLowerCase()].requestBody.content['application/json'].schema;
			const example = exampleOf(doc, schema);
			if (op.path === '/api/pads/import' || op.path === '/api/macros') continue; // documents whose fields need real content
			expect(op.body!.safeParse(example).success, `${op.method} ${op.path}: ${JSON.stringify(example)}`).toBe(true);
		}
	});

	it('shows a body of several shapes as several tables, path parameters as shell variables, public routes without a key', () => {
		expect(entry('PATCH', '/api/macros/{id}').variants.length).toBeGreaterThan(1);
		expect(entry('GET', '/api/pads/{id}/steps/{n}').curl).toContain('/api/pads/$ID/steps/$N"');
		expect(entry('GET', '/api/t/{slug}').curl).not.toContain('Authorization');
		expect(entry('POST', '/api/datasets').curl).toContain('-F file=@');
		expect(entry('GET', '/api/macros').query).toEqual([expect.objectContaining({ name: 'state', required: false })]);
	});
});
