/**
 * The verb registry: every verb the language knows, one module each. The parser, the runner, completion,
 * the palette and help all read it, so adding a verb is adding its module to BUILT_IN (or, in a test,
 * `registerVerb`). Plain data and engine-free functions: this ships to the browser.
 */
import { area } from './area';
import { coeffs } from './coeffs';
import { darea } from './darea';
import { dentropy } from './dentropy';
import { energy } from './energy';
import { entropy } from './entropy';
import { firstlaw } from './firstlaw';
import { growth } from './growth';
import { mi } from './mi';
import { mu } from './mu';
import { phases } from './phases';
import { profile } from './profile';
import { resum } from './resum';
import { stress } from './stress';
import { tent } from './tent';
import { thermo } from './thermo';
import type { VerbSpec } from './types';
import { validity } from './validity';
import { width } from './width';
import { zstar } from './zstar';

export type { VerbSpec, VerbKind, VerbForm, VerbHelp, Point, ScalarAt, RecordAt, CheckAt, SeriesTerms, TableAt } from './types';
export { defineVerb } from './types';

/** In the order help and completion list them. */
const BUILT_IN: readonly VerbSpec[] = [
	zstar,
	width,
	area,
	darea,
	entropy,
	dentropy,
	energy,
	tent,
	mu,
	firstlaw,
	stress,
	thermo,
	coeffs,
	validity,
	mi,
	resum,
	phases,
	growth,
	profile
];

const registry = new Map<string, VerbSpec>(BUILT_IN.map((v) => [v.name, v]));

/** A verb's name: any registered one. */
export type Verb = string;

/** Adds a verb (tests, extensions). A name already taken is a programming error. */
export function registerVerb(spec: VerbSpec): void {
	if (registry.has(spec.name)) throw new Error(`verb '${spec.name}' is already registered`);
	if (!/^[a-z][a-z0-9_]*$/.test(spec.name)) throw new Error(`verb name '${spec.name}' must be lower-case letters, digits and _`);
	registry.set(spec.name, spec);
}

/** Removes a verb added by registerVerb (tests clean up after themselves); built-ins stay. */
export function unregisterVerb(name: string): void {
	if (BUILT_IN.some((v) => v.name === name)) throw new Error(`verb '${name}' is built in`);
	registry.delete(name);
}

export function verbSpec(name: string): VerbSpec | undefined {
	return registry.get(name);
}

export function isVerb(name: string): boolean {
	return registry.has(name);
}

/** Every verb's name, built-ins first in their listed order. */
export function verbNames(): string[] {
	return [...registry.keys()];
}

export function verbSpecs(): VerbSpec[] {
	return [...registry.values()];
}
