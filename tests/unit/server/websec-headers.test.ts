// The pure halves of the hooks: which headers an answer gets, and which writes are served.
import { describe, expect, it } from 'vitest';
import { applySecurityHeaders } from '../../../src/lib/server/security/headers';
import { judgeWrite } from '../../../src/lib/server/security/writes';

describe('applySecurityHeaders', () => {
	it('adds HSTS only under https', () => {
		const https = new Headers();
		applySecurityHeaders(https, new URL('https://bulkpad.example/api/pads'));
		expect(https.get('strict-transport-security')).toBe('max-age=31536000');
		const http = new Headers();
		applySecurityHeaders(http, new URL('http://localhost:3000/'));
		expect(http.get('strict-transport-security')).toBeNull();
	});

	it('keeps the page policy SvelteKit set and gives everything else one that allows nothing', () => {
		const page = new Headers({ 'content-security-policy': "default-src 'self'" });
		applySecurityHeaders(page, new URL('http://localhost/'));
		expect(page.get('content-security-policy')).toBe("default-src 'self'");
		const api = new Headers();
		applySecurityHeaders(api, new URL('http://localhost/api/pads'));
		expect(api.get('content-security-policy')).toBe("default-src 'none'; frame-ancestors 'none'; base-uri 'none'; form-action 'none'");
		expect(api.get('x-content-type-options')).toBe('nosniff');
		expect(api.get('x-frame-options')).toBe('DENY');
	});
});

describe('judgeWrite', () => {
	const url = new URL('http://127.0.0.1:3000/api/pads');
	const req = (method: string, headers: Record<string, string> = {}) => new Request(url, { method, headers });

	it.each([
		['GET', {}, true],
		['HEAD', {}, true],
		['POST', { 'content-type': 'application/json' }, true],
		['DELETE', { 'content-type': 'Application/JSON; charset=utf-8' }, true],
		['POST', {}, false],
		['DELETE', {}, false],
		['PATCH', { 'content-type': 'text/plain' }, false],
		['POST', { 'content-type': 'text/plain', origin: 'http://127.0.0.1:3000' }, true],
		['POST', { 'content-type': 'multipart/form-data; boundary=x', origin: 'http://127.0.0.1:3000' }, true],
		['POST', { 'content-type': 'multipart/form-data; boundary=x', origin: 'http://127.0.0.1:3001' }, false],
		['POST', { 'content-type': 'application/x-www-form-urlencoded' }, false],
		['POST', { 'content-type': 'application/json-seq' }, false],
		['PUT', { 'content-type': 'application/octet-stream' }, false],
		// a script with its key: no browser sends one on its own, so no forgery to fear (bare DELETE, CSV upload)
		['DELETE', { authorization: 'Bearer bp_abc' }, true],
		['POST', { authorization: 'Bearer bp_abc', 'content-type': 'multipart/form-data; boundary=x' }, true],
		['POST', { authorization: 'Basic abc' }, false]
	] as const)('%s %j → served %s', (method, headers, served) => expect(judgeWrite(req(method, headers), url).ok).toBe(served));

	it('says 415 and what to send for a bare write, 403 for a foreign form', () => {
		expect(judgeWrite(req('POST'), url)).toMatchObject({ ok: false, status: 415, message: expect.stringMatching(/application\/json/) });
		expect(judgeWrite(req('POST', { 'content-type': 'text/plain', origin: 'http://evil.test' }), url)).toMatchObject({
			ok: false,
			status: 403
		});
	});
});
