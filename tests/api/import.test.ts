// Import as an allow-list against the built server: every demo pad round-trips, an unknown bulk or bad units
// are a 400 naming them and the step, and a pad whose stored bulk is unknown answers each verb with a clear
// language error (never a 500) until a `use` line moves it to a known bulk.
import { beforeAll, describe, expect, it } from 'vitest';
import { Client, freshMember, signedIn } from '../helpers/client';
import { expectFailure } from '../helpers/roles';
import { padWithSteps, sql } from './support/pads';

let member: Client;
let doc: any;

beforeAll(async () => {
	member = await freshMember('import');
	const id = await padWithSteps(member, 'Import source', [
		'use boosted d=4 zh=1 v=0.6',
		'darea l=0.4 o=1,2,exact',
		'units geo G=2',
		'let w = width zstar=0.5',
		'thermo'
	]);
	doc = (await member.get(`/api/pads/${id}/export?format=json`)).body;
	expect(doc.format).toBe('bulkpad-pad');
});

describe('import checks what it stores', () => {
	it('round-trips every pad of the demo group', async () => {
		const owners = ['ines@sable.test', 'tomas@sable.test'];
		let seen = 0;
		for (const email of owners) {
			const owner = await signedIn(email);
			for (const pad of (await owner.get('/api/pads')).body.pads) {
				const exported = await owner.get(`/api/pads/${pad.id}/export?format=json`);
				expect(exported.status).toBe(200);
				const r = await member.post('/api/pads/import', exported.body);
				expect(r.status, `${pad.title}: ${JSON.stringify(r.body).slice(0, 300)}`).toBe(201);
				expect(r.body.pad.bulk).toEqual(exported.body.bulk);
				seen++;
			}
		}
		expect(seen).toBeGreaterThanOrEqual(4);
	});

	it('round-trips a pad with a boosted bulk, its units, a let and a table', async () => {
		const r = await member.post('/api/pads/import', doc);
		expect(r.status, JSON.stringify(r.body)).toBe(201);
		expect(r.body.pad).toMatchObject({ bulk: doc.bulk, units: { system: 'geo', G: 2 }, lets: { w: doc.lets.w } });
	});

	it('round-trips the longest answers the language can give (boosted coefficients to the highest order)', async () => {
		const id = await padWithSteps(member, 'Long formulas', ['use boosted d=4 v=0.5', 'coeffs darea o=12']);
		const long = (await member.get(`/api/pads/${id}/export?format=json`)).body;
		const series = long.steps.at(-1).results[0];
		expect(series.kind).toBe('series');
		const r = await member.post('/api/pads/import', long);
		expect(r.status, JSON.stringify(r.body).slice(0, 300)).toBe(201);
		const back = (await member.get(`/api/pads/${r.body.pad.id}/export?format=json`)).body;
		expect(back.steps.at(-1).results[0]).toEqual(series);
	});

	it('refuses an unknown pad bulk with a 400 naming it', async () => {
		const message = expectFailure(await member.post('/api/pads/import', { ...doc, bulk: { name: 'wormhole', params: { d: 4 } } }), 400);
		expect(message).toMatch(/bulk\.name: unknown bulk 'wormhole': Bulkpad knows vacuum, brane, boosted/);
	});

	it('refuses an unknown bulk in a step, naming the step', async () => {
		const steps = doc.steps.map((s: any, i: number) => (i === 2 ? { ...s, bulkBefore: { name: 'wormhole', params: {} } } : s));
		expect(expectFailure(await member.post('/api/pads/import', { ...doc, steps }), 400)).toMatch(
			/step 3, steps\.2\.bulkBefore\.name: unknown bulk 'wormhole'/
		);
	});

	it('refuses parameters, units and results the language could not have produced', async () => {
		const cases: [unknown, RegExp][] = [
			[{ ...doc, bulk: { name: 'boosted', params: { d: 4, zh: 1, v: 2 } } }, /bulk\.params\.v: bulk boosted: v must satisfy \|v\| < 1/],
			[{ ...doc, bulk: { name: 'brane', params: { d: 4, zh: 1, f: '1-z^4' } } }, /key 'f' does not apply to bulk 'brane'/],
			[{ ...doc, units: { system: 'cft', c: -3 } }, /units\.c: c must be > 0/],
			[{ ...doc, units: { system: 'planck', G: 1 } }, /units\.system/],
			[
				{ ...doc, steps: doc.steps.map((s: any, i: number) => (i === 1 ? { ...s, results: [{ ...s.results[0], rows: 'lots' }] } : s)) },
				/step 2, steps\.1\.results\.0\.rows/
			],
			[
				{
					...doc,
					steps: doc.steps.map((s: any, i: number) => (i === 4 ? { ...s, results: [{ ...s.results[0], fields: { T: 'hot' } }] } : s))
				},
				/step 5, steps\.4\.results\.0\.fields\.T/
			]
		];
		for (const [body, message] of cases) expect(expectFailure(await member.post('/api/pads/import', body), 400)).toMatch(message);
		// nothing half-imported: the member's pads are the ones made above
		const titles = (await member.get('/api/pads')).body.pads.map((p: { title: string }) => p.title);
		expect(titles.filter((t: string) => t === doc.title)).toHaveLength(1 + 1); // the source and the one good import
	});
});

describe('a pad whose stored bulk is unknown', () => {
	let padId: string;
	beforeAll(async () => {
		padId = await padWithSteps(member, 'Stranded', ['zstar l=0.5']);
		// as a pad imported before import checked bulks (or a hand-edited database) would hold it
		sql('UPDATE pads SET bulk = ? WHERE id = ?', JSON.stringify({ name: 'wormhole', params: { d: 4 } }), padId);
	});

	it('answers a verb with a 400 naming the bulk and pointing at use, and keeps the line as an attempt', async () => {
		const r = await member.post('/api/eval', { input: 'zstar l=0.5', pad: padId });
		expect(r.status, JSON.stringify(r.body)).toBe(400);
		expect(r.body.error).toMatchObject({ message: "this pad's bulk 'wormhole' is not one Bulkpad knows", start: 0, end: 11 });
		expect(r.body.error.hint).toMatch(/use <bulk>/);
		const attempts = (await member.get(`/api/pads/${padId}`)).body.attempts;
		expect(attempts.at(-1)).toMatchObject({
			id: r.body.attempt.id,
			input: 'zstar l=0.5',
			status: 'error',
			error: { message: "this pad's bulk 'wormhole' is not one Bulkpad knows" }
		});
	});

	it('still shows the pad page and its data', async () => {
		expect((await member.get(`/pads/${padId}`)).status).toBe(200);
		const data = await member.get(`/pads/${padId}/__data.json`);
		expect(data.status).toBe(200);
		expect(JSON.stringify(data.body)).toContain('wormhole');
	});

	it('moves to a known bulk with use, after which verbs run again', async () => {
		const used = await member.post('/api/eval', { input: 'use brane d=4 zh=1', pad: padId });
		expect(used.status, JSON.stringify(used.body)).toBe(200);
		const again = await member.post('/api/eval', { input: 'zstar l=0.5', pad: padId });
		expect(again.status, JSON.stringify(again.body)).toBe(200);
		const steps = (await member.get(`/api/pads/${padId}`)).body.steps;
		// the same line, evaluated in the same bulk as step 1, gives the same z*
		expect(again.body.results[0].value).toBe(steps[0].results[0].value);
	});
});
