/** A relative drift: three significant digits are plenty to judge it against the 1e-8 tolerance. */
export function showDelta(d: number): string {
	return d === 0 ? '0' : d.toExponential(2).replace('e', '×10^').replace('^+', '^');
}
