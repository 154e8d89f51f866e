/**
 * The pad as it is read: numbered steps in order, each failed line (attempt) right after the step it was typed
 * after. Attempts typed before any step come first; dismissed ones are left out unless asked for.
 */
import type { AttemptData, StepData } from './types';

export type Entry = { kind: 'step'; step: StepData; key: string } | { kind: 'attempt'; attempt: AttemptData; key: string };

export function buildTimeline(steps: StepData[], attempts: AttemptData[], showDismissed = false): Entry[] {
	const shown = attempts.filter((a) => showDismissed || !a.dismissed);
	const after = new Map<number, AttemptData[]>();
	for (const a of shown) after.set(a.afterN, [...(after.get(a.afterN) ?? []), a]);
	const out: Entry[] = [];
	const pushAttempts = (n: number) => {
		for (const [i, a] of (after.get(n) ?? []).entries()) out.push({ kind: 'attempt', attempt: a, key: a.id ?? `attempt-${n}-${i}` });
		after.delete(n);
	};
	pushAttempts(0);
	steps.forEach((s, i) => {
		out.push({ kind: 'step', step: s, key: s.id ?? `local-${i}` });
		if (s.n !== null) pushAttempts(s.n);
	});
	// attempts after a step this page does not hold (numbers from another tab): keep them, at the end
	for (const n of [...after.keys()].sort((a, b) => a - b)) pushAttempts(n);
	return out;
}
