// The queue's policy (src/lib/server/eval/queue.ts) against a fake pool whose lines finish when the test says
// so: order and concurrency only, no clocks.
import { describe, expect, it } from 'vitest';
import { createEvalQueue, type Runner } from '../../../src/lib/server/eval/queue';
import type { PoolAnswer, PoolJob, Slot } from '../../../src/lib/server/eval/pool';
import type { PadContext } from '../../../src/lib/lang/result';
import { isHeavyLine, reachableWords } from '../../../src/lib/server/eval/plan';

const ctx: PadContext = { bulk: { name: 'brane', params: { d: 4, zh: 1 } }, units: { system: 'geo', G: 1 }, refs: {}, lets: {} };
const job = (input: string) => ({ input, ctx, datasets: [], otherDatasets: [] });

/** A pool of `size` slots; `started` lists inputs in the order they began, `finish(input)` ends one. */
function fakePool(size: number) {
	const free = Array.from({ length: size }, (_, i) => ({ index: i }) as Slot);
	const running = new Map<string, { slot: Slot; done: (a: PoolAnswer) => void }>();
	const started: string[] = [];
	let idle = () => {};
	const runner: Runner = {
		size,
		take: () => free[0], // which kind of process does not matter here: the heavy cap is the queue's own
		run(slot: Slot, j: PoolJob) {
			free.splice(free.indexOf(slot), 1);
			started.push(j.input);
			return new Promise((done) => running.set(j.input, { slot, done }));
		},
		onIdle: (cb) => (idle = cb)
	};
	const finish = async (input: string) => {
		const r = running.get(input)!;
		running.delete(input);
		free.push(r.slot);
		r.done({ answer: { ok: false, error: { message: 'done', start: 0, end: 0, code: 'limit' } }, runMs: 1 });
		idle();
		await new Promise((r) => setTimeout(r, 0)); // let the queue's .then/.finally run
	};
	return { runner, started, finish, running: () => [...running.keys()] };
}

const settings = { budgetMs: 5000, queueWaitMs: 60_000, pendingPerOwner: 3 };

