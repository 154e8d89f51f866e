import type { Result } from '../../lang/result';

/** Relative tolerance for a replayed number to count as the same (engine accuracy is ~1e-10). */
export const DRIFT_TOLERANCE = 1e-8;

function numbersOf(results: Result[]): (number | string | null)[] {
	const out: (number | string | null)[] = [];
	for (const r of results) {
		switch (r.kind) {
			case 'scalar':
				out.push(r.value, String(r.order));
				break;
			case 'record':
				for (const k of Object.keys(r.fields).sort()) out.push(k, r.fields[k]);
				break;
			case 'table':
				out.push(...r.columns);
				for (const row of r.rows) out.push(...row);
				break;
			case 'series':
				for (const t of r.terms) out.push(t.k, t.coeff);
				break;
			case 'check':
				out.push(r.lhs, r.rhs, r.residual, String(r.pass));
				break;
			case 'note':
				out.push(r.text);
		}
	}
	return out;
}

/**
 * How far a fresh evaluation is from the recorded one: the largest relative difference over every number,
 * or Infinity when the shape changed (another kind, count, label or text).
 */
export function driftBetween(recorded: Result[], fresh: Result[]): number {
	if (recorded.length !== fresh.length) return Infinity;
	for (let i = 0; i < recorded.length; i++) if (recorded[i].kind !== fresh[i].kind) return Infinity;
	const a = numbersOf(recorded);
	const b = numbersOf(fresh);
	if (a.length !== b.length) return Infinity;
	let worst = 0;
	for (let i = 0; i < a.length; i++) {
		const x = a[i];
		const y = b[i];
		if (typeof x === 'number' && typeof y === 'number') {
			if (Number.isNaN(x) && Number.isNaN(y)) continue;
			const scale = Math.max(Math.abs(x), Math.abs(y), 1e-300);
			const rel = x === y ? 0 : Math.abs(x - y) / scale;
			if (!(rel <= worst)) worst = Number.isNaN(rel) ? Infinity : rel;
		} else if (x !== y) return Infinity;
	}
	return worst;
}
