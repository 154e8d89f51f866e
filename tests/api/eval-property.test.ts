/**
 * Whatever is typed, POST /api/eval answers 200, 400 (a language error with a span inside the line) or 422 (a
 * limit) — never a 500, and the server keeps answering afterwards.
 */
import fc from 'fast-check';
import { beforeAll, describe, expect, it } from 'vitest';
import { freshMember, type Client } from '../helpers/client';

const VALID = [
	'use boosted d=4 zh=1 v=0.6',
	'darea l=0.4 o=1,2,3,exact',
	'tent l=0.4 o=3',
	'firstlaw l=0.4 o=3',
	'coeffs darea o=4 | tex',
	'mi pair l=1 gap=0.3',
	'use metric d=3 f="1 - (z/zh)^3" zh=1; area l=0.3',
	'let w = zstar l=0.2; w * 2',
	'units sym N=3; thermo'
];
const PIECES = [
	...'abdelorstuvz0123456789.,;:=|#@"()+-*/^ _',
	'..',
	'exact',
	'l=',
	'o=',
	'use ',
	'1e308',
	'-0',
	'__proto__',
	'constructor'
];

const mutated = fc
	.tuple(fc.constantFrom(...VALID), fc.array(fc.tuple(fc.nat(), fc.constantFrom(...PIECES), fc.boolean()), { minLength: 1, maxLength: 3 }))
	.map(([line, edits]) => {
		let s = line;
		for (const [at, piece, insert] of edits) {
			const i = at % (s.length + 1);
			s = insert ? s.slice(0, i) + piece + s.slice(i) : s.slice(0, i) + s.slice(i + 1);
		}
		return s;
	});

let client: Client;
let padId: string;
beforeAll(async () => {
	client = await freshMember('fuzz');
	padId = (await client.post('/api/pads', { title: 'fuzz' })).body.pad.id;
});

async function answersSanely(input: string, pad?: string) {
	const r = await client.post('/api/eval', pad ? { input, pad } : { input });
	expect([200, 400, 422], `${r.status} for ${JSON.stringify(input)}: ${JSON.stringify(r.body).slice(0, 300)}`).toContain(r.status);
	if (r.status === 200) expect(Array.isArray(r.body.results)).toBe(true);
	else {
		expect(r.body.ok).toBe(false);
		expect(r.body.error.start).toBeGreaterThanOrEqual(0);
		expect(r.body.error.start).toBeLessThanOrEqual(r.body.error.end);
		expect(r.body.error.end).toBeLessThanOrEqual(input.length);
	}
}

describe('POST /api/eval under random input (fast-check)', () => {
	it('answers mutated valid lines with 200, 400 or 422', async () => {
		await fc.assert(
			fc.asyncProperty(mutated, (s) => answersSanely(s)),
			{ numRuns: 60, seed: 20261202 }
		);
	});

	it('answers random strings, also inside a pad, with 200, 400 or 422', async () => {
		await fc.assert(
			fc.asyncProperty(fc.string({ maxLength: 60 }), (s) => answersSanely(s, padId)),
			{ numRuns: 40, seed: 7 }
		);
		expect((await client.get('/api/health')).status).toBe(200);
	});
});
