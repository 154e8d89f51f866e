import { all, create } from 'mathjs';
import { HoloError } from '../errors';

/**
 * Compiles a user's metric function (a string in z and named numeric parameters) once, in a private mathjs
 * instance: we keep our own reference to `compile`, then replace import, createUnit, reviver, evaluate,
 * parse, simplify, derivative and resolve with functions that throw (mathjs's guidance for untrusted
 * expressions), so a string cannot change the instance or reach anything but arithmetic. The compiled
 * function is evaluated with a Map scope holding only z and the parameters.
 */
const math = create(all);
const compile = math.compile;
const refuse = () => {
	throw new Error('disabled in metric strings');
};
math.import(
	{
		import: refuse,
		createUnit: refuse,
		reviver: refuse,
		evaluate: refuse,
		parse: refuse,
		simplify: refuse,
		derivative: refuse,
		resolve: refuse
	},
	{ override: true }
);

const MAX_LEN = 400;

/** Returns a real function of z, or throws HoloError(key) when the text does not compile. */
export function compileMetricFunction(
	text: string,
	key: string,
	params: Record<string, number>
): (z: number) => number {
	if (typeof text !== 'string' || text.trim() === '') throw new HoloError(`${key} must be a formula in z`, key);
	if (text.length > MAX_LEN) throw new HoloError(`${key} is longer than ${MAX_LEN} characters`, key);
	let code: { evaluate(scope: Map<string, unknown>): unknown };
	try {
		code = compile(text);
	} catch (e) {
		throw new HoloError(`${key} does not parse: ${(e as Error).message}`, key);
	}
	const scope = new Map<string, unknown>(Object.entries(params));
	return (z: number) => {
		scope.set('z', z);
		let r: unknown;
		try {
			r = code.evaluate(scope);
		} catch (e) {
			throw new HoloError(`${key} cannot be evaluated: ${(e as Error).message}`, key);
		}
		return typeof r === 'number' ? r : NaN;
	};
}
