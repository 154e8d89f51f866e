// A hostile member and hostile anonymous clients against the real built server: each attack from the isolation
// issue, and after each one the server still answers, other users' light lines still get their right numbers,
// and nothing one user sent changed what the next user computes.
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, freshMember, signedIn } from '../helpers/client';
import { padWithSteps, sql } from './support/pads';

/** f = 1 − z⁴ in d = 4 is the planar brane, so a metric line must give the brane's ΔA (same engine, same l). */
const CLEAN_METRIC = 'use metric d=4 f="1-z^4" zh=1; darea l=0.5 o=exact';
const BRANE = 'darea l=0.5 d=4 zh=1 o=exact';
/** The test server's budgets (tests/helpers/server-setup.ts), and the messages that name them. */
const BUDGET_MS = inject('evalBudgetMs');
const REPLAY_BUDGET_MS = inject('replayBudgetMs');
const seconds = (ms: number) => `${(ms / 1000).toFixed(1)} s`;
const OVER_BUDGET = `evaluation stopped: over the time budget of ${seconds(BUDGET_MS)}`;
/**
 * A heavy line that can never finish within any test budget, on any machine: 2000 points of mutual information
 * (three strip solves each) in a metric bulk whose f and h are as long as a formula may be, so every quadrature
 * node evaluates ~100 functions (~0.1 s a point here even when idle). Exact balls no longer serve: they take
 * milliseconds since ball-shot.ts.
 */
const HEAVY_LINE = `use metric f="1-z^4+0*(${Array(52).fill('sin(z)').join('+')})" h="1+0*(${Array(52).fill('cos(z)').join('+')})"; sweep mi pair l=0.2..1.2:2000 gap=0.1`;
const DEMO_SLUG = 'sable-boosted-first-law';

let attacker: Client;
let victim: Client;
let braneValue: number;

const valueOf = (r: { body: any }) => r.body.results.find((x: any) => x.kind === 'scalar').value as number;

async function expectServerFine() {
	expect((await new Client().get('/api/health')).status).toBe(200);
	const r = await victim.post('/api/eval', { input: BRANE });
	expect(r.status, JSON.stringify(r.body)).toBe(200);
	expect(valueOf(r)).toBe(braneValue);
}

beforeAll(async () => {
	attacker = await freshMember('attacker');
	victim = await signedIn('tomas@sable.test');
	const r = await victim.post('/api/eval', { input: BRANE });
	expect(r.status).toBe(200);
	braneValue = valueOf(r);
});

describe('formulas cannot reach or change the evaluator', () => {
	it('refuses the range attack that used to take the server down, and keeps serving', async () => {
		const r = await attacker.post('/api/eval', { input: 'use metric d=4 f="1+0*sum(range(1,1e9))"' });
		expect(r.status).toBe(400);
		expect(r.body.error.message).toBe("f is refused: function 'sum' is not allowed");
		await expectServerFine();
	});

	it('refuses config/createUnit/import/ones/matrix in metric strings; the next user still gets doubles', async () => {
		const attacks: [string, string][] = [
			['config({number: \\"BigNumber\\"})', "f is refused: function 'config' is not allowed"],
			['1+0*createUnit(\\"zork\\")', "f is refused: function 'createUnit' is not allowed"],
			['1+0*import({sin: 1})', "f is refused: function 'import' is not allowed"],
			['1+0*sum(ones(1e5, 1e5))', "f is refused: function 'sum' is not allowed"],
			['1+0*matrix([1])', "f is refused: function 'matrix' is not allowed"],
			['1+0*compile(\\"1\\")', "f is refused: function 'compile' is not allowed"]
		];
		// several times each, so every evaluation process has seen them
		for (let round = 0; round < 3; round++) {
			for (const [f, message] of attacks) {
				const r = await attacker.post('/api/eval', { input: `use metric d=4 f="${f}"` });
				expect(r.status, f).toBe(400);
				expect(r.body.error.message).toBe(message);
			}
		}
		const clean = await Promise.all([0, 1, 2, 3].map(() => victim.post('/api/eval', { input: CLEAN_METRIC })));
		for (const r of clean) {
			expect(r.status, JSON.stringify(r.body)).toBe(200);
			// derived: the metric is the brane, integrated by the same strip routine; only its f is a formula
			expect(Math.abs(valueOf(r) / braneValue - 1)).toBeLessThan(1e-8);
		}
		const arith = await victim.post('/api/eval', { input: '0.1 + 0.2' });
		expect(valueOf(arith)).toBe(0.1 + 0.2); // IEEE doubles, not BigNumber
	});
});

