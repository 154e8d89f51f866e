import { describe, expect, it } from 'vitest';
import { createLineSplitter, evaluateLine, readEvalStream } from '../../../src/lib/client/eval';

function streamOf(chunks: string[]): ReadableStream<Uint8Array> {
	const enc = new TextEncoder();
	return new ReadableStream({
		start(c) {
			for (const ch of chunks) c.enqueue(enc.encode(ch));
			c.close();
		}
	});
}

describe('NDJSON splitting', () => {
	it('joins a line split across chunks and splits several lines in one chunk', () => {
		const got: unknown[] = [];
		const s = createLineSplitter((o) => got.push(o));
		s.push('{"a":');
		s.push('1}\n{"b":2}\n{"c"');
		s.push(':3}');
		s.end();
		expect(got).toEqual([{ a: 1 }, { b: 2 }, { c: 3 }]);
	});
	it('skips blank lines', () => {
		const got: unknown[] = [];
		const s = createLineSplitter((o) => got.push(o));
		s.push('\n\n{"a":1}\n\n');
		s.end();
		expect(got).toEqual([{ a: 1 }]);
	});
});

describe('readEvalStream', () => {
	it('reports progress in order and returns the reply', async () => {
		const seen: number[] = [];
		const r = await readEvalStream(
			streamOf([
				'{"progress":{"done":1,"total":3}}\n{"progress":{"do',
				'ne":2,"total":3}}\n',
				'{"reply":{"status":200,"body":{"ok":true,"results":[]}}}\n'
			]),
			(p) => seen.push(p.done)
		);
		expect(seen).toEqual([1, 2]);
		expect(r).toEqual({ status: 200, body: { ok: true, results: [] } });
	});
	it('throws when the stream ends without a reply (a dropped connection)', async () => {
		await expect(readEvalStream(streamOf(['{"progress":{"done":1,"total":3}}\n']))).rejects.toThrow(/without an answer/);
	});
});

describe('evaluateLine', () => {
	it('asks for NDJSON and reads the stream', async () => {
		let sent: RequestInit | undefined;
		const fake = (async (_u: string, init: RequestInit) => {
			sent = init;
			return new Response(streamOf(['{"reply":{"status":400,"body":{"ok":false,"error":{"message":"x","start":0,"end":1}}}}\n']), {
				headers: { 'content-type': 'application/x-ndjson' }
			});
		}) as unknown as typeof fetch;
		const r = await evaluateLine('dara l=1', 'p1', { fetch: fake });
		expect((sent!.headers as Record<string, string>).accept).toBe('application/x-ndjson');
		expect(JSON.parse(sent!.body as string)).toEqual({ input: 'dara l=1', pad: 'p1' });
		expect(r.status).toBe(400);
		expect(r.body.error?.message).toBe('x');
	});
	it('reads a plain JSON answer (validation failure before the stream)', async () => {
		const fake = (async () => Response.json({ ok: false, error: { message: 'No such pad.' } }, { status: 404 })) as unknown as typeof fetch;
		const r = await evaluateLine('darea', 'nope', { fetch: fake });
		expect(r).toEqual({ status: 404, body: { ok: false, error: { message: 'No such pad.' } } });
	});
	it('passes the abort signal so cancelling closes the request', async () => {
		const ac = new AbortController();
		const fake = ((_u: string, init: RequestInit) =>
			new Promise((_r, reject) =>
				init.signal!.addEventListener('abort', () => reject(new DOMException('aborted', 'AbortError')))
			)) as unknown as typeof fetch;
		const p = evaluateLine('sweep darea l=0.1..1:500', undefined, { fetch: fake, signal: ac.signal });
		ac.abort();
		await expect(p).rejects.toThrow(/aborted/);
	});
});
