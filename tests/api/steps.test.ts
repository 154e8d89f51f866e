// Steps as a working document over HTTP: hide, name and re-run steps of a pad; attempts dismissed. Nothing is
// ever deleted, `#name` follows its step, a re-run keeps every earlier version, and a replay still reproduces.
import { beforeAll, describe, expect, it } from 'vitest';
import { Client, freshMember } from '../helpers/client';
import { expectFailure, freshWithRole, signInPatiently } from '../helpers/roles';
import { padWithSteps, sql } from './support/pads';

let owner: Client;
let other: Client;
let reader: Client;
let padId: string;

const count = (table: string) => sql<{ k: number }>(`SELECT count(*) AS k FROM ${table} WHERE pad_id = ?`, padId)[0]!.k;

beforeAll(async () => {
	const admin = await signInPatiently('curator@sable.test');
	owner = await freshMember('steps-owner');
	other = await freshMember('steps-other');
	reader = await freshWithRole(admin, 'steps-reader', 'reader');
	padId = await padWithSteps(owner, 'Working document', ['use boosted d=4 zh=1 v=0.5', 'darea l=0.3', 'darea l=0.6']);
});

describe('naming', () => {
	it('names a step, reads it through #name, and refuses a taken or malformed name', async () => {
		const named = await owner.patch(`/api/pads/${padId}/steps/2`, { name: 'btz' });
		expect(named.status, JSON.stringify(named.body)).toBe(200);
		expect(named.body.step).toMatchObject({ n: 2, name: 'btz', hidden: false, version: 1 });
		const twice = await owner.post('/api/eval', { input: '#btz * 2', pad: padId });
		const direct = await owner.post('/api/eval', { input: '#2 * 2', pad: padId });
		expect(twice.status).toBe(200);
		expect(twice.body.results[0].value).toBeCloseTo(direct.body.results[0].value, 14);
		expect(expectFailure(await owner.patch(`/api/pads/${padId}/steps/3`, { name: 'btz' }), 409)).toMatch(/#btz already names step #2/);
		expectFailure(await owner.patch(`/api/pads/${padId}/steps/3`, { name: '3x' }), 400);
		expectFailure(await owner.patch(`/api/pads/${padId}/steps/99`, { name: 'far' }), 404);
		const unknown = await owner.post('/api/eval', { input: '#bzt + 1', pad: padId });
		expect(unknown.status).toBe(400);
		expect(unknown.body.error).toMatchObject({ start: 0, end: 4 });
		expect(unknown.body.error.message).toMatch(/no step named #bzt.*btz/);
	});

	it('moves a name to another step: #name follows it, the number stays', async () => {
		expect((await owner.patch(`/api/pads/${padId}/steps/2`, { name: null })).status).toBe(200);
		expect((await owner.patch(`/api/pads/${padId}/steps/3`, { name: 'btz' })).status).toBe(200);
		const viaName = await owner.post('/api/eval', { input: '#btz', pad: padId });
		const viaNumber = await owner.post('/api/eval', { input: '#3', pad: padId });
		expect(viaName.body.results[0].value).toBe(viaNumber.body.results[0].value);
	});
});

describe('hiding and attempts', () => {
	it('hides and restores a step without deleting it; references still read it', async () => {
		const steps = count('steps');
		const hidden = await owner.patch(`/api/pads/${padId}/steps/2`, { hidden: true });
		expect(hidden.body.step.hidden).toBe(true);
		expect(count('steps')).toBe(steps);
		const pad = await owner.get(`/api/pads/${padId}`);
		expect(pad.body.steps.find((s: { n: number }) => s.n === 2).hidden).toBe(true);
		expect((await owner.post('/api/eval', { input: '#2 + 0', pad: padId })).status).toBe(200);
		expect((await owner.patch(`/api/pads/${padId}/steps/2`, { hidden: false })).body.step.hidden).toBe(false);
	});

	it('dismisses an attempt and brings it back; only the owner sees attempts', async () => {
		const bad = await owner.post('/api/eval', { input: 'dara l=0.3', pad: padId });
		expect(bad.status).toBe(400);
		const id = bad.body.attempt.id;
		const gone = await owner.patch(`/api/pads/${padId}/attempts/${id}`, { dismissed: true });
		expect(gone.body.attempt).toMatchObject({ id, dismissed: true, input: 'dara l=0.3' });
		expect(sql('SELECT id FROM attempts WHERE id = ?', id)).toHaveLength(1);
		const back = await owner.patch(`/api/pads/${padId}/attempts/${id}`, { dismissed: false });
		expect(back.body.attempt.dismissed).toBe(false);
		expectFailure(await other.patch(`/api/pads/${padId}/attempts/${id}`, { dismissed: true }), 404);
		expectFailure(await reader.patch(`/api/pads/${padId}/attempts/${id}`, { dismissed: true }), 403);
	});
});

describe('re-running', () => {
	it('re-runs a step with an edited line as version 2, keeps version 1, and #n reads the new one', async () => {
		const before = await owner.get(`/api/pads/${padId}/steps/2`);
		expect(before.body.versions).toEqual([]);
		const r = await owner.post(`/api/pads/${padId}/steps/2`, { input: 'darea l=0.4' });
		expect(r.status, JSON.stringify(r.body)).toBe(200);
		expect(r.body.step).toMatchObject({ n: 2, version: 2 });
		// evaluated in the bulk the step started from: the same as a stateless line in that bulk
		const same = await owner.post('/api/eval', { input: 'use boosted d=4 zh=1 v=0.5; darea l=0.4' });
		expect(r.body.results[0].value).toBe(same.body.results.at(-1).value);
		const after = await owner.get(`/api/pads/${padId}/steps/2`);
		expect(after.body.step).toMatchObject({ n: 2, input: 'darea l=0.4', version: 2 });
		expect(after.body.versions).toEqual([expect.objectContaining({ version: 1, input: 'darea l=0.3', status: 'ok' })]);
		expect(after.body.versions[0].results[0].value).toBe(before.body.step.results[0].value);
		const ref = await owner.post('/api/eval', { input: '#2', pad: padId });
		expect(ref.body.results[0].value).toBe(r.body.results[0].value);
	});

	it('keeps a failed re-run as an attempt for that step and leaves the step as it was', async () => {
		const r = await owner.post(`/api/pads/${padId}/steps/2`, { input: 'darea l=-1' });
		expect(r.status).toBe(400);
		expect(r.body.attempt.id).toEqual(expect.any(String));
		const step = await owner.get(`/api/pads/${padId}/steps/2`);
		expect(step.body.step).toMatchObject({ input: 'darea l=0.4', version: 2 });
		expect(sql<{ for_n: number }>('SELECT for_n FROM attempts WHERE id = ?', r.body.attempt.id)).toEqual([{ for_n: 2 }]);
	});

	it('sees only earlier steps: a re-run of #2 cannot read #3', async () => {
		const r = await owner.post(`/api/pads/${padId}/steps/2`, { input: '#3 * 1' });
		expect(r.status).toBe(400);
		expect(r.body.error.message).toMatch(/no step #3/);
	});

	it('answers 404 to another member and 403 to a reader', async () => {
		expectFailure(await other.post(`/api/pads/${padId}/steps/2`, { input: 'darea l=0.5' }), 404);
		expectFailure(await other.get(`/api/pads/${padId}/steps/2`), 404);
		expectFailure(await reader.post(`/api/pads/${padId}/steps/2`, { input: 'darea l=0.5' }), 403);
		expectFailure(await owner.get(`/api/pads/${padId}/steps/0`), 404);
	});
});

describe('replay', () => {
	it('replays a pad with names and re-runs: exactly the steps that read what changed drift', async () => {
		const inputs = sql<{ n: number; input: string }>('SELECT n, input FROM steps WHERE pad_id = ? ORDER BY n', padId);
		expect(inputs.map((s) => s.input)).toEqual([
			'use boosted d=4 zh=1 v=0.5',
			'darea l=0.4', // re-run: v1 was l=0.3
			'darea l=0.6',
			'#btz * 2', // computed when #btz named #2 (v1); the name now names #3
			'#2 * 2', // computed from #2 v1
			'#btz', // computed after the name moved to #3
			'#3',
			'#2 + 0', // computed from #2 v1
			'#2' // computed from #2 v2
		]);
		const r = await owner.post(`/api/pads/${padId}/replay`, {});
		expect(r.status, JSON.stringify(r.body).slice(0, 400)).toBe(200);
		expect(r.body.skipped).toBe(0);
		const drifted = r.body.steps.filter((s: { drift: boolean }) => s.drift).map((s: { n: number }) => s.n);
		// the replay runs the pad as it stands (current versions, current names), so it shows which recorded
		// results no longer follow from it; everything else reproduces
		expect(drifted).toEqual([4, 5, 8]);
	});
});
