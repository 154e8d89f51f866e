/**
 * The relation a check tests, split into its two sides, so the result can show "lhs = T_ent δΔS = 0.0424…"
 * beside the formula. A check carries `relation` when its producer sets it; recorded first-law steps from
 * before that field name the relation in their label ("first law T_ent δΔS = δΔE − μ δΔP_y (l=0.4), …").
 */
import type { CheckResult } from '$lib/lang/result';

export interface CheckSides {
	relation: string | null;
	lhs: string | null;
	rhs: string | null;
}

export function checkSides(r: Pick<CheckResult, 'label'> & { relation?: string }): CheckSides {
	const relation = r.relation ?? /^first law (.+? = .+?)(?: \(|,)/.exec(r.label)?.[1] ?? null;
	if (!relation) return { relation: null, lhs: null, rhs: null };
	const at = relation.indexOf(' = ');
	return at < 0 ? { relation, lhs: null, rhs: null } : { relation, lhs: relation.slice(0, at), rhs: relation.slice(at + 3) };
}
