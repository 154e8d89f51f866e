import { json } from '@sveltejs/kit';
import { openDb } from '$lib/server/db';
import { queueMode } from '$lib/server/eval/fleet';

/**
 * GET /api/health — `{ok, db, queue}` after a real query against the users table, for supervisors and load
 * balancers. `queue` says where lines are evaluated: 'in-process', 'fleet', or 'fallback: <why>' (fleet mode
 * configured but unusable, so in-process; still ok). Anyone may ask, so it tells nothing else: no counts, and a
 * database failure is logged, not described.
 */
export function GET() {
	try {
		openDb().sqlite.prepare('select 1 from users limit 1').get();
		return json({ ok: true, db: 'ok', queue: queueMode() });
	} catch (e) {
		console.error('health: the database did not answer', e);
		return json({ ok: false, db: 'error', queue: queueMode() }, { status: 503 });
	}
}
