// `seed --demo` (or BULKPAD_DEMO=1): demo data for a first start — the (fictional) Sable holography group, its
// people, pads, library and a dataset — only when the database has no users. Every result is computed by the
// engine now; nothing here is a recorded number except the dataset, which is invented demo data (exact ΔA
// with a small deterministic wobble standing in for someone's lattice numerics).
// `seed` without the demo is the production path: it never makes an account, and fails while the demo's
// accounts (known password) are in the database unless BULKPAD_KEEP_DEMO=1 says to keep them.
import { count, eq, like } from 'drizzle-orm';
import { openDb, schema } from '../src/lib/server/db/index';
import { createUser, newId } from '../src/lib/server/auth/accounts';
import { setSignupPolicy } from '../src/lib/server/auth/policy';
import { hashToken, newToken } from '../src/lib/server/auth/tokens';
import { createPad, type PadRow } from '../src/lib/server/pads';
import { finishStep, startStep } from '../src/lib/server/steps';
import { runLine } from '../src/lib/lang/index';
import type { PadContext, StepRef } from '../src/lib/lang/result';

export const DEMO_PASSWORD = 'bulkpad-demo';
/** every demo account's address ends so: the production start refuses to run while any exists */
export const DEMO_DOMAIN = '@sable.test';

const people = [
	{ email: 'curator@sable.test', name: 'Noor Halvorsen', role: 'admin' },
	{ email: 'ines@sable.test', name: 'Inès Cardoso', role: 'member' },
	{ email: 'tomas@sable.test', name: 'Tomás Ribeiro', role: 'member' },
	{ email: 'referee@sable.test', name: 'Referee (journal)', role: 'reader' }
] as const;

const pads: { owner: string; title: string; lines: string[]; share?: boolean; invite?: string }[] = [
	{
		owner: 'ines@sable.test',
		title: 'Boosted brane d=4: first law to third order',
		lines: [
			'use boosted d=4 zh=1 v=0.6',
			'darea l=0.4 o=1,2,3,exact',
			'tent l=0.4 o=3',
			'mu l=0.4 o=3',
			'firstlaw l=0.4 o=3',
			'coeffs darea o=4 | tex',
			'sweep darea l=0.05..1.2:40 o=1,2,3,exact'
		],
		share: true,
		invite: 'referee@sable.test'
	},
	{
		owner: 'ines@sable.test',
		title: 'Where does the series stop working?',
		lines: ['use brane d=3 zh=1', 'validity darea o=2 tol=1e-3', 'validity darea o=6 tol=1e-3', 'resum l=1.5 o=6']
	},
	{
		owner: 'tomas@sable.test',
		title: 'BTZ sanity check',
		lines: ['use brane d=2 zh=1', 'units cft c=24', 'dentropy l=0.5', 'dentropy l=3', 'thermo']
	},
	{
		owner: 'tomas@sable.test',
		title: 'Mutual information in vacuum',
		lines: ['use vacuum d=2', 'mi pair l=1 gap=0.3', 'mi pair l=1 gap=0.5', 'use vacuum d=4', 'mi pair l=1 gap=0.3']
	}
];

const library = [
	{
		name: 'btz-check',
		description: 'BTZ strip entropy at width l in a CFT of central charge c (Calabrese–Cardy check).',
		params: { l: '1', c: '12' },
		body: ['use brane d=2 zh=1', 'units cft c={c}', 'dentropy l={l}'],
		// a check: it leaves the pad's bulk and units as it found them
		effects: [],
		state: 'approved'
	},
	{
		name: 'sym-thermo',
		description: 'N=4 SYM units at large N and the brane thermodynamics.',
		params: { N: '10', zh: '1' },
		body: ['use brane d=4 zh={zh}', 'units sym N={N}', 'thermo'],
		// a convention setter: the pad keeps the SYM units and the brane afterwards
		effects: ['bulk', 'units'],
		state: 'approved'
	},
	{
		name: 'charged-scan',
		description: 'ΔA of a strip in the charged brane across charges (proposed).',
		params: { l: '0.5' },
		body: ['use charged d=4 zh=1 q=0.5', 'darea l={l}'],
		effects: [],
		state: 'proposed'
	}
] as const;

function runPadLines(pad: PadRow, lines: string[]) {
	const db = openDb().db;
	let ctx: PadContext = { bulk: pad.bulk as PadContext['bulk'], units: pad.units as PadContext['units'], lets: {}, refs: {} };
	for (const input of lines) {
		const fresh = db.select().from(schema.pads).where(eq(schema.pads.id, pad.id)).get()!;
		const step = startStep(fresh, input);
		const t0 = performance.now();
		try {
			const out = runLine(input, ctx);
			const stored = finishStep(fresh, step.id, performance.now() - t0, { ok: true, ...out });
			const refs: Record<number, StepRef> = { ...ctx.refs, [stored.step!.n]: out.ref };
			ctx = { bulk: out.bulk, units: out.units, lets: out.lets, refs };
		} catch (e) {
			const err = e as { message: string; start?: number; end?: number };
			console.warn(`seed: "${input}" failed: ${err.message}`);
			finishStep(fresh, step.id, performance.now() - t0, {
				ok: false,
				error: { message: err.message, start: err.start ?? 0, end: err.end ?? input.length, code: 'language' }
			});
		}
	}
}

