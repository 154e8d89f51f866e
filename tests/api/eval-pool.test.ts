// The evaluation processes themselves (src/lib/server/eval/pool.ts) with the built bundle (dist/eval-worker.mjs):
// a process that runs out of memory, over its budget, or is cancelled answers for its own line only and is
// replaced, and the pool keeps answering. In the api project because it needs the build.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ProcessPool, WORKER_FILE, type PoolJob } from '../../src/lib/server/eval/pool';
import { createEvalQueue } from '../../src/lib/server/eval/queue';
import type { PadContext } from '../../src/lib/lang/result';

const ctx: PadContext = { bulk: { name: 'brane', params: { d: 4, zh: 1 } }, units: { system: 'geo', G: 1 }, refs: {}, lets: {} };
const job = (input: string, extra: Partial<PoolJob> = {}): PoolJob => ({
	input,
	ctx,
	datasets: [],
	otherDatasets: [],
	budgetMs: 60_000,
	...extra
});

let pool: ProcessPool;

async function until(cond: () => boolean) {
	// generous: a fresh process loads the whole engine, which can take seconds on a busy machine
	for (let i = 0; i < 1200 && !cond(); i++) await new Promise((r) => setTimeout(r, 50));
	expect(cond()).toBe(true);
}

async function runWhenFree(j: PoolJob) {
	await until(() => pool.take() !== undefined);
	return pool.run(pool.take()!, j);
}

beforeAll(async () => {
	process.env.BULKPAD_TEST_HOOKS = '1'; // the forked processes inherit it: enables '#test-hook …' (child.ts)
	// a small heap so the allocation dies at its limit quickly even on a loaded machine; the engine fits in it
	pool = new ProcessPool(2, { file: WORKER_FILE, memoryMb: 96, datasetCacheBytes: 1_000_000 });
	await until(() => pool.readyCount() === 2);
});
afterAll(() => pool.close());

describe('evaluation processes', () => {
	it('answers a line with the engine', async () => {
		const r = await runWhenFree(job('zstar l=0.5'));
		expect(r.answer.ok).toBe(true);
	});

	it('a line that exhausts memory kills only its process, which is replaced', async () => {
		const dying = runWhenFree(job('#test-hook allocate'));
		// the other process keeps answering meanwhile
		const other = await runWhenFree(job('zstar l=0.5'));
		expect(other.answer.ok).toBe(true);
		const r = await dying;
		expect(r.answer).toMatchObject({
			ok: false,
			error: { message: 'evaluation stopped: it ran out of memory (96 MB) or crashed', code: 'limit' }
		});
		await until(() => pool.readyCount() === 2);
		expect((await runWhenFree(job('zstar l=0.5'))).answer.ok).toBe(true);
	});

	it('stops a line at its own budget, counted from its start', async () => {
		const r = await runWhenFree(job('#test-hook spin', { budgetMs: 300 }));
		expect(r.answer).toMatchObject({ ok: false, error: { message: 'evaluation stopped: over the time budget of 0.3 s' } });
		expect(r.runMs).toBeGreaterThanOrEqual(300);
		await until(() => pool.readyCount() === 2);
	});

	it('cancels a running line when its signal aborts', async () => {
		const c = new AbortController();
		const spinning = runWhenFree(job('#test-hook spin', { signal: c.signal }));
		setTimeout(() => c.abort(), 200);
		expect((await spinning).answer).toMatchObject({ ok: false, error: { message: 'evaluation cancelled' } });
		await until(() => pool.readyCount() === 2);
	});

	it('behind the queue: a waiting line is refused as busy, naming how many lines are ahead, never as over budget', async () => {
		const q = createEvalQueue(pool, { budgetMs: 60_000, queueWaitMs: 300, pendingPerOwner: 10 });
		const spinners = [0, 1].map(() => q.enqueue(job('#test-hook spin'), `spinner`, 'light', { budgetMs: 3000 }));
		const waiting = await q.enqueue(job('zstar l=0.5'), 'someone', 'light');
		expect(waiting.answer).toMatchObject({
			ok: false,
			error: { code: 'busy', message: 'evaluation not started: queued behind 2 lines for 0 s; try again shortly' }
		});
		expect(waiting.runMs).toBe(0);
		for (const s of await Promise.all(spinners))
			expect(s.answer).toMatchObject({ ok: false, error: { message: 'evaluation stopped: over the time budget of 3.0 s' } });
	});
});
