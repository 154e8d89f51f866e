// /api/openapi.json is public and describes the running server; the answer shapes it names fit real answers.
import { beforeAll, describe, expect, it } from 'vitest';
import { Client, freshMember } from '../helpers/client';
import { evalReplySchema, keyListSchema, keyMadeSchema, lineErrorSchema } from '../../src/lib/server/openapi/answers';

let member: Client;

beforeAll(async () => {
	member = await freshMember('openapi');
});

const fits = (schema: { safeParse(v: unknown): { success: boolean; error?: unknown } }, value: unknown) => {
	const r = schema.safeParse(value);
	expect(r.success, JSON.stringify(r.error)).toBe(true);
};

describe('GET /api/openapi.json', () => {
	it('answers anyone with a cacheable OpenAPI 3.1 document of this server', async () => {
		const r = await new Client().get('/api/openapi.json');
		expect(r.status).toBe(200);
		expect(r.headers.get('content-type')).toMatch(/application\/json/);
		expect(r.headers.get('cache-control')).toMatch(/public/);
		expect(r.body.openapi).toBe('3.1.0');
		expect(Object.keys(r.body.paths)).toEqual(
			expect.arrayContaining(['/api/eval', '/api/pads/{id}', '/api/t/{slug}/replay', '/api/openapi.json'])
		);
		expect(r.body.servers[0].url).toMatch(/^http/);
	});
});

describe('the answer shapes it describes', () => {
	it('fit real evaluation replies: every kind, and a language error', async () => {
		for (const input of [
			'darea l=0.3 o=2',
			'darea l=0.1..0.5:5 o=1,2,exact',
			'coeffs darea o=3',
			'firstlaw l=0.3 o=2',
			'thermo',
			'use vacuum d=3; zstar l=1'
		]) {
			const r = await member.post('/api/eval', { input });
			expect(r.status, `${input}: ${JSON.stringify(r.body)}`).toBe(200);
			fits(evalReplySchema, r.body);
		}
		const bad = await member.post('/api/eval', { input: 'darea l=' });
		expect(bad.status).toBe(400);
		fits(lineErrorSchema, bad.body);
	});

	it('fit the keys answers', async () => {
		const made = await member.post('/api/keys', { label: 'shape check', perMinute: 10 });
		expect(made.status).toBe(201);
		fits(keyMadeSchema, made.body);
		fits(keyListSchema, (await member.get('/api/keys')).body);
	});
});
