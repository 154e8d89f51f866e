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
		csrf: { trustedOrigins: [] }
	}
};

export default config;
