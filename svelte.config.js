import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	kit: {
		// separate output folders let several checkouts of work build side by side (see DEVELOPERS.md)
		adapter: adapter({ out: process.env.BULKPAD_BUILD_DIR ?? 'build' }),
		outDir: process.env.BULKPAD_KIT_DIR ?? '.svelte-kit',
		csrf: { trustedOrigins: [] }
	}
};

export default config;
