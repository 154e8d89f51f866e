// See https://svelte.dev/docs/kit/types#app.d.ts
import type { Role } from '$lib/server/db/schema';

declare global {
	namespace App {
		interface Locals {
			user: { id: string; email: string; name: string; role: Role } | null;
			session: import('lucia').Session | null;
			/** how the request was authenticated */
			via: 'session' | 'key' | null;
		}
		interface Error {
			message: string;
			id?: string;
		}
	}
}

export {};
