// The fast path (src/lib/server/eval/fast.ts) answers light stateless lines in the server process; the same
// line in a pad goes through the queue to an evaluation process. Both must answer the same results and errors.
import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, type Client } from '../helpers/client';

let c: Client;
let pad: string;
beforeAll(async () => {
	c = await signedIn('tomas@sable.test');
	pad = (await c.post('/api/pads', { title: 'fast path twin' })).body.pad.id;
});

const strip = (b: Record<string, unknown>) => ({ ok: b.ok, bulk: b.bulk, results: b.results, error: b.error });

describe('POST /api/eval fast path', () => {
	it('answers what the queued path answers, for lines that take it and lines that do not', async () => {
		const lines = [
			'darea l=0.5',
			'darea l=0.5 o=exact',
			'zstar l=0.3 zh=2',
			'area strip l=0.7 d=3',
			'entropy l=0.4 o=3',
			'dentropy l=1.1 zh=0.8',
			'width zstar=0.4',
			'darea l=-1',
			'darea l=0.5 nonsense=3',
			'darea l=0.5 o=9',
			'darea l=0.2..0.4:3',
			'thermo'
		];
		for (const input of lines) {
			const a = await c.post('/api/eval', { input });
			const b = await c.post('/api/eval', { input, pad });
			expect(a.status, input).toBe(b.status);
			expect(strip(a.body), input).toEqual(strip(b.body));
		}
	});

	it('streams the same reply line to a client that asks for ndjson (the console does, for lines in no pad too)', async () => {
		for (const input of ['darea l=0.5', 'darea l=-1', 'thermo']) {
			const plain = await c.post('/api/eval', { input });
			const r = await c.request('POST', '/api/eval', { input }, { accept: 'application/x-ndjson' });
			expect(r.headers.get('content-type'), input).toContain('application/x-ndjson');
			// one line of ndjson is also one JSON document, which the test client has parsed already
			const last = typeof r.body === 'string' ? JSON.parse(r.body.trim().split('\n').at(-1)!) : r.body;
			expect(last.reply.status, input).toBe(plain.status);
			expect(strip(last.reply.body), input).toEqual(strip(plain.body));
		}
	});
});
