import { error, isHttpError, json, type RequestEvent, type RequestHandler } from '@sveltejs/kit';
import { z, type ZodType } from 'zod';

/** An expected API failure with the `{ ok:false, error }` body of API.md. */
export class ApiFailure extends Error {
	constructor(
		public status: number,
		message: string,
		public extra: Record<string, unknown> = {}
	) {
		super(message);
	}
}

export function failure(status: number, message: string, extra: Record<string, unknown> = {}): never {
	throw new ApiFailure(status, message, extra);
}

export function ok<T extends Record<string, unknown>>(body: T, init?: ResponseInit) {
	return json({ ok: true, ...body }, init);
}

/**
 * Wraps a JSON route so every expected failure (ours, SvelteKit's `error()`, zod) answers the API's error
 * shape; anything else is rethrown to `handleError`, which logs it with an id and shows nothing inside.
 */
export function api(handler: (event: RequestEvent) => Promise<Response> | Response): RequestHandler {
	return async (event) => {
		try {
			return await handler(event);
		} catch (e) {
			if (e instanceof ApiFailure) {
				// a rate limit says when to come back (429 with Retry-After)
				const headers = typeof e.extra.retryAfter === 'number' ? { 'retry-after': String(e.extra.retryAfter) } : undefined;
				return json({ ok: false, error: { message: e.message, ...e.extra } }, { status: e.status, headers });
			}
			if (isHttpError(e)) return json({ ok: false, error: { message: e.body.message } }, { status: e.status });
			if (isTooLarge(e)) return json({ ok: false, error: { message: tooLargeMessage(e) } }, { status: 413 });
			throw e;
		}
	};
}

/**
 * adapter-node stops reading a body over BODY_SIZE_LIMIT and errors the stream with SvelteKit's own 413 error;
 * it reaches a route as a rejected read, which must not be mistaken for a malformed body.
 */
export function isTooLarge(e: unknown): e is { status: 413; message?: string } {
	return typeof e === 'object' && e !== null && (e as { status?: unknown }).status === 413;
}

function tooLargeMessage(e: { message?: string }): string {
	const limit = /(?:limit of|BODY_SIZE_LIMIT of) (\d+)/.exec(e.message ?? '')?.[1];
	return `The request body is too large${limit ? ` (the server takes at most ${limit} bytes)` : ''}.`;
}

/** Reads and validates a JSON body: 413 when it is over the server's limit, 400 with zod's issues when it does not fit. */
export async function readBody<S extends ZodType>(event: RequestEvent, schema: S): Promise<z.infer<S>> {
	let text: string;
	try {
		text = await event.request.text();
	} catch (e) {
		if (isTooLarge(e)) failure(413, tooLargeMessage(e));
		failure(400, 'The body could not be read.');
	}
	let raw: unknown;
	try {
		raw = JSON.parse(text);
	} catch {
		failure(400, 'The body must be JSON.');
	}
	const parsed = schema.safeParse(raw);
	if (!parsed.success) {
		const issues = parsed.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
		failure(400, `Invalid body: ${issues.map((i) => (i.path ? `${i.path}: ` : '') + i.message).join('; ')}`, { issues });
	}
	return parsed.data;
}

/**
 * Runs server work for a page load or form action: an expected failure (a missing or foreign pad is the same
 * 404) becomes SvelteKit's page error with its status and message, as the API would answer.
 */
export function orPageError<T>(work: () => T): T {
	try {
		return work();
	} catch (e) {
		if (e instanceof ApiFailure) error(e.status, e.message);
		throw e;
	}
}
