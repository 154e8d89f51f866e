import { json } from '@sveltejs/kit';
import { openDb } from '$lib/server/db';

/**
 * GET /api/health — `{ok, db}` after a real query against the users table, for supervisors and load balancers.
 * Anyone may ask, so it tells nothing else: no counts, and a database failure is logged, not described.
 */
export function GET() {
	try {
		openDb().sqlite.prepare('select 1 from users limit 1').get();
		return json({ ok: true, db: 'ok' });
	} catch (e) {
		console.error('health: the database did not answer', e);
		return json({ ok: false, db: 'error' }, { status: 503 });
	}
}
