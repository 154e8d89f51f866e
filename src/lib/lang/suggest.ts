/**
 * "Did you mean …?" hints. Optimal-string-alignment distance (Levenshtein plus adjacent transpositions,
 * the usual typo model); a candidate is offered only when it is close relative to the word's length, so
 * a wild word gets no misleading hint.
 */
export function editDistance(a: string, b: string): number {
	if (a === b) return 0;
	const m = a.length;
	const n = b.length;
	if (m === 0) return n;
	if (n === 0) return m;
	// three rolling rows are enough for the transposition step
	let prev2 = new Array<number>(n + 1).fill(0);
	let prev = Array.from({ length: n + 1 }, (_, j) => j);
	let cur = new Array<number>(n + 1).fill(0);
	for (let i = 1; i <= m; i++) {
		cur[0] = i;
		for (let j = 1; j <= n; j++) {
			const cost = a[i - 1] === b[j - 1] ? 0 : 1;
			let v = Math.min(prev[j]! + 1, cur[j - 1]! + 1, prev[j - 1]! + cost);
			if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) v = Math.min(v, prev2[j - 2]! + 1);
			cur[j] = v;
		}
		[prev2, prev, cur] = [prev, cur, prev2];
	}
	return prev[n]!;
}

/** The closest candidate, or undefined when none is close enough to be a plausible typo. */
export function closest(word: string, candidates: Iterable<string>): string | undefined {
	if (word.length > 64) return undefined; // hostile input: not worth the quadratic work
	const list = [...candidates];
	const budget = word.length >= 3 ? Math.max(1, Math.floor(word.length / 3)) : 0;
	let best: string | undefined;
	let bestD = Infinity;
	for (const c of list) {
		const d = editDistance(word, c);
		if (d < bestD || (d === bestD && best !== undefined && c < best)) {
			best = c;
			bestD = d;
		}
	}
	if (best === undefined) return undefined;
	if (word.length <= 2) {
		// one- and two-letter words are a letter away from many keys: only a different case ('t' → 'T') or
		// one dropped letter ('bd' → 'bad') is a plausible slip
		for (const c of list) if (c !== word && c.toLowerCase() === word.toLowerCase()) return c;
		return bestD === 1 && best.length === word.length + 1 && isSubsequence(word, best) ? best : undefined;
	}
	// a prefix of a longer candidate ("dare" → "darea") is also a plausible slip
	if ((bestD <= budget && bestD > 0) || (best.startsWith(word) && word.length >= 2 && best !== word)) return best;
	return undefined;
}

function isSubsequence(short: string, long: string): boolean {
	let i = 0;
	for (const ch of long) if (ch === short[i]) i++;
	return i === short.length;
}

/** " — did you mean 'x'?" or the empty string. */
export function didYouMean(word: string, candidates: Iterable<string>): string {
	const c = closest(word, candidates);
	return c === undefined ? '' : ` — did you mean '${c}'?`;
}
