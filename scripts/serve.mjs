// Serves the built app over plain HTTP on this machine (what `npm start` runs when no ORIGIN is given).
// adapter-node would otherwise assume https for requests without ORIGIN, and form posts from
// http://localhost:3000 or http://127.0.0.1:3000 would fail its cross-site check; here each request says
// it came over http, and the origin follows whatever host the browser used. Behind a TLS proxy set ORIGIN
// and run build/index.js instead.
import http from 'node:http';
import { buildDir } from './out-dirs.mjs';

process.env.PROTOCOL_HEADER = 'x-bulkpad-proto';
const { handler } = await import(`../${buildDir}/handler.js`);
const port = Number(process.env.PORT ?? 3000);
const host = process.env.HOST ?? '127.0.0.1';
const server = http.createServer((req, res) => {
	req.headers['x-bulkpad-proto'] = 'http';
	handler(req, res);
});
server.listen(port, host, () => console.log(`listening on http://${host === '127.0.0.1' ? 'localhost' : host}:${port}`));
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => server.close(() => process.exit(0)));
