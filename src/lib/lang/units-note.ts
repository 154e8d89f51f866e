/**
 * What a change of bulk does to the pad's units. `units cft c=…` holds only in d = 2 and `units sym N=…` only
 * in d = 4 (holo/units.ts says why), yet units are the pad's, kept across `use`. Instead of letting the next
 * entropy fail with "units cft needs d = 2", `use` says at once that the units no longer fit and offers the
 * line that keeps the same Newton constant in geometric units, so entropies keep their values.
 */
import type { NoteResult, UnitsState } from './result';

/** Newton's constant of units that need a dimension (Brown–Henneaux for cft, N = 4 SYM for sym), as in holo/units.ts. */
function sameG(units: UnitsState): number | undefined {
	if (units.system === 'cft') return 3 / (2 * units.c);
	if (units.system === 'sym') return Math.PI / (2 * units.N * units.N);
	return undefined;
}

const NEEDS: Record<'cft' | 'sym', number> = { cft: 2, sym: 4 };

/** A note when the new bulk's dimension d no longer fits the pad's units; nothing when it does. */
export function unitsAfterUse(units: UnitsState, d: number): NoteResult | undefined {
	if (units.system === 'geo') return undefined;
	const need = NEEDS[units.system];
	if (d === need) return undefined;
	const G = sameG(units)!;
	const given = units.system === 'cft' ? `c=${units.c}` : `N=${units.N}`;
	const fix = `units geo G=${Number(G.toPrecision(12))}`;
	return {
		kind: 'note',
		text: `units ${units.system} ${given} are kept, but they hold only for d = ${need} and this bulk has d = ${d}: entropies will refuse to run. \`${fix}\` keeps the same G.`,
		fix
	};
}
