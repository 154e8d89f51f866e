// A small HTTP client for API tests: keeps the session cookie like a browser would.
import { inject } from 'vitest';

export const DEMO_PASSWORD = 'bulkpad-demo';

export interface Reply<T = any> {
	status: number;
	body: T;
	headers: Headers;
}

export class Client {
	cookie = '';
	constructor(
		public baseUrl = inject('baseUrl'),
		public bearer?: string
	) {}

	async request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Reply<T>> {
		const h: Record<string, string> = { ...headers };
		if (this.cookie) h.cookie = this.cookie;
		if (this.bearer) h.authorization = `Bearer ${this.bearer}`;
		let payload: BodyInit | undefined;
		if (body instanceof FormData) payload = body;
		else if (body !== undefined) {
			payload = JSON.stringify(body);
			h['content-type'] = 'application/json';
		}
		const r = await fetch(this.baseUrl + path, { method, headers: { origin: this.baseUrl, ...h }, body: payload, redirect: 'manual' });
		const set = r.headers.getSetCookie();
		for (const c of set) {
			const [pair] = c.split(';');
			if (pair.startsWith('auth_session=')) this.cookie = pair.endsWith('=') ? '' : pair;
		}
		const text = await r.text();
		let parsed: unknown = text;
		try {
			parsed = JSON.parse(text);
		} catch {
			/* not JSON */
		}
		return { status: r.status, body: parsed as T, headers: r.headers };
	}
	get<T = any>(path: string) {
		return this.request<T>('GET', path);
	}
	post<T = any>(path: string, body?: unknown) {
		return this.request<T>('POST', path, body ?? {});
	}
	patch<T = any>(path: string, body: unknown) {
		return this.request<T>('PATCH', path, body);
	}
	/** Without a body, but declaring JSON as a browser page of Bulkpad's does (the server refuses other writes). */
	del<T = any>(path: string) {
		return this.request<T>('DELETE', path, undefined, { 'content-type': 'application/json' });
	}
}

const sessions = new Map<string, Client>();

/**
 * A client signed in as one of the demo accounts (or any account). Sessions are reused within a test file,
 * so the suite stays well under the sign-in rate limit; pass `fresh` for a new session.
 */
export async function signedIn(email: string, password = DEMO_PASSWORD, fresh = false): Promise<Client> {
	const cached = sessions.get(email);
	if (cached && !fresh && (await cached.get('/api/auth/me')).status === 200) return cached;
	const c = new Client();
	const r = await c.post('/api/auth/signin', { email, password });
	if (r.status !== 200) throw new Error(`sign-in as ${email} failed: ${r.status} ${JSON.stringify(r.body)}`);
	if (!fresh) sessions.set(email, c);
	return c;
}

/** A fresh member account, so tests that change things do not disturb the demo data. */
export async function freshMember(tag: string): Promise<Client> {
	const c = new Client();
	const email = `${tag}-${Math.random().toString(36).slice(2, 8)}@tests.test`;
	const r = await c.post('/api/auth/signup', { email, password: 'correct horse battery', name: tag });
	if (r.status !== 201) throw new Error(`sign-up failed: ${r.status} ${JSON.stringify(r.body)}`);
	return c;
}