describe('the evaluation queue', () => {
	it('runs one heavy line per owner at a time and keeps a process free for light lines', async () => {
		const p = fakePool(3);
		const q = createEvalQueue(p.runner, settings);
		q.enqueue(job('a-heavy-1'), 'a', 'heavy');
		q.enqueue(job('a-heavy-2'), 'a', 'heavy');
		q.enqueue(job('b-heavy-1'), 'b', 'heavy');
		q.enqueue(job('c-heavy-1'), 'c', 'heavy');
		// heavy lines take at most size − 1 = 2 processes, one per owner
		expect(p.running()).toEqual(['a-heavy-1', 'b-heavy-1']);
		q.enqueue(job('d-light'), 'd', 'light');
		expect(p.running()).toContain('d-light');
		await p.finish('a-heavy-1');
		// a's second heavy line waits behind c's first: both have nothing running, but a just had its turn
		expect(p.running()).toEqual(['b-heavy-1', 'd-light', 'c-heavy-1']);
		await p.finish('c-heavy-1');
		expect(p.running()).toContain('a-heavy-2');
	});

	it('serves light lines before heavy ones and replays last, owners in turn', async () => {
		const p = fakePool(1);
		const q = createEvalQueue(p.runner, settings);
		q.enqueue(job('first'), 'x', 'light');
		q.enqueue(job('replay'), 'anon', 'replay');
		q.enqueue(job('heavy'), 'h', 'heavy');
		q.enqueue(job('x-light-2'), 'x', 'light');
		q.enqueue(job('y-light'), 'y', 'light');
		while (p.running().length) await p.finish(p.running()[0]!);
		// x just had a line, so y goes before x's second (round robin), then heavy, then the replay
		expect(p.started).toEqual(['first', 'y-light', 'x-light-2', 'heavy', 'replay']);
	});

	it("never lets one owner's flood of light lines starve another owner's heavy line", async () => {
		const p = fakePool(2);
		const q = createEvalQueue(p.runner, { ...settings, pendingPerOwner: 100 });
		for (let i = 0; i < 20; i++) q.enqueue(job(`a-light-${i}`), 'a', 'light');
		q.enqueue(job('b-heavy'), 'b', 'heavy');
		expect(p.running()).toEqual(['a-light-0', 'a-light-1']);
		await p.finish('a-light-0');
		// a still has a line running, b has none: b's heavy line takes the free process
		expect(p.running()).toEqual(['a-light-1', 'b-heavy']);
	});

	it("takes heavy lines and replays in turn by owner, so one member's stream of heavy lines cannot starve a replay", async () => {
		const p = fakePool(2);
		const q = createEvalQueue(p.runner, settings);
		q.enqueue(job('h-1'), 'h', 'heavy');
		q.enqueue(job('h-2'), 'h', 'heavy');
		q.enqueue(job('replay-1'), 'anon', 'replay');
		q.enqueue(job('h-3'), 'h', 'heavy');
		expect(p.running()).toEqual(['h-1']); // heavy lines leave one process to light ones
		await p.finish('h-1');
		expect(p.running()).toEqual(['replay-1']);
		await p.finish('replay-1');
		expect(p.running()).toEqual(['h-2']);
	});

	it("runs a replay's light step beside a heavy line instead of waiting for the heavy process", async () => {
		const p = fakePool(2);
		const q = createEvalQueue(p.runner, settings);
		q.enqueue(job('h-1'), 'h', 'heavy');
		q.enqueue(job('replay-light-step'), 'anon', 'replay', { weight: 'light' });
		expect(p.running()).toEqual(['h-1', 'replay-light-step']);
	});

	it('answers 429 (throttled) past the pending lines per owner, and cancels a waiting line without running it', async () => {
		const p = fakePool(1);
		const q = createEvalQueue(p.runner, settings);
		q.enqueue(job('busy'), 'a', 'light');
		const c = new AbortController();
		const waiting = [
			q.enqueue(job('w1'), 'a', 'light', { signal: c.signal }),
			q.enqueue(job('w2'), 'a', 'light'),
			q.enqueue(job('w3'), 'a', 'light')
		];
		const fourth = await q.enqueue(job('w4'), 'a', 'light');
		expect(fourth.answer).toMatchObject({
			ok: false,
			error: { code: 'throttled', message: 'you have 3 lines waiting already; wait for them to finish' }
		});
		// someone else is not affected by a's backlog
		const other = q.enqueue(job('b1'), 'b', 'light');
		c.abort();
		expect((await waiting[0]).answer).toMatchObject({ ok: false, error: { message: 'evaluation cancelled' } });
		await p.finish('busy');
		// a's backlog does not hold b up: a just had a line, so b's goes next, then a's, in a's order
		expect(p.started).toEqual(['busy', 'b1']);
		await p.finish('b1');
		await other;
		expect(p.started).toEqual(['busy', 'b1', 'w2']);
		expect(q.stats()).toEqual({ waiting: 1, running: 1 });
	});
});

describe('planning a line', () => {
	it.each([
		['zstar l=0.5', 'brane', false],
		['darea l=0.1,0.2,0.3 o=1,2', 'brane', false],
		['sweep darea l=0.1..1:20', 'brane', true],
		['darea ball R=0.5', 'brane', true],
		['darea l=0.1..1:40', 'brane', true],
		['coeffs darea o=10', 'brane', true],
		['use metric d=4 f="1-z^4"', 'brane', true],
		['darea l=0.5', 'metric', true],
		['use brane d=4; darea l=0.5', 'metric', false],
		['@table l=1', 'brane', true],
		['compare lattice darea', 'brane', true],
		['dara l=0.5', 'brane', false]
	] as const)('%s in %s: heavy = %s', (input, bulk, heavy) => {
		expect(isHeavyLine(input, bulk)).toBe(heavy);
	});

	it('reaches the words of the macros a line calls, and of theirs, but not of others', () => {
		const macros = {
			outer: { params: { ds: 'lattice_d4' }, body: ['@inner', 'compare {ds} darea'] },
			inner: { params: {}, body: ['compare inner_data darea'] },
			unused: { params: {}, body: ['compare secret darea'] }
		};
		const words = reachableWords('@outer l=1', macros);
		expect([...words]).toEqual(expect.arrayContaining(['outer', 'lattice_d4', 'compare', 'inner_data']));
		expect(words.has('secret')).toBe(false);
	});
});
