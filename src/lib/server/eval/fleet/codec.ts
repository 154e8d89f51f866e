/**
 * Job data and answers travel through Redis as V8's structured-clone bytes (base64), the same serialisation
 * the in-process pool uses over IPC: NaN, ±Infinity and -0 survive, so a fleet answer is the in-process one
 * bit for bit (JSON would turn them into null or 0).
 */
import { deserialize, serialize } from 'node:v8';

export function encode(value: unknown): string {
	return serialize(value).toString('base64');
}

export function decode<T>(text: string): T {
	return deserialize(Buffer.from(text, 'base64')) as T;
}
