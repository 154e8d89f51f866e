// `npm run worker`: one evaluation worker of the fleet (README › Operations). Needs BULKPAD_QUEUE=redis://host:port
// and a built checkout (the same as the server's: jobs are refused across code versions). Builds the worker
// bundles first when the sources are newer, as `npm start` does for the server.
import { spawnSync } from 'node:child_process';
import { pathToFileURL } from 'node:url';
import { built, newest } from './freshness.mjs';

const bundle = process.env.BULKPAD_WORKER ?? 'dist/eval-worker.mjs';
if (Math.min(built(bundle), built('dist/fleet-worker.mjs')) < newest('src/lib')) {
	const r = spawnSync(process.execPath, ['scripts/build-worker.mjs'], { stdio: 'inherit' });
	if (r.status !== 0) process.exit(r.status ?? 1);
}
await import(pathToFileURL('dist/fleet-worker.mjs').href);
