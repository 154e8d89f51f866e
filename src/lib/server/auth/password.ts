import { hash, verify } from '@node-rs/argon2';

// OWASP's argon2id minimum (19 MiB, 2 passes); enough for a group tool and fast enough for tests.
const OPTIONS = { memoryCost: 19456, timeCost: 2, outputLen: 32, parallelism: 1 };

export function hashPassword(password: string): Promise<string> {
	return hash(password, OPTIONS);
}

export async function verifyPassword(hashed: string, password: string): Promise<boolean> {
	try {
		return await verify(hashed, password);
	} catch {
		return false;
	}
}

/** A dummy hash so an unknown e-mail costs as much time as a wrong password. */
let dummy: Promise<string> | undefined;
export async function burnPasswordTime(password: string): Promise<void> {
	dummy ??= hashPassword('bulkpad-timing-equaliser');
	await verifyPassword(await dummy, password);
}