describe('an evaluator that dies or runs away costs only its own line', () => {
	it('a line that exhausts memory answers 422 while another user is served, and its process is replaced', async () => {
		// '#test-hook allocate' exists only with BULKPAD_TEST_HOOKS=1 (tests/helpers/server-setup.ts)
		const dying = attacker.post('/api/eval', { input: '#test-hook allocate' });
		const meanwhile = await Promise.all([0, 1, 2].map(() => victim.post('/api/eval', { input: BRANE })));
		for (const r of meanwhile) expect(valueOf(r)).toBe(braneValue);
		const r = await dying;
		expect(r.status).toBe(422);
		// on a loaded machine the budget can end the allocation before the heap limit does; either way only
		// that process died (tests/api/eval-pool.test.ts pins the out-of-memory path itself with a small heap)
		expect(r.body.error.message).toMatch(
			/^evaluation stopped: (it ran out of memory \(\d+ MB\) or crashed|over the time budget of \d+\.\d s)$/
		);
		await expectServerFine();
		// again, so the replacement process is proven to be replaceable too
		expect((await attacker.post('/api/eval', { input: '#test-hook allocate' })).status).toBe(422);
		await expectServerFine();
	});

	it('a line that never returns is stopped at its budget while another user is served', async () => {
		const spinning = attacker.post('/api/eval', { input: '#test-hook spin' });
		for (let i = 0; i < 3; i++) expect(valueOf(await victim.post('/api/eval', { input: BRANE }))).toBe(braneValue);
		const r = await spinning;
		expect(r.status).toBe(422);
		expect(r.body.error.message).toBe(OVER_BUDGET);
		await expectServerFine();
	});

	it('without the hook variable the hook text is an ordinary (refused) line', async () => {
		// the variable is set for this server, so this only checks the language's own answer to the text
		const r = await victim.post('/api/eval', { input: '#test-hook' });
		expect(r.status).toBe(400);
	});
});

describe('fair queueing', () => {
	it("runs one member's heavy lines one at a time, counts only running time against the budget, and serves others first", async () => {
		const heavy = [0, 1].map(() => attacker.post('/api/eval', { input: HEAVY_LINE }));
		await new Promise((r) => setTimeout(r, 200));
		for (let i = 0; i < 4; i++) expect(valueOf(await victim.post('/api/eval', { input: BRANE }))).toBe(braneValue);
		const answers = await Promise.all(heavy);
		for (const r of answers) {
			expect(r.status).toBe(422);
			// each ran its own full budget: the time it waited behind the others is reported apart
			expect(r.body.error.message).toBe(OVER_BUDGET);
		}
		const queued = answers.map((r) => r.body.queuedMs as number).sort((a, b) => a - b);
		// one heavy line per member at a time: the second waited for the first to use its whole budget
		expect(queued[1]).toBeGreaterThanOrEqual(BUDGET_MS);
	});
});

describe('replays', () => {
	it('anonymous clients that hang up stop their replay; a later replay reproduces the transcript', async () => {
		const controllers = Array.from({ length: 6 }, () => new AbortController());
		const base = new Client().baseUrl;
		const calls = controllers.map((c) =>
			fetch(`${base}/api/t/${DEMO_SLUG}/replay`, {
				method: 'POST',
				headers: { origin: base, 'content-type': 'application/json' },
				body: '{}',
				signal: c.signal
			}).catch(() => undefined)
		);
		await new Promise((r) => setTimeout(r, 300));
		for (const c of controllers) c.abort();
		await Promise.all(calls);
		await expectServerFine();
		const anon = new Client();
		const r = await anon.post(`/api/t/${DEMO_SLUG}/replay`);
		expect(r.status).toBe(200);
		expect(r.body.skipped).toBe(0);
		expect(r.body.steps.filter((s: { drift: boolean }) => s.drift)).toEqual([]);
		// unchanged transcript: the next replay reuses the fresh answers, with the same marks
		const again = await anon.post(`/api/t/${DEMO_SLUG}/replay`);
		expect(again.body.reused).toBe(true);
		expect(again.body.steps.map((s: any) => [s.n, s.drift])).toEqual(r.body.steps.map((s: any) => [s.n, s.drift]));
	});
});

