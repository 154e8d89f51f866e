/**
 * The language's one runtime door into the engine (src/lib/holo). Verb modules never import the engine
 * themselves: the runner hands it to them on each point (`Point.holo`), so the verb registry — which the
 * browser's completion and help read — stays free of mathjs and the numerics.
 */
import * as holo from '../holo/index';

export type Engine = typeof holo;
export const engine: Engine = holo;

export function isHoloError(e: unknown): e is InstanceType<Engine['HoloError']> {
	return e instanceof holo.HoloError;
}
