/**
 * The library, dataset, key and user pages talk to the same JSON API scripts use, so the rules a page
 * shows are the rules the server enforces. Every answer comes back as { status, body } — never thrown —
 * so a page can show the server's own message.
 */
export interface ApiAnswer<T = Record<string, unknown>> {
	status: number;
	ok: boolean;
	body: T & {
		ok?: boolean;
		error?: { message: string; line?: number; row?: number; column?: string; start?: number; end?: number; hint?: string };
	};
}

export async function callApi<T = Record<string, unknown>>(method: string, url: string, body?: unknown): Promise<ApiAnswer<T>> {
	const init: RequestInit = { method, headers: {} };
	if (body instanceof FormData) init.body = body;
	else {
		// a DELETE without a body still says JSON: the server refuses other writes as possible cross-site requests
		(init.headers as Record<string, string>)['content-type'] = 'application/json';
		if (body !== undefined) init.body = JSON.stringify(body);
	}
	let r: Response;
	try {
		r = await fetch(url, init);
	} catch {
		return {
			status: 0,
			ok: false,
			body: { ok: false, error: { message: 'The server could not be reached; try again.' } } as ApiAnswer<T>['body']
		};
	}
	let parsed: unknown;
	try {
		parsed = await r.json();
	} catch {
		parsed = { ok: false, error: { message: `The server answered ${r.status} without JSON.` } };
	}
	return { status: r.status, ok: r.ok, body: parsed as ApiAnswer<T>['body'] };
}

/** The message to show for a failed answer. */
export function messageOf(a: ApiAnswer<unknown>): string {
	return a.body.error?.message ?? `The server answered ${a.status}.`;
}
