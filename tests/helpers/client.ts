// A small HTTP client for API tests: keeps the session cookie like a browser would.
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
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

/**
 * The token of the newest link `/<path>/<token>` mailed to `to`, waiting for the fake SMTP server to write the
 * message (it is in the mail only: the database keeps hashes).
 */
export async function mailedToken(to: string, path: 'confirm' | 'reset' | 'invite', timeoutMs = 15_000): Promise<string> {
	const dir = inject('mailDir');
	const pattern = new RegExp(`/${path}/([A-Za-z0-9_-]{20,})`);
	const deadline = Date.now() + timeoutMs;
	for (;;) {
		const found = readdirSync(dir)
			.filter((f) => f.endsWith('.json'))
			.sort()
			.reverse()
			.map((f) => JSON.parse(readFileSync(join(dir, f), 'utf8')) as { to: string[]; text: string })
			.find((m) => m.to.includes(to) && pattern.test(m.text));
		if (found) return pattern.exec(found.text)![1];
		if (Date.now() > deadline) throw new Error(`no /${path}/ link mailed to ${to} within ${timeoutMs} ms`);
		await new Promise((r) => setTimeout(r, 100));
	}
}

/** Signs up, follows the confirmation link from the mail, and signs in: what a newcomer does. */
export async function signUpConfirmed(email: string, password: string, name: string, invite?: string): Promise<Client> {
	const r = await new Client().post('/api/auth/signup', { email, password, name, ...(invite ? { invite } : {}) });
	if (r.status !== 201) throw new Error(`sign-up failed: ${r.status} ${JSON.stringify(r.body)}`);
	const confirmed = await new Client().post('/api/auth/confirm', { token: await mailedToken(email, 'confirm') });
	if (confirmed.status !== 200) throw new Error(`confirmation failed: ${confirmed.status} ${JSON.stringify(confirmed.body)}`);
	const c = new Client();
	const s = await c.post('/api/auth/signin', { email, password });
	if (s.status !== 200) throw new Error(`sign-in after confirmation failed: ${s.status} ${JSON.stringify(s.body)}`);
	return c;
}

/** A fresh member account, so tests that change things do not disturb the demo data. */
export async function freshMember(tag: string): Promise<Client> {
	const email = `${tag}-${Math.random().toString(36).slice(2, 8)}@tests.test`;
	return signUpConfirmed(email, 'correct horse battery', tag);
}

/**
 * What an invitation takes now: the owner invites the invitee's address, the invitee opens the mailed link and
 * accepts it signed in. Returns the invitation's token.
 */
export async function inviteAndAccept(owner: Client, padId: string, invitee: Client): Promise<string> {
	const email = (await invitee.get('/api/auth/me')).body.user.email as string;
	const sent = await owner.post(`/api/pads/${padId}/invite`, { email });
	if (sent.status !== 200 || sent.body.mail?.status !== 'sent')
		throw new Error(`invitation failed: ${sent.status} ${JSON.stringify(sent.body)}`);
	// the newest invite link to this address: the one just sent (earlier ones may exist for other pads)
	const token = await mailedToken(email, 'invite');
	const accepted = await invitee.post('/api/invitations/accept', { token });
	if (accepted.status !== 200 || accepted.body.pad?.id !== padId)
		throw new Error(`accepting failed: ${accepted.status} ${JSON.stringify(accepted.body)}`);
	return token;
}