describe('replay limits', () => {
	it('limits fresh anonymous replays of one transcript, whatever the address', async () => {
		const owner = await freshMember('macro-user');
		// a step through the library ('@') is never reused, so every replay of this transcript runs afresh
		const pad = await padWithSteps(owner, 'Macro replay', ['@btz-check l=1 c=12']);
		const slug = (await owner.post(`/api/pads/${pad}/share`, {})).body.slug as string;
		const anon = new Client();
		// the test server's per-transcript limit is the default, 6 fresh runs a minute
		for (let i = 0; i < 6; i++) {
			const r = await anon.post(`/api/t/${slug}/replay`);
			expect(r.status, JSON.stringify(r.body)).toBe(200);
			expect(r.body.reused).toBeUndefined();
		}
		const seventh = await anon.post(`/api/t/${slug}/replay`);
		expect(seventh.status).toBe(429);
		expect(seventh.body.error.message).toMatch(/^This transcript is being replayed too often; try again in \d+ s\.$/);
		// its owner is not an anonymous client: members replay without the transcript's limit
		expect((await owner.post(`/api/pads/${pad}/replay`)).status).toBe(200);
	});

	it('stops a replay at its total budget and reports the remaining steps as skipped', async () => {
		const owner = await freshMember('long-replay');
		const pad = await padWithSteps(
			owner,
			'Long replay',
			Array.from({ length: 11 }, () => 'zstar l=0.5')
		);
		// eleven steps that each run to the line budget: far past the test server's replay budget
		sql("UPDATE steps SET input = '#test-hook spin' WHERE pad_id = ?", pad);
		const r = await owner.post(`/api/pads/${pad}/replay`);
		expect(r.status).toBe(200);
		const ran = r.body.steps.filter((s: any) => !s.skipped);
		const skipped = r.body.steps.filter((s: any) => s.skipped);
		expect(skipped.length).toBeGreaterThanOrEqual(1);
		expect(ran.length + skipped.length).toBe(11);
		for (const s of skipped) expect(s.error.message).toBe(`not replayed: the replay used its budget of ${seconds(REPLAY_BUDGET_MS)}`);
		for (const s of ran) expect(s.error.message).toMatch(/^evaluation stopped: over the time budget of \d+\.\d s$/);
		expect(r.body.skipped).toBe(skipped.length);
		await expectServerFine();
	});
});

describe('datasets', () => {
	const tag = () => Math.random().toString(36).slice(2, 7);
	/** about 0.9 MB: 18,000 rows of four numbers with many digits */
	function bigCsv(seed: number): string {
		const lines = ['l,darea,a,b'];
		for (let i = 0; i < 18_000; i++)
			lines.push(
				`${(0.01 + i * 1e-5).toFixed(8)},${Math.sin(seed + i).toFixed(12)},${Math.cos(i).toFixed(12)},${(i * 1.000001).toFixed(6)}`
			);
		return lines.join('\n') + '\n';
	}
	const upload = (c: Client, csv: string, name: string) => {
		const f = new FormData();
		f.append('file', new File([csv], `${name}.csv`, { type: 'text/csv' }));
		f.append('name', name);
		return c.post('/api/datasets', f);
	};

	it('a compare line reads only the dataset it names, among many large ones; quotas stop the next upload', async () => {
		const owner = await freshMember('hoarder');
		for (let i = 0; i < 7; i++) {
			const r = await upload(owner, bigCsv(i), `big_${i}_${tag()}`);
			expect(r.status, JSON.stringify(r.body)).toBe(201);
		}
		const small = `small_${tag()}`;
		const values: number[] = [];
		for (const l of [0.2, 0.4]) values.push(valueOf(await owner.post('/api/eval', { input: `darea l=${l} d=4 zh=1` })));
		expect((await upload(owner, `l,darea\n0.2,${values[0]}\n0.4,${values[1]}\n`, small)).status).toBe(201);
		const lines = await Promise.all([0, 1, 2, 3].map(() => owner.post('/api/eval', { input: `compare ${small} darea d=4 zh=1` })));
		for (const r of lines) {
			expect(r.status, JSON.stringify(r.body)).toBe(200);
			const t = r.body.results.find((x: any) => x.kind === 'table');
			expect(t.rows.map((row: number[]) => row[t.columns.indexOf('dataset')])).toEqual(values);
		}
		await expectServerFine();
		// the test server's quota per member is 8 MB (tests/helpers/server-setup.ts): seven ~0.9 MB files fit, two more do not
		const over = await upload(owner, bigCsv(8), `big_8_${tag()}`);
		const last = over.status === 201 ? await upload(owner, bigCsv(9), `big_9_${tag()}`) : over;
		expect(last.status).toBe(413);
		expect(last.body.error.message).toMatch(/^Your datasets use .* of your 8\.00 MB; delete one before uploading/);
	});
});
