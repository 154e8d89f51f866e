/** The pad page's calls to change a step or an attempt (JSON, as every write of the site). */
import type { EvalBody } from './eval';

async function send(method: string, url: string, body: unknown): Promise<{ status: number; body: Record<string, unknown> }> {
	const r = await fetch(url, { method, headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
	let json: Record<string, unknown>;
	try {
		json = await r.json();
	} catch {
		json = { ok: false, error: { message: `The server answered ${r.status}.` } };
	}
	return { status: r.status, body: json };
}

function failureText(b: Record<string, unknown>, status: number): string {
	return ((b.error as { message?: string } | undefined)?.message ?? `The server answered ${status}.`) as string;
}

/** PATCH a step: hide/restore or (un)name. Resolves to an error message, or null when it worked. */
export async function patchStep(
	pad: string,
	n: number,
	change: {
		hidden?: boolean;
		name?: string | null;
		figureLabels?: Record<string, { xlabel?: string; ylabel?: string; legends?: Record<string, string> } | null>;
	}
): Promise<string | null> {
	const r = await send('PATCH', `/api/pads/${pad}/steps/${n}`, change);
	return r.body.ok ? null : failureText(r.body, r.status);
}

export async function dismissAttempt(pad: string, id: string, dismissed: boolean): Promise<string | null> {
	const r = await send('PATCH', `/api/pads/${pad}/attempts/${id}`, { dismissed });
	return r.body.ok ? null : failureText(r.body, r.status);
}

/** Re-run step n with an edited line: the answer of POST /api/eval, `step.version` on success. */
export async function rerunStep(pad: string, n: number, input: string): Promise<{ status: number; body: EvalBody }> {
	const r = await send('POST', `/api/pads/${pad}/steps/${n}`, { input });
	return { status: r.status, body: r.body as unknown as EvalBody };
}
