import { Lucia } from 'lucia';
import { getDb } from '../db';
import { PreparedSessionAdapter } from './session-adapter';
import { env } from '../env';
import type { Role } from '../db/schema';

function createLucia() {
	const adapter = new PreparedSessionAdapter(getDb());
	return new Lucia(adapter, {
		sessionCookie: { attributes: { secure: env.secureCookies, sameSite: 'lax' } },
		getUserAttributes: (a) => ({ email: a.email, name: a.name, role: a.role }),
		getSessionAttributes: (a) => ({ createdAt: a.createdAt, lastSeenAt: a.lastSeenAt, userAgent: a.userAgent })
	});
}

let lucia: ReturnType<typeof createLucia> | undefined;

/** The session manager (ids are token hashes: start and check sessions through ./sessions.ts), created on first use (never during `vite build`). */
export function getLucia() {
	lucia ??= createLucia();
	return lucia;
}

declare module 'lucia' {
	interface Register {
		Lucia: ReturnType<typeof createLucia>;
		DatabaseUserAttributes: { email: string; name: string; role: Role };
		DatabaseSessionAttributes: { createdAt: Date | null; lastSeenAt: Date | null; userAgent: string | null };
	}
}
