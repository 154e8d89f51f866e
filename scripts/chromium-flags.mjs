// Debian Chromium, headless, with the flags this machine's closed network needs (without the background-
// networking ones it keeps trying hosts it cannot reach). Shared by the browser tests and the web bench.
export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const CHROMIUM_ARGS = [
	'--no-sandbox',
	'--disable-gpu',
	'--disable-quic',
	'--no-first-run',
	'--disable-background-networking',
	'--disable-component-update',
	'--disable-sync'
];
