/**
 * Lookups keyed by what a user typed must never reach Object.prototype: `constructor` or `__proto__` as a
 * name, field or macro would otherwise find a function.
 */
export function getOwn<T>(obj: Record<string | number, T> | undefined, key: string | number): T | undefined {
	return obj !== undefined && Object.prototype.hasOwnProperty.call(obj, key) ? obj[key] : undefined;
}