function demoDataset() {
	// invented demo numbers: a smooth curve with a small deterministic wobble
	const rows: number[][] = [];
	for (let i = 0; i < 12; i++) {
		const l = 0.1 + 0.1 * i;
		const out = runLine(`darea l=${l.toFixed(2)} d=4 zh=1`, {
			bulk: { name: 'brane', params: { d: 4, zh: 1 } },
			units: { system: 'geo', G: 1 },
			refs: {},
			lets: {}
		});
		const exact = out.ref.value ?? NaN;
		rows.push([Number(l.toFixed(2)), exact * (1 + 2e-3 * Math.sin(7 * i))]);
	}
	return rows;
}

export async function seedDemoIfEmpty(): Promise<boolean> {
	const { db } = openDb();
	const n = db.select({ n: count() }).from(schema.users).get()?.n ?? 0;
	if (n > 0) return false;
	const ids: Record<string, string> = {};
	for (const p of people) {
		const u = await createUser({ email: p.email, name: p.name, password: DEMO_PASSWORD }, p.role, { confirmed: true });
		ids[p.email] = u.id;
	}
	// the demo is for trying Bulkpad out: anyone may make an account (each still confirms its address)
	setSignupPolicy({ mode: 'open', domains: [] });
	for (const m of library) {
		const id = newId();
		db.insert(schema.macros)
			.values({
				id,
				name: m.name,
				description: m.description,
				state: m.state,
				version: 1,
				params: m.params,
				body: [...m.body],
				effects: [...m.effects],
				authorId: ids['curator@sable.test']
			})
			.run();
		db.insert(schema.macroVersions)
			.values({ id: newId(), macroId: id, version: 1, params: m.params, body: [...m.body], editedBy: ids['curator@sable.test'] })
			.run();
	}
	const rows = demoDataset();
	db.insert(schema.datasets)
		.values({
			id: newId(),
			ownerId: ids['tomas@sable.test'],
			name: 'lattice_d4',
			columns: ['l', 'darea'],
			rows,
			bytes: JSON.stringify(rows).length
		})
		.run();
	for (const p of pads) {
		const pad = createPad(ids[p.owner], p.title);
		runPadLines(pad, p.lines);
		if (p.share) {
			db.insert(schema.shares).values({ slug: 'sable-boosted-first-law', padId: pad.id, createdBy: ids[p.owner] }).run();
		}
		if (p.invite) {
			// an invitation the referee has accepted already; its token was never mailed and is thrown away
			const now = new Date();
			db.insert(schema.invitations)
				.values({
					id: newId(),
					padId: pad.id,
					email: p.invite,
					tokenHash: hashToken(newToken()),
					invitedBy: ids[p.owner],
					state: 'accepted',
					acceptedBy: ids[p.invite],
					acceptedAt: now,
					expiresAt: now
				})
				.run();
			db.insert(schema.padAccess).values({ padId: pad.id, email: p.invite }).run();
		}
	}
	return true;
}

/** The production path: what is in the database, and whether it may be served. */
export function checkProduction(keepDemo: boolean): { ok: boolean; message: string } {
	const { db } = openDb();
	const demo = db
		.select({ email: schema.users.email })
		.from(schema.users)
		.where(like(schema.users.email, `%${DEMO_DOMAIN}`))
		.all();
	if (demo.length > 0 && !keepDemo) {
		return {
			ok: false,
			message:
				`This database holds the demo's accounts (${demo.map((d) => d.email).join(', ')}), whose password is published. ` +
				'Use another DATABASE_URL for production, or set BULKPAD_KEEP_DEMO=1 to serve the demo anyway.'
		};
	}
	const admins = db.select({ n: count() }).from(schema.users).where(eq(schema.users.role, 'admin')).get()?.n ?? 0;
	return {
		ok: true,
		message:
			admins > 0
				? 'production start: no demo data'
				: 'production start: no admin yet; make the first one with: npm run setup-admin -- --email you@example.org'
	};
}

if (import.meta.url === `file://${process.argv[1]}`) {
	if (process.argv.includes('--demo') || process.env.BULKPAD_DEMO === '1') {
		const seeded = await seedDemoIfEmpty();
		console.log(seeded ? 'seeded the Sable group demo data' : 'database has users already: no seed');
	} else {
		const { ok, message } = checkProduction(process.env.BULKPAD_KEEP_DEMO === '1');
		(ok ? console.log : console.error)(message);
		if (!ok) process.exit(2);
	}
}
