// The failure counter behind the sign-in limits, and the sign-up policy's validation.
import { describe, expect, it } from 'vitest';
import { createFailureCounter, LimitFailure } from '../../../src/lib/server/auth/limits';
import { signupPolicySchema } from '../../../src/lib/server/auth/policy';

describe('failure counter', () => {
	it('blocks a key only after `limit` recorded failures, and looking does not count', () => {
		const c = createFailureCounter(3, 60_000);
		const t = 1_000_000;
		for (let i = 0; i < 10; i++) expect(c.blocked('owner', t)).toBe(false);
		c.fail('attacker', t);
		c.fail('attacker', t + 1);
		expect(c.blocked('attacker', t + 2)).toBe(false);
		c.fail('attacker', t + 2);
		expect(c.blocked('attacker', t + 3)).toBe(true);
		// other keys are untouched by the attacker's failures
		expect(c.blocked('owner', t + 3)).toBe(false);
		expect(c.retryAfterSeconds('attacker', t + 3)).toBe(60);
		expect(c.retryAfterSeconds('attacker', t + 30_500)).toBe(30);
	});

	it('forgets failures when the window ends', () => {
		const c = createFailureCounter(1, 1000);
		c.fail('k', 0);
		expect(c.blocked('k', 999)).toBe(true);
		expect(c.blocked('k', 1000)).toBe(false);
		c.fail('k', 1000);
		expect(c.blocked('k', 1500)).toBe(true);
	});

	it('answers 429 with the seconds to wait', () => {
		const e = new LimitFailure('Too many sign-ups.', 42);
		expect(e.status).toBe(429);
		expect(e.extra).toEqual({ retryAfter: 42 });
		expect(e.message).toBe('Too many sign-ups. Try again in 42 s.');
	});
});

describe('sign-up policy', () => {
	it('normalises domains and refuses a domain list that is empty or malformed', () => {
		expect(signupPolicySchema.parse({ mode: 'domains', domains: [' @Physics.Example.EDU '] })).toEqual({
			mode: 'domains',
			domains: ['physics.example.edu']
		});
		expect(signupPolicySchema.parse({ mode: 'open' })).toEqual({ mode: 'open', domains: [] });
		expect(signupPolicySchema.safeParse({ mode: 'domains', domains: [] }).success).toBe(false);
		expect(signupPolicySchema.safeParse({ mode: 'domains', domains: ['no spaces.example'] }).success).toBe(false);
		expect(signupPolicySchema.safeParse({ mode: 'domains', domains: ['localhost'] }).success).toBe(false);
		expect(signupPolicySchema.safeParse({ mode: 'everyone' }).success).toBe(false);
	});
});
