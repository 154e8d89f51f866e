import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';
import { buildDir, kitDir } from './scripts/out-dirs.mjs';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	kit: {
		// separate output folders let several checkouts of work build side by side (see DEVELOPERS.md)
		adapter: adapter({ out: buildDir }),
		outDir: kitDir,
		csrf: { trustedOrigins: [] },
		// Pages get a nonce per response ('auto': hashes for prerendered pages, of which there are none today).
		// style-src alone allows 'unsafe-inline': KaTeX writes its layout as inline style attributes (heights,
		// vertical offsets of fractions and roots), which neither a nonce nor a hash can cover. Scripts stay
		// strict, so an injected style can restyle a page but not run anything. The headers every other answer
		// carries are in src/lib/server/security/headers.ts.
		csp: {
			mode: 'auto',
			directives: {
				'default-src': ['self'],
				'script-src': ['self'],
				'style-src': ['self', 'unsafe-inline'],
				'img-src': ['self', 'data:', 'blob:'],
				'font-src': ['self', 'data:'],
				'connect-src': ['self'],
				'object-src': ['none'],
				'base-uri': ['self'],
				'form-action': ['self'],
				'frame-ancestors': ['none']
			}
		}
	}
};

export default config;
