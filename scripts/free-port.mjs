// A free TCP port on 127.0.0.1, for the servers the tests and benches start (the OS picks it, we release it).
import { createServer } from 'node:net';

/** @returns {Promise<number>} */
export function freePort() {
	return new Promise((resolve, reject) => {
		const s = createServer();
		s.once('error', reject);
		s.listen(0, '127.0.0.1', () => {
			const address = s.address();
			const port = typeof address === 'object' && address ? address.port : 0;
			s.close(() => resolve(port));
		});
	});
}
