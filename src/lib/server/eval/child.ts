/**
 * Entry point of an evaluation process (bundled by scripts/build-worker.mjs and forked by pool.ts with its own
 * heap limit). A process, not a thread: a line that exhausts memory aborts this process alone, where a worker
 * thread's resourceLimits did not stop V8 from taking the whole server down. It runs one line at a time and
 * holds the datasets it was sent, by id, so a replay or a run of `compare` lines sends each one once.
 */
import type { PadContext } from '../../lang/result';
import type { DatasetRows, FromChild, ToChild } from './protocol';
import { evaluateTask } from './worker';
import type { EvalAnswer } from './worker';

const send = (m: FromChild) => process.send!(m);
const held = new Map<string, DatasetRows>();

/**
 * TEST-ONLY hooks, enabled solely by BULKPAD_TEST_HOOKS=1 (tests/helpers/server-setup.ts sets it for the
 * built test server; nothing else does): '#test-hook allocate' allocates until this process dies at its heap
 * limit, '#test-hook spin' busy-loops for two minutes. They let tests/api/abuse.test.ts prove that a dying evaluator costs
 * only its own line, now that the formula sandbox refuses every real line that could do this. Without the
 * variable the text is an ordinary line and the language refuses it.
 */
const TEST_HOOKS = process.env.BULKPAD_TEST_HOOKS === '1';
function testHook(input: string): EvalAnswer | undefined {
	if (!TEST_HOOKS || !input.startsWith('#test-hook ')) return undefined;
	const what = input.slice('#test-hook '.length).trim();
	if (what === 'allocate') {
		const hoard: number[][] = [];
		for (;;) hoard.push(new Array(1 << 20).fill(Math.random()));
	}
	// bounded, so an orphan (a server killed with SIGKILL cannot kill its evaluators) still ends by itself
	if (what === 'spin') for (const end = Date.now() + 120_000; Date.now() < end;);
	return undefined;
}

function run(m: Extract<ToChild, { type: 'run' }>) {
	for (const id of m.evict) held.delete(id);
	for (const d of m.load) held.set(d.id, { columns: JSON.parse(d.columns) as string[], rows: JSON.parse(d.rows) as number[][] });
	const datasets: Record<string, DatasetRows> = {};
	// an unnamed dataset appears only in "did you mean" hints, so it needs no rows here
	for (const name of m.otherDatasets) datasets[name] = { columns: [], rows: [] };
	for (const [name, id] of Object.entries(m.datasets)) {
		const d = held.get(id);
		if (d) datasets[name] = d;
	}
	// the time budget starts now, not while the line waited in the queue
	send({ type: 'started', id: m.id });
	let last = 0;
	const onProgress = (done: number, total: number) => {
		const now = Date.now();
		if (now - last < 100 && done < total) return;
		last = now;
		send({ type: 'progress', id: m.id, done, total });
	};
	const answer = testHook(m.input) ?? evaluateTask({ input: m.input, ctx: { ...m.ctx, datasets } }, onProgress);
	send({ type: 'answer', id: m.id, answer });
}

/**
 * JIT warm-up while the process is idle. A fresh process runs the engine's hot loops interpreted for its first
 * thousands of calls: a 2000-point exact strip sweep took 5–10× its warm time on its first run and 2–5× on the
 * next, and every evaluation process is fresh after a fork. These lines are small (≲ 25 strip solves, a few ms
 * cold) and stateless and run one per turn of the event loop after 'ready', so a real line that arrives meanwhile
 * waits for at most one of them, and its budget starts only when it starts. BULKPAD_EVAL_WARMUP=0 turns it off.
 */
const WARMUP: readonly string[] = [
	'darea l=0.5',
	'zstar l=0.5',
	'dentropy l=0.5 o=2',
	...Array.from({ length: 48 }, (_, i) => `sweep darea l=${0.05 + 0.002 * i}..1.2:25`),
	'sweep darea l=0.1..1:20 o=1,2,3',
	...Array.from({ length: 4 }, (_, i) => `sweep darea ball R=${0.2 + 0.05 * i}..1.5:4`)
];
function warmUp(i: number): void {
	if (i >= WARMUP.length) return;
	const ctx: PadContext = {
		bulk: { name: 'brane', params: { d: 4, zh: 1 } },
		units: { system: 'geo', G: 1 },
		refs: {},
		lets: {},
		macros: {}
	};
	evaluateTask({ input: WARMUP[i]!, ctx });
	setImmediate(() => warmUp(i + 1));
}

process.on('message', (m: ToChild) => {
	if (m?.type === 'run') run(m);
});
// the server going away closes the channel: nothing left to answer
process.on('disconnect', () => process.exit(0));
send({ type: 'ready' });
if (process.env.BULKPAD_EVAL_WARMUP !== '0') setImmediate(() => warmUp(0));
