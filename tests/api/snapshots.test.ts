// Share links are snapshots: frozen when made (a referee needs the pad as submitted), listed with their note
// and date, revocable; a link from before snapshots freezes on its first open; replay never calls a failed step
// reproduced; signed-in readers comment on a snapshot's steps, the owner reads them, strangers get 404.
import { beforeAll, describe, expect, it } from 'vitest';
import { Client, freshMember } from '../helpers/client';
import { expectFailure, freshWithRole, signInPatiently } from '../helpers/roles';
import { padWithSteps, sql } from './support/pads';

const anon = new Client();
let owner: Client;
let referee: Client;
let stranger: Client;
let reader: Client;
let padId: string;

const strip = (s: { n: number; input: string; status: string; results: unknown }) => ({
	n: s.n,
	input: s.input,
	status: s.status,
	results: s.results
});

beforeAll(async () => {
	const admin = await signInPatiently('curator@sable.test');
	owner = await freshMember('snap-owner');
	referee = await freshMember('snap-referee');
	stranger = await freshMember('snap-stranger');
	reader = await freshWithRole(admin, 'snap-reader', 'reader');
	padId = await padWithSteps(owner, 'As submitted', ['use brane d=3 zh=1', 'darea l=0.4 o=2']);
});

describe('a snapshot', () => {
	it('does not change when the pad does, and a new share is a new snapshot', async () => {
		const made = await owner.post(`/api/pads/${padId}/share`, { note: 'as submitted v1', expiresInDays: 30 });
		expect(made.status, JSON.stringify(made.body)).toBe(201);
		expect(made.body.note).toBe('as submitted v1');
		const v1 = made.body.slug as string;
		const before = (await anon.get(`/api/t/${v1}`)).body;
		expect(before.steps.map(strip)).toEqual((await owner.get(`/api/pads/${padId}`)).body.steps.map(strip));
		expect(before.note).toBe('as submitted v1');

		// the pad moves on: a new step, and its title
		expect((await owner.post('/api/eval', { input: 'darea l=0.6 o=2', pad: padId })).status).toBe(200);
		expect((await owner.patch(`/api/pads/${padId}`, { title: 'Grown since' })).status).toBe(200);

		const after = (await anon.get(`/api/t/${v1}`)).body;
		expect(after).toEqual(before);
		expect(after.steps).toHaveLength(2);
		expect(after.title).toBe('As submitted');
		// its export and its replay are of the snapshot too
		const json = (await anon.get(`/api/t/${v1}/export?format=json`)).body;
		expect(json.steps.map((s: { input: string }) => s.input)).toEqual(['use brane d=3 zh=1', 'darea l=0.4 o=2']);
		const replay = await anon.post(`/api/t/${v1}/replay`);
		expect(replay.body.steps.map((s: { n: number }) => s.n)).toEqual([1, 2]);
		expect(replay.body.drifted).toBe(0);

		const v2 = (await owner.post(`/api/pads/${padId}/share`, { note: 'as submitted v2' })).body.slug;
		expect((await anon.get(`/api/t/${v2}`)).body.steps).toHaveLength(3);
		const listed = (await owner.get(`/api/pads/${padId}/share`)).body.shares;
		expect(listed.map((s: { note: string; steps: number }) => [s.note, s.steps])).toEqual([
			['as submitted v2', 3],
			['as submitted v1', 2]
		]);
		for (const s of listed) expect(Date.parse(s.frozenAt)).toBeGreaterThan(0);
	});

	it('revokes one snapshot and leaves the others readable', async () => {
		const a = (await owner.post(`/api/pads/${padId}/share`, { note: 'to revoke' })).body.slug;
		const b = (await owner.post(`/api/pads/${padId}/share`, {})).body.slug;
		expectFailure(await stranger.del(`/api/pads/${padId}/share/${a}`), 404);
		expect((await owner.del(`/api/pads/${padId}/share/${a}`)).status).toBe(200);
		expectFailure(await anon.get(`/api/t/${a}`), 404);
		expectFailure(await referee.get(`/api/t/${a}/comments`), 404);
		expectFailure(await referee.post(`/api/t/${a}/comments`, { step: 1, body: 'too late' }), 404);
		expect((await anon.get(`/api/t/${b}`)).status).toBe(200);
		const listed = (await owner.get(`/api/pads/${padId}/share`)).body.shares.find((s: { slug: string }) => s.slug === a);
		expect(listed).toMatchObject({ live: false, note: 'to revoke' });
	});

	it('freezes a link made before snapshots on its first open, and keeps it frozen', async () => {
		const slug = (await owner.post(`/api/pads/${padId}/share`, {})).body.slug;
		sql('UPDATE shares SET snapshot = NULL, frozen_at = NULL WHERE slug = ?', slug); // as an old row is after the migration
		expect((await owner.get(`/api/pads/${padId}/share`)).body.shares.find((s: { slug: string }) => s.slug === slug)).toMatchObject({
			frozenAt: null,
			steps: null
		});
		const steps = (await owner.get(`/api/pads/${padId}`)).body.steps.length;
		const first = (await anon.get(`/api/t/${slug}`)).body;
		expect(first.steps).toHaveLength(steps);
		expect((await owner.post('/api/eval', { input: 'thermo', pad: padId })).status).toBe(200);
		expect((await anon.get(`/api/t/${slug}`)).body).toEqual(first);
	});

	it('takes a note of bounded length', async () => {
		expectFailure(await owner.post(`/api/pads/${padId}/share`, { note: 'x'.repeat(201) }), 400);
	});
});

