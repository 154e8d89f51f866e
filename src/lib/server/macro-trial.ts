/**
 * A trial run of a macro on its example parameters (the defaults in its header), in a fresh default pad, for
 * the curator before approving it — proposed macros included, which no pad can run yet. Nothing is stored.
 */
import { evaluateLine } from './eval/dispatch';
import { failure } from './http';
import { getMacro } from './macros';
import { DEFAULT_BULK, DEFAULT_UNITS, approvedMacros } from './pads';
import type { AppUser } from './auth/guards';
import type { PadContext } from '../lang/result';

export async function trialMacro(user: AppUser, id: string, signal?: AbortSignal) {
	const m = getMacro(user, id);
	const input = `@${m.name}`;
	const ctx: PadContext = {
		bulk: DEFAULT_BULK,
		units: DEFAULT_UNITS,
		refs: {},
		lets: {},
		// the macro as it stands now (proposed or not), beside the approved library its body may call
		macros: { ...approvedMacros(), [m.name]: { params: m.params, body: m.body, effects: m.effects } }
	};
	const q = await evaluateLine(input, ctx, user.id, user.id, { signal });
	const before = { bulk: DEFAULT_BULK, units: DEFAULT_UNITS };
	const base = { input, version: m.version, params: m.params, effects: m.effects, before, ms: Math.round(q.runMs) };
	if (q.answer.ok) {
		const { results, bulk, units } = q.answer.outcome;
		return { ...base, ok: true as const, results, after: { bulk, units } };
	}
	const { code, message, retryAfter } = q.answer.error as { code: string; message: string; retryAfter?: number };
	// a full queue is the server's problem, not the macro's: answered as the evaluation route answers it
	if (code === 'busy') failure(503, message, retryAfter ? { retryAfter } : {});
	if (code === 'throttled') failure(429, message, retryAfter ? { retryAfter } : {});
	return { ...base, ok: false as const, error: q.answer.error };
}
