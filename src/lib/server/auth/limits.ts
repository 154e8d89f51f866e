/**
 * The account rate limits. Each answers 429 with the seconds to wait (the API puts them in Retry-After).
 * Client addresses come from `event.getClientAddress()`, which honours adapter-node's ADDRESS_HEADER and
 * XFF_DEPTH behind a trusted proxy, so clients behind one proxy do not share a bucket.
 */
import { env } from '../env';
import { ApiFailure } from '../http';
import { createRateLimiter } from '../rate-limit';

/**
 * Counts only what `fail` records (wrong passwords), in fixed windows. `blocked` looks without counting, so a
 * request with the right password never adds to a bucket.
 */
export function createFailureCounter(limit: number, windowMs: number) {
	const fails = new Map<string, { count: number; resetAt: number }>();
	const live = (key: string, now: number) => {
		const w = fails.get(key);
		return w && w.resetAt > now ? w : undefined;
	};
	return {
		blocked(key: string, now = Date.now()): boolean {
			return (live(key, now)?.count ?? 0) >= limit;
		},
		fail(key: string, now = Date.now()): void {
			if (fails.size > 10_000) for (const [k, w] of fails) if (w.resetAt <= now) fails.delete(k);
			const w = live(key, now);
			if (w) w.count += 1;
			else fails.set(key, { count: 1, resetAt: now + windowMs });
		},
		retryAfterSeconds(key: string, now = Date.now()): number {
			const w = live(key, now);
			return w ? Math.max(1, Math.ceil((w.resetAt - now) / 1000)) : 1;
		},
		reset() {
			fails.clear();
		}
	};
}

/**
 * Wrong passwords per account *and client address*: another client's wrong tries never lock the owner out,
 * while one client guessing one account is slowed. Wrong passwords per address across all accounts catch one
 * password tried on many accounts.
 */
export const signInFailures = {
	account: createFailureCounter(env.signinPerMinute, 60_000),
	address: createFailureCounter(env.signinPerMinutePerAddress, 60_000)
};

const HOUR = 60 * 60_000;

/** Sign-up, confirmation resend, reset and invitation limits: per client address and per target e-mail. */
export const mailLimits = {
	signupPerAddress: createRateLimiter(env.signupPerHourPerAddress, HOUR),
	signupPerEmail: createRateLimiter(5, HOUR),
	resetPerAddress: createRateLimiter(30, 15 * 60_000),
	resetPerEmail: createRateLimiter(5, 15 * 60_000),
	invitePerAddress: createRateLimiter(env.invitePerHourPerAddress, HOUR),
	invitePerEmail: createRateLimiter(5, HOUR),
	invitePerInviter: createRateLimiter(30, HOUR)
};

export class LimitFailure extends ApiFailure {
	constructor(message: string, retryAfter: number) {
		super(429, `${message} Try again in ${retryAfter} s.`, { retryAfter });
	}
}

type Limiter = { take(key: string): boolean; retryAfterSeconds(key: string): number };

/** Counts one request against every (limiter, key) pair; the first one over its limit answers 429. */
export function takeOrThrow(message: string, ...pairs: [Limiter, string][]): void {
	for (const [limiter, key] of pairs) {
		if (!limiter.take(key)) throw new LimitFailure(message, limiter.retryAfterSeconds(key));
	}
}
