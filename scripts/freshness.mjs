// Whether a build output is older than its sources: `npm start` and `npm run worker` rebuild only then.
import { existsSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';

/** The newest modification time of any file under dir. */
export function newest(dir) {
	let t = 0;
	for (const name of readdirSync(dir)) {
		const p = join(dir, name);
		const s = statSync(p);
		t = Math.max(t, s.isDirectory() ? newest(p) : s.mtimeMs);
	}
	return t;
}

/** A file's modification time, 0 when it does not exist yet. */
export const built = (f) => (existsSync(f) ? statSync(f).mtimeMs : 0);
