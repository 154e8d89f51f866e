/**
 * A fixed-window counter per key, in memory. One process serves Bulkpad, so memory is the right store;
 * windows are dropped lazily so the map cannot grow without bound.
 */
export function createRateLimiter(limit: number, windowMs: number) {
	const hits = new Map<string, { count: number; resetAt: number }>();
	return {
		/** true when the call is allowed; false when the key is over its limit */
		take(key: string, now = Date.now()): boolean {
			if (hits.size > 10_000) for (const [k, w] of hits) if (w.resetAt <= now) hits.delete(k);
			const w = hits.get(key);
			if (!w || w.resetAt <= now) {
				hits.set(key, { count: 1, resetAt: now + windowMs });
				return true;
			}
			w.count += 1;
			return w.count <= limit;
		},
		retryAfterSeconds(key: string, now = Date.now()): number {
			const w = hits.get(key);
			return w ? Math.max(1, Math.ceil((w.resetAt - now) / 1000)) : 1;
		},
		reset() {
			hits.clear();
		}
	};
}