describe('replay of a failed step', () => {
	it('marks it failed, never reproduced, even when it fails exactly as recorded', async () => {
		// a failed line is an attempt now (no step); a failed *step* comes from a pad kept before that change,
		// which an exported document still carries: import one with a typo recorded as step #2
		const first = (await owner.post('/api/pads', { title: 'With a typo' })).body.pad.id;
		expect((await owner.post('/api/eval', { input: 'darea l=0.3 d=4 zh=1', pad: first })).status).toBe(200);
		const doc = (await owner.get(`/api/pads/${first}/export?format=json`)).body;
		const typo = await owner.post('/api/eval', { input: 'dara l=0.3' });
		expect(typo.status).toBe(400);
		const { message, start, end, hint, code } = typo.body.error;
		doc.steps.push({ n: 2, input: 'dara l=0.3', status: 'error', results: null, error: { message, start, end, hint, code } });
		const imported = await owner.post('/api/pads/import', doc);
		expect(imported.status, JSON.stringify(imported.body)).toBe(201);
		const pad = imported.body.pad.id;
		const slug = (await owner.post(`/api/pads/${pad}/share`, {})).body.slug;
		const t = (await anon.get(`/api/t/${slug}`)).body;
		const failedN = t.steps.find((s: { status: string }) => s.status === 'error').n;
		const r = await anon.post(`/api/t/${slug}/replay`);
		expect(r.status, JSON.stringify(r.body)).toBe(200);
		const mark = r.body.steps.find((s: { n: number }) => s.n === failedN);
		expect(mark).toMatchObject({ failed: true, drift: false });
		expect(mark.error.message).toMatch(/unknown verb 'dara'/);
		expect(r.body.failed).toBe(1);
		expect(r.body.steps.find((s: { n: number }) => s.n !== failedN)).toMatchObject({ failed: false, drift: false });
	});
});

describe('comments on a snapshot', () => {
	let slug: string;
	beforeAll(async () => {
		slug = (await owner.post(`/api/pads/${padId}/share`, { note: 'for the referee' })).body.slug;
	});

	it('reach the owner and the other readers; a stranger without the link gets 404', async () => {
		const body = 'Step 2: which order is this? <script>alert(1)</script>';
		const posted = await referee.post(`/api/t/${slug}/comments`, { step: 2, body });
		expect(posted.status, JSON.stringify(posted.body)).toBe(201);
		expect(posted.body.comment).toMatchObject({ step: 2, body, author: { name: 'snap-referee' } });
		expect((await reader.post(`/api/t/${slug}/comments`, { step: 1, body: 'A reader agrees.' })).status).toBe(201);

		const ownerView = await owner.get(`/api/pads/${padId}/share/${slug}/comments`);
		expect(ownerView.status).toBe(200);
		expect(ownerView.body.comments.map((c: { step: number; body: string }) => [c.step, c.body])).toEqual([
			[2, body],
			[1, 'A reader agrees.']
		]);
		expect((await owner.get(`/api/pads/${padId}/share`)).body.shares.find((s: { slug: string }) => s.slug === slug).comments).toBe(2);
		// another reader of the snapshot sees both
		expect((await reader.get(`/api/t/${slug}/comments`)).body.comments).toHaveLength(2);

		expectFailure(await stranger.get(`/api/pads/${padId}/share/${slug}/comments`), 404);
		expectFailure(await reader.get(`/api/pads/${padId}/share/${slug}/comments`), 403);
		expectFailure(await anon.get(`/api/t/${slug}/comments`), 401);
		expectFailure(await anon.post(`/api/t/${slug}/comments`, { step: 1, body: 'hi' }), 401);
		expectFailure(await stranger.get(`/api/t/no-such-link/comments`), 404);

		// shown as text on the transcript page, never as markup
		const page = await reader.get(`/t/${slug}`);
		expect(page.status).toBe(200);
		// (Svelte escapes < in text; the page's data script escapes it as \u003C)
		expect(page.body).toContain('which order is this? &lt;script>alert(1)&lt;/script>');
		expect(page.body).not.toContain('<script>alert(1)');
	});

	it('are bounded in length, refer to a step of the snapshot, and are rate-limited per author', async () => {
		const writer = await freshMember('snap-writer');
		expectFailure(await writer.post(`/api/t/${slug}/comments`, { step: 1, body: 'x'.repeat(2001) }), 400);
		expectFailure(await writer.post(`/api/t/${slug}/comments`, { step: 1, body: '   ' }), 400);
		expectFailure(await writer.post(`/api/t/${slug}/comments`, { step: 99, body: 'no such step' }), 400);
		expectFailure(await writer.post(`/api/t/${slug}/comments`, { step: 1, body: 'bell\u0007' }), 400);
		// COMMENTS_PER_MINUTE is 6 (lib/server/comments.ts); the refusals above were validated before counting.
		// Post until refused: the first six go through, and a refusal comes with Retry-After (however slow the
		// machine, a window that rolled over only adds six more before the refusal)
		const statuses: number[] = [];
		let refused: { status: number; headers: Headers } | undefined;
		for (let i = 0; i < 20 && !refused; i++) {
			const r = await writer.post(`/api/t/${slug}/comments`, { step: 1, body: `note ${i}` });
			statuses.push(r.status);
			if (r.status !== 201) refused = r;
		}
		expect(statuses.slice(0, 6)).toEqual([201, 201, 201, 201, 201, 201]);
		expect(refused?.status).toBe(429);
		expect(Number(refused?.headers.get('retry-after'))).toBeGreaterThan(0);
	});
});
