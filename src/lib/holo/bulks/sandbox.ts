import { HoloError } from '../errors';
import { compileFormula, FormulaError } from '../formula';

/**
 * A user's metric function (a string in z and named numeric parameters), checked and compiled once by the
 * one formula sandbox (../formula.ts): the allow-list is checked on the parsed tree before anything runs, and
 * evaluation is plain JS Math, so a string can neither change shared state nor allocate without bound.
 */
const MAX_LEN = 400;

/** Returns a real function of z (NaN where the formula has no real value), or throws HoloError(key). */
export function compileMetricFunction(text: string, key: string, params: Record<string, number>): (z: number) => number {
	if (typeof text !== 'string' || text.trim() === '') throw new HoloError(`${key} must be a formula in z`, key);
	const names = [...Object.keys(params).filter((k) => k !== 'z'), 'z'];
	let formula;
	try {
		formula = compileFormula(text, names, { limits: { maxLength: MAX_LEN } });
	} catch (e) {
		// 'does not parse: …' and the limits read after the key; a refusal says what was refused
		if (e instanceof FormulaError) throw new HoloError(`${key} ${e.code === 'refused' ? 'is refused: ' : ''}${e.message}`, key);
		throw e;
	}
	const values = names.map((n) => (n === 'z' ? 0 : params[n]!));
	const zi = values.length - 1;
	return (z: number) => {
		values[zi] = z;
		return formula.evaluate(values);
	};
}
