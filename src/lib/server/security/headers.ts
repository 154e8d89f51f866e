/**
 * Headers every response carries, pages and API alike. Pages get their Content-Security-Policy from SvelteKit
 * (kit.csp in svelte.config.js, with a nonce per page); everything else — JSON, downloads, redirects, errors —
 * gets a policy that allows nothing, since none of it is meant to run or be framed.
 */
const STRICT_CSP = "default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'";

/** One year; only ever sent over https, where a browser honours it (RFC 6797 §7.2). */
const HSTS = 'max-age=31536000';

export function applySecurityHeaders(headers: Headers, url: URL): void {
	const set = (name: string, value: string) => {
		if (!headers.has(name)) headers.set(name, value);
	};
	set('content-security-policy', STRICT_CSP);
	set('x-content-type-options', 'nosniff');
	set('referrer-policy', 'same-origin');
	// the CSP's frame-ancestors covers current browsers; this covers the ones that predate it
	set('x-frame-options', 'DENY');
	set('cross-origin-opener-policy', 'same-origin');
	if (url.protocol === 'https:') set('strict-transport-security', HSTS);
}
