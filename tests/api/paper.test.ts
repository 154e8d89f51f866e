// Paper output through the API: the pad's validity tolerance (set, evaluated with, carried by snapshots and
// forks), forks that carry the datasets their steps compare against, and figure labels kept with their step.
import { beforeAll, describe, expect, it } from 'vitest';
import * as holo from '../../src/lib/holo/index';
import { Client, freshMember } from '../helpers/client';
import { expectFailure } from '../helpers/roles';
import { padWithSteps } from './support/pads';

let owner: Client;
let member: Client;
const tag = () => Math.random().toString(36).slice(2, 7);

// a width where order 2 of the d=4 brane is within 1e-2 of exact but not within 1e-3 (the engine's own validity)
const brane = holo.makeBulk('brane', { d: 4, zh: 1 });
const tight = holo.validity(brane, 2, 1e-3).l_max;
const loose = holo.validity(brane, 2, 1e-2).l_max;
const L = Math.sqrt(tight * loose);
const LINE = `darea l=${L} o=2`;

const scalar = (body: any) => body.results.find((r: any) => r.kind === 'scalar');

beforeAll(async () => {
	owner = await freshMember('paper-owner');
	member = await freshMember('paper-member');
});

describe('the pad validity tolerance', () => {
	let padId: string;

	it('starts at the default (null, 1e-3): the series warning uses 1e-3', async () => {
		padId = await padWithSteps(owner, 'Tolerant', ['use brane d=4 zh=1']);
		expect((await owner.get(`/api/pads/${padId}`)).body.pad.validityTol).toBeNull();
		const r = await owner.post('/api/eval', { input: LINE, pad: padId });
		expect(r.status, JSON.stringify(r.body)).toBe(200);
		expect(scalar(r.body).warning).toMatch(/off by more than 0\.001 \(relative, the pad's validity tolerance\)/);
		// stateless /api/eval uses the default too
		const s = await owner.post('/api/eval', { input: `use brane d=4 zh=1; ${LINE}` });
		expect(scalar(s.body).warning).toMatch(/off by more than 0\.001/);
	});

	it('PATCH sets it; the same line then answers without the warning, and validity and shading follow', async () => {
		const p = await owner.patch(`/api/pads/${padId}`, { validityTol: 1e-2 });
		expect(p.status, JSON.stringify(p.body)).toBe(200);
		expect(p.body.pad.validityTol).toBe(1e-2);
		expect((await owner.get(`/api/pads/${padId}`)).body.pad.validityTol).toBe(1e-2);
		const r = await owner.post('/api/eval', { input: LINE, pad: padId });
		expect(scalar(r.body).warning).toBeUndefined();
		const v = await owner.post('/api/eval', { input: 'validity o=2', pad: padId });
		expect(v.body.results[0].fields.l_max).toBe(loose);
		const t = await owner.post('/api/eval', { input: 'sweep darea l=0.05..0.6:4 o=2,exact', pad: padId });
		const table = t.body.results.find((x: any) => x.kind === 'table');
		expect(table.plot.tol).toBe(1e-2);
		expect(table.plot.validity.o2).toBe(loose);
	});

	it('refuses what the engine cannot use, and only the owner may change it', async () => {
		expectFailure(await owner.patch(`/api/pads/${padId}`, { validityTol: 2 }), 400);
		expectFailure(await owner.patch(`/api/pads/${padId}`, { validityTol: 0 }), 400);
		expectFailure(await owner.patch(`/api/pads/${padId}`, { validityTol: 'small' }), 400);
		expectFailure(await owner.patch(`/api/pads/${padId}`, {}), 400);
		expectFailure(await member.patch(`/api/pads/${padId}`, { validityTol: 1e-4 }), 404);
		expect((await owner.get(`/api/pads/${padId}`)).body.pad.validityTol).toBe(1e-2);
	});

	it('a snapshot and its fork carry it; null puts the pad back to the default', async () => {
		const share = await owner.post(`/api/pads/${padId}/share`, {});
		expect(share.status).toBe(201);
		const fork = await member.post(`/api/t/${share.body.slug}/fork`);
		expect(fork.status, JSON.stringify(fork.body)).toBe(201);
		const forked = (await member.get(`/api/pads/${fork.body.pad.id}`)).body.pad;
		expect(forked.validityTol).toBe(1e-2);
		const r = await member.post('/api/eval', { input: LINE, pad: fork.body.pad.id });
		expect(scalar(r.body).warning).toBeUndefined();
		// the live pad goes back to the default; the link still replays at the tolerance it was shared with
		expect((await owner.patch(`/api/pads/${padId}`, { validityTol: null })).body.pad.validityTol).toBeNull();
		const again = await owner.post('/api/eval', { input: LINE, pad: padId });
		expect(scalar(again.body).warning).toMatch(/more than 0\.001/);
		const replay = await new Client().post(`/api/t/${share.body.slug}/replay`);
		expect(replay.status, JSON.stringify(replay.body)).toBe(200);
		const step = replay.body.steps.find((s: any) => s.results?.some((x: any) => x.kind === 'scalar' && x.label.startsWith('ΔA')));
		expect(step.drift).toBe(false);
		expect(scalar(step).warning).toBeUndefined();
	});
});

describe('a fork carries the datasets its steps compare against', () => {
	it('copies the dataset with its origin, and the fork replays for the forker', async () => {
		const name = `fork_${tag()}`;
		// the engine's own ΔA at three widths: the comparison agrees and has something to replay
		const ls = [0.2, 0.4, 0.6];
		const ys = ls.map((l) => holo.deltaArea(brane, l));
		const f = new FormData();
		f.append('file', new File(['l,darea\n' + ls.map((l, i) => `${l},${ys[i]}`).join('\n') + '\n'], `${name}.csv`, { type: 'text/csv' }));
		expect((await owner.post('/api/datasets', f)).status).toBe(201);
		const padId = await padWithSteps(owner, 'With data', ['use brane d=4 zh=1', `compare ${name} darea`]);
		const share = await owner.post(`/api/pads/${padId}/share`, {});
		// before the fork the member has no such dataset, so the step could not run for them
		expect((await member.get('/api/datasets')).body.datasets.map((d: any) => d.name)).not.toContain(name);

		const fork = await member.post(`/api/t/${share.body.slug}/fork`);
		expect(fork.status, JSON.stringify(fork.body)).toBe(201);
		expect(fork.body.datasets).toEqual({ copied: [name], kept: [], skipped: [] });
		const mine = (await member.get('/api/datasets')).body.datasets.find((d: any) => d.name === name);
		expect(mine.origin).toBe(`${name} of paper-owner, copied when forking 'With data'`);
		expect((await member.get(`/api/datasets/${mine.id}`)).body.dataset.rows).toEqual(ls.map((l, i) => [l, ys[i]]));

		const replay = await member.post(`/api/pads/${fork.body.pad.id}/replay`);
		expect(replay.status, JSON.stringify(replay.body)).toBe(200);
		const cmp = replay.body.steps.find((s: any) => s.n === 2);
		expect(cmp.failed, JSON.stringify(cmp)).toBe(false);
		expect(cmp.drift).toBe(false);

		// control: without the copy the same replay fails for the forker
		expect((await member.del(`/api/datasets/${mine.id}`)).status).toBe(200);
		const bare = await member.post(`/api/pads/${fork.body.pad.id}/replay`);
		expect(bare.body.steps.find((s: any) => s.n === 2).failed).toBe(true);

		// a second fork while the member has a dataset of that name keeps theirs
		const f2 = new FormData();
		f2.append('file', new File(['l,darea\n0.3,1\n0.5,2\n'], `${name}.csv`, { type: 'text/csv' }));
		expect((await member.post('/api/datasets', f2)).status).toBe(201);
		const again = await member.post(`/api/t/${share.body.slug}/fork`);
		expect(again.body.datasets).toEqual({ copied: [], kept: [name], skipped: [] });
	});
});

describe('figure labels are kept with their step', () => {
	it('PATCH stores them by result index, GET returns them, null clears them', async () => {
		const padId = await padWithSteps(owner, 'Labelled', ['sweep darea l=0.1..0.5:4 o=1,exact']);
		const labels = { xlabel: '\\ell/z_h', ylabel: '\\Delta A', legends: { exact: '\\mathrm{numerics}' } };
		const p = await owner.patch(`/api/pads/${padId}/steps/1`, { figureLabels: { '0': labels } });
		expect(p.status, JSON.stringify(p.body)).toBe(200);
		expect(p.body.step.figureLabels).toEqual({ '0': labels });
		const got = (await owner.get(`/api/pads/${padId}`)).body.steps[0];
		expect(got.figureLabels).toEqual({ '0': labels });
		// blanks mean the default and are not kept
		const blank = await owner.patch(`/api/pads/${padId}/steps/1`, { figureLabels: { '0': { xlabel: '  ', ylabel: 'A' } } });
		expect(blank.body.step.figureLabels).toEqual({ '0': { ylabel: 'A' } });
		expectFailure(await owner.patch(`/api/pads/${padId}/steps/1`, { figureLabels: { '0': { xlabel: 'x'.repeat(201) } } }), 400);
		expectFailure(await member.patch(`/api/pads/${padId}/steps/1`, { figureLabels: { '0': labels } }), 404);
		// a link made now and its fork keep the labels
		expect((await owner.patch(`/api/pads/${padId}/steps/1`, { figureLabels: { '0': labels } })).status).toBe(200);
		const share = await owner.post(`/api/pads/${padId}/share`, {});
		const fork = await member.post(`/api/t/${share.body.slug}/fork`);
		expect((await member.get(`/api/pads/${fork.body.pad.id}`)).body.steps[0].figureLabels).toEqual({ '0': labels });
		const cleared = await owner.patch(`/api/pads/${padId}/steps/1`, { figureLabels: { '0': null } });
		expect(cleared.body.step.figureLabels).toBeNull();
	});
});
