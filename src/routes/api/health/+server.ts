import { json } from '@sveltejs/kit';
import { openDb } from '$lib/server/db';

export function GET() {
	try {
		const row = openDb().sqlite.prepare('select count(*) as n from users').get() as { n: number };
		return json({ ok: true, db: 'ok', users: row.n });
	} catch (e) {
		return json({ ok: false, db: 'error', message: (e as Error).message }, { status: 503 });
	}
}
