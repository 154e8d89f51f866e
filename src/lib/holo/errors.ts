/**
 * The one error shape of the engine. `key` names the input that was wrong ('l', 'd', 'v', 'f', …) so the
 * language layer can point at it; `hint` suggests a fix. The engine never returns NaN for a bad input: it
 * throws this instead.
 */
export class HoloError extends Error {
	constructor(
		message: string,
		public key?: string,
		public hint?: string
	) {
		super(message);
		this.name = 'HoloError';
	}
}

/** Throws a HoloError unless `ok`. */
export function requireThat(ok: boolean, message: string, key?: string, hint?: string): asserts ok {
	if (!ok) throw new HoloError(message, key, hint);
}

/** Throws unless `x` is a finite number. */
export function requireFinite(x: unknown, key: string): asserts x is number {
	if (typeof x !== 'number' || !Number.isFinite(x)) {
		throw new HoloError(`${key} must be a finite number`, key);
	}
}
