/** A number in a message or label: `digits` significant digits, no trailing zeros (0.5, not 0.500000). */
export function sigFigs(x: number, digits = 6): string {
	return Number(x.toPrecision(digits)).toString();
}
