import type { IncomingMessage } from 'node:http';

/**
 * A signal that aborts when the client hangs up. SvelteKit's `request.signal` only aborts while the body is
 * still being read, so once a POST body is in, a client that leaves would go unnoticed; adapter-node hands
 * us the Node request (`platform.req`), whose socket closing is the real "client gone". Detach with `done`.
 */
export function clientGone(event: { request: Request; platform?: unknown }): { signal: AbortSignal; abort: () => void; done: () => void } {
	const controller = new AbortController();
	const abort = () => controller.abort('client gone');
	const outer = event.request.signal;
	if (outer.aborted) abort();
	outer.addEventListener('abort', abort, { once: true });
	const socket = (event.platform as { req?: IncomingMessage } | undefined)?.req?.socket;
	if (socket?.destroyed) abort();
	socket?.once('close', abort);
	return {
		signal: controller.signal,
		abort,
		done: () => {
			outer.removeEventListener('abort', abort);
			socket?.off('close', abort);
		}
	};
}
