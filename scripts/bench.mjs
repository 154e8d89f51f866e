// `npm run bench -- <name…>` runs bench/<name>.mjs for each name (all of them with no name).
import { readdirSync } from 'node:fs';
import { spawnSync } from 'node:child_process';

const all = readdirSync('bench')
	.filter((f) => f.endsWith('.mjs'))
	.map((f) => f.slice(0, -4));
const names = process.argv.slice(2).length ? process.argv.slice(2) : all;
for (const name of names) {
	if (!all.includes(name)) {
		console.error(`no bench named "${name}"; there are: ${all.join(', ')}`);
		process.exit(2);
	}
	console.error(`▸ bench ${name}`);
	const r = spawnSync(process.execPath, [`bench/${name}.mjs`], { stdio: 'inherit' });
	if (r.status !== 0) process.exit(r.status ?? 1);
}
